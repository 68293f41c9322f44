import { Link } from 'react-router-dom';
import type { PlanFigures } from '../../../../shared/planner';
import type { PlannerStrikeRate } from '../../../../shared/schemas/planner';
import type { PlanMode } from '../lib/plan-form';
import { pct, strikeRateSource, tenths, whole } from '../lib/words';

function Figure({ label, value, detail, testId }: { label: string; value: string; detail?: string; testId?: string }) {
  return (
    <div className="flex flex-col gap-0.5 rounded-lg bg-white/70 px-4 py-3">
      <dt className="text-sm font-medium text-ink-soft">{label}</dt>
      <dd className="text-2xl font-bold tabular-nums text-ink" data-testid={testId}>
        {value}
      </dd>
      {detail ? <dd className="text-sm text-ink-soft">{detail}</dd> : null}
    </div>
  );
}

export type ResultsProps = {
  mode: PlanMode;
  figures: PlanFigures;
  strikeRate: PlannerStrikeRate;
  /** N rooted plants wanted with confidence c, when asked. */
  target: { rooted: number; confidence: number } | undefined;
  names: { species: string; variety: string | null };
  /** The server's answer for exactly these inputs, or the same shared functions run here meanwhile. */
  fromServer: boolean;
  /** The strike-rate table for this species and treatment. */
  ratesHref?: string;
};

/** The answer: cuttings to ask for and how well they fill the planting. */
export function PlanResults({ mode, figures, strikeRate, target, names, fromServer, ratesHref }: ResultsProps) {
  const ask = mode === 'rooted' ? (figures.cuttingsForTarget ?? figures.cuttings) : figures.cuttings;
  return (
    <section aria-labelledby="plan-results-title" aria-live="polite" className="flex flex-col gap-4 rounded-card border border-leaf/40 bg-leaf-light/50 p-5 sm:p-6">
      <h2 id="plan-results-title" className="text-lg font-semibold">
        What to ask for
      </h2>
      <p className="text-3xl font-bold tracking-tight">
        <span data-testid="plan-ask">{whole(ask)}</span> cuttings
      </p>
      <dl className="grid grid-cols-2 gap-3">
        {mode !== 'rooted' ? (
          <>
            <Figure
              label="Planting positions"
              value={whole(figures.positions)}
              detail={`${whole(figures.positions)} × ${figures.cuttingsPerPosition} cutting${figures.cuttingsPerPosition === 1 ? '' : 's'} = ${whole(figures.cuttings)}`}
              testId="plan-positions"
            />
            <Figure
              label="Chance a position ends with at least one rooted plant"
              value={pct(figures.fillProbability)}
              testId="plan-fill"
            />
            <Figure
              label="Expected empty positions"
              value={tenths(figures.expectedEmptyPositions)}
              detail={`of ${whole(figures.positions)}, on average`}
              testId="plan-empty"
            />
          </>
        ) : null}
        {target && figures.cuttingsForTarget !== undefined && figures.targetChance !== undefined ? (
          <Figure
            label={`Cuttings for ${whole(target.rooted)} rooted plants, ${pct(target.confidence, 0)} sure`}
            value={whole(figures.cuttingsForTarget)}
            detail={`With that many, the chance of at least that many rooted is ${pct(figures.targetChance)}.`}
            testId="plan-target"
          />
        ) : null}
      </dl>
      <div className="rounded-lg bg-white/70 px-4 py-3">
        <p>
          Strike rate <strong data-testid="plan-rate">{pct(strikeRate.rate)}</strong>{' '}
          <span className="text-ink-soft">
            (90 % interval {pct(strikeRate.low)} to {pct(strikeRate.high)})
          </span>
        </p>
        <p className="mt-1 text-sm text-ink-soft">{strikeRateSource(strikeRate, names)}</p>
        {ratesHref ? (
          <p className="mt-1 text-sm">
            Strike rates are learned from growers’ strike reports: <Link to={ratesHref}>see the strike-rate table</Link>.
          </p>
        ) : null}
      </div>
      <p className="text-sm text-ink-soft">{fromServer ? 'Checked by the Heelwood server.' : 'Worked out on this device; the server’s check follows.'}</p>
    </section>
  );
}
