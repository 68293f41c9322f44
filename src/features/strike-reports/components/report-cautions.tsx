import { safetyCautions } from '../../../../shared/planner';
import { Card, CardTitle } from '../../../components/ui/card';

function CautionMark({ size = 18 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0 text-amber">
      <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
      <rect x="9" y="7" width="2" height="6" fill="white" />
      <rect x="9" y="14.5" width="2" height="2" fill="white" />
    </svg>
  );
}

// The project's one list of cautions (shared/planner.ts), so the words match the planner's.
const HORMONE = safetyCautions({ hormone: true }).find((line) => line.startsWith('Rooting hormone'));

/** Beside a treatment that uses rooting hormone. */
export function HormoneCaution({ id }: { id?: string }) {
  if (!HORMONE) return null;
  return (
    <div id={id} className="flex gap-2 rounded-lg border-l-4 border-amber bg-amber-light px-3 py-2 text-sm">
      <CautionMark size={16} />
      <p>
        <span className="font-semibold">Caution: </span>
        {HORMONE}
      </p>
    </div>
  );
}

/** "Working safely" on the bundles page: lifting, trimming and potting rooted cuttings. */
export function ReportCautions() {
  const cautions = safetyCautions({ hormone: true });
  return (
    <Card as="aside" tone="caution" aria-labelledby="report-cautions-title">
      <CardTitle>
        <span id="report-cautions-title" className="inline-flex items-center gap-2">
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
