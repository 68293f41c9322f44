// "Working safely": the cautions card beside the planner and the bundles page, and the
// warning triangle it and the inline cautions carry. The words come from the caller (the
// project's one list is safetyCautions in shared/planner.ts).
import { useId } from 'react';
import { Card, CardTitle } from './card';

export function CautionMark({ size = 18 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0 text-amber">
      <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
      <rect x="9" y="7" width="2" height="6" fill="white" />
      <rect x="9" y="14.5" width="2" height="2" fill="white" />
    </svg>
  );
}

export function SafetyCard({ cautions }: { cautions: string[] }) {
  const titleId = useId();
  return (
    <Card as="aside" tone="caution" aria-labelledby={titleId}>
      <CardTitle>
        <span id={titleId} className="inline-flex items-center gap-2">
          <CautionMark />
          Working safely
        </span>
      </CardTitle>
      <ul className="flex list-disc flex-col gap-2 pl-5">
        {cautions.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </Card>
  );
}
