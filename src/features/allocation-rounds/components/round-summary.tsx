import type { ReactNode } from 'react';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { count, percent } from '../lib/round-facts';

type Stats = NonNullable<RoundView['stats']>;

const STAGE_WORDS: Record<string, { title: string; figure: (objective: number) => string }> = {
  fairness: { title: '1. Fair share for every line', figure: (x) => `${percent(x)} of each request` },
  volume: { title: '2. Most cuttings in total', figure: (x) => `${count(Math.round(x))} cuttings` },
  travel: { title: '3. Least travel', figure: (x) => `travel score ${x.toLocaleString('en', { maximumFractionDigits: 1 })}` },
};

function statusWords(status: string): string {
  const s = status.toLowerCase();
  if (s === 'optimal') return 'proven best';
  if (s === 'optimal_within_gap') return 'best within the allowed gap';
  if (s === 'empty') return 'nothing to share';
  if (s === 'start') return 'kept the starting solution';
  if (s.includes('time')) return 'stopped at the time limit';
  return s.replace(/_/g, ' ');
}

function Figure({ label, value, note }: { label: string; value: ReactNode; note?: ReactNode }) {
  return (
    <div className="rounded-lg bg-paper-deep/70 px-4 py-3">
      <dt className="text-sm font-semibold text-ink-soft">{label}</dt>
      <dd className="mt-1 text-2xl font-bold tabular-nums">{value}</dd>
      {note ? <dd className="mt-1 text-sm text-ink-soft">{note}</dd> : null}
    </div>
  );
}

/** The solver's figures: the fair share reached, the wood moved, the travel, and how sure it is. */
export function RoundSummary({ stats, bundles, lines }: { stats: Stats; bundles: number; lines: number }) {
  const gap = typeof stats.gap === 'number' && Number.isFinite(stats.gap) ? stats.gap : null;
  return (
    <div>
      <dl className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure label="Lowest fill share" value={percent(stats.minFill)} note="Every line that any offer can reach gets at least this share of its request." />
        <Figure label="Cuttings allocated" value={count(stats.totalCuttings)} note={`${count(bundles)} bundles for ${count(lines)} request lines`} />
        <Figure label="Travel" value={`${stats.travelKm.toLocaleString('en', { maximumFractionDigits: 0 })} km`} note="Round trips from each grower's place to the farms they visit." />
        <Figure
          label="Optimal"
          value={stats.optimal ? 'Yes' : 'No'}
          note={
            <>
              {stats.optimal ? 'Fair share and total proven best' : 'Best found within the time limit'}
              {gap === null ? '' : gap < 1e-6 ? '; travel proven least' : `; travel within ${(gap * 100).toLocaleString('en', { maximumFractionDigits: 2 })} % of the least possible`}. Solved in{' '}
              {stats.seconds.toLocaleString('en', { maximumFractionDigits: 1 })} s over {count(stats.arcs)} possible plant-to-line pairs.
            </>
          }
        />
      </dl>
      {stats.stages.length > 0 ? (
        <section aria-labelledby="solver-stages-title" className="mt-4 rounded-card border border-paper-edge bg-white/70 p-4">
          <h3 id="solver-stages-title" className="font-semibold">
            The solver's stages
          </h3>
          <p className="text-sm text-ink-soft">Each stage keeps what the stages before it reached.</p>
          <ol className="mt-2 divide-y divide-paper-edge">
            {stats.stages.map((s) => {
              const words = STAGE_WORDS[s.name];
              return (
                <li key={s.name} className="grid gap-x-4 gap-y-0.5 py-2 sm:grid-cols-[16rem_1fr_12rem_6rem] sm:items-baseline">
                  <span className="font-semibold">{words?.title ?? s.name}</span>
                  {/* One line on a phone; three grid columns from the small breakpoint up. */}
                  <span className="flex flex-wrap gap-x-3 sm:contents">
                    <span className="tabular-nums">{words ? words.figure(s.objective) : s.objective}</span>
                    <span className="text-ink-soft">{statusWords(s.status)}</span>
                    <span className="tabular-nums text-ink-soft sm:text-right">{s.seconds.toLocaleString('en', { maximumFractionDigits: 2 })} s</span>
                  </span>
                </li>
              );
            })}
          </ol>
        </section>
      ) : null}
    </div>
  );
}
