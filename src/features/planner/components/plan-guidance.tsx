import { LABELS, type Hemisphere, type SeasonKind } from '../../../../shared/domain';
import { safetyCautions, seasonGuidance, shadeSideGuidance } from '../../../../shared/planner';
import type { Species } from '../../../../shared/schemas/register';
import { Card, CardTitle } from '../../../components/ui/card';
import { SafetyCard } from '../../../components/ui/safety-card';

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
      <SafetyCard cautions={cautions} />
    </div>
  );
}
