import { LABELS, type Hemisphere, type SeasonKind } from '../../../../shared/domain';
import { safetyCautions, seasonGuidance, shadeSideGuidance } from '../../../../shared/planner';
import type { Species } from '../../../../shared/schemas/register';
import { Card, CardTitle } from '../../../components/ui/card';

/**
 * Advice beside the plan, all of it from shared/planner.ts: where shade-tolerant shrubs go
 * in this hemisphere, handling for the season's kind of cuttings, and the cautions.
 */
export function PlanGuidance({
  hemisphere,
  seasonKind,
  species,
  hormone,
}: {
  hemisphere: Hemisphere;
  seasonKind: SeasonKind | null;
  species: Species | null;
  hormone: boolean;
}) {
  const shade = shadeSideGuidance(hemisphere);
  const handling = seasonKind ? seasonGuidance(seasonKind) : [];
  const cautions = safetyCautions({ hormone, restrictionNote: species?.restrictionNote ?? null });
  return (
    <div className="grid items-start gap-5 lg:grid-cols-2">
      <div className="flex flex-col gap-5">
        <Card>
          <CardTitle>Beside trees</CardTitle>
          <p>{shade.text}</p>
          {species ? (
            <p className="mt-2 font-medium">
              {species.shadeTolerant
                ? `${species.commonName} tolerates shade: the ${shade.side} side of the trees suits it.`
                : `${species.commonName} is not marked shade-tolerant: give it the sunny side.`}
            </p>
          ) : null}
        </Card>
        {seasonKind ? (
          <Card>
            <CardTitle>Handling {LABELS.seasonKind[seasonKind].toLowerCase()}</CardTitle>
            <ul className="flex list-disc flex-col gap-1.5 pl-5">
              {handling.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </Card>
        ) : null}
      </div>
      <Card as="aside" tone="caution" aria-labelledby="plan-cautions-title">
        <CardTitle>
          <span id="plan-cautions-title" className="inline-flex items-center gap-2">
            <svg width="18" height="18" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="text-amber">
              <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
              <rect x="9" y="7" width="2" height="6" fill="white" />
              <rect x="9" y="14.5" width="2" height="2" fill="white" />
            </svg>
            Working safely
          </span>
        </CardTitle>
        <ul className="flex list-disc flex-col gap-2 pl-5">
          {cautions.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </Card>
    </div>
  );
}
