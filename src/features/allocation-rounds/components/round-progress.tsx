import { useEffect, useState } from 'react';
import type { RoundView } from '../../../../shared/schemas/allocation';
import { Spinner } from '../../../components/ui/button';
import { cn } from '../../../lib/cn';
import { elapsed, SOLVE_STEPS, solveStep } from '../lib/round-facts';

function useNow(intervalMs: number): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const id = window.setInterval(() => setNow(Date.now()), intervalMs);
    return () => window.clearInterval(id);
  }, [intervalMs]);
  return now;
}

/** While the server solves: the stage it reports, the time so far, and the three steps. */
export function RoundProgress({ round }: { round: Pick<RoundView, 'running' | 'createdAt'> }) {
  const now = useNow(1000);
  const stage = round.running?.stage ?? 'waiting for the solver';
  const step = solveStep(round.running?.stage);
  const since = round.running?.startedAt ?? round.createdAt;
  return (
    <section aria-labelledby="round-progress-title" className="rounded-card border border-currant/40 bg-currant-light/50 p-5 sm:p-6">
      <h2 id="round-progress-title" className="flex items-center gap-3 text-lg font-semibold">
        <Spinner className="h-5 w-5 text-currant" />
        Working out the allocation
      </h2>
      <div role="status" aria-live="polite" className="mt-3">
        <p>
          Now: <span className="font-semibold" data-testid="round-stage">{stage}</span>
        </p>
        <p className="text-ink-soft">
          Running for <span className="tabular-nums">{elapsed(since, now)}</span>. This page follows the server every second; you may leave and
          come back.
        </p>
      </div>
      {/* A bar of our own colours (a native <progress> paints the browser's green and grey). */}
      <div
        role="progressbar"
        aria-label={`Step ${step} of ${SOLVE_STEPS.length}`}
        aria-valuemin={0}
        aria-valuemax={SOLVE_STEPS.length}
        aria-valuenow={step}
        aria-valuetext={`Step ${step} of ${SOLVE_STEPS.length}: ${SOLVE_STEPS[step - 1]}`}
        className="mt-4 h-3 w-full overflow-hidden rounded-full border border-currant/30 bg-white"
      >
        <div className="h-full rounded-full bg-currant transition-[width] duration-700" style={{ width: `${((step - 0.5) / SOLVE_STEPS.length) * 100}%` }} />
      </div>
      <ol className="mt-3 grid gap-2 sm:grid-cols-3">
        {SOLVE_STEPS.map((name, i) => {
          const state = i + 1 < step ? 'done' : i + 1 === step ? 'now' : 'later';
          return (
            <li key={name} className={cn('flex items-center gap-2 text-sm', state === 'later' ? 'text-ink-faint' : 'text-ink')}>
              <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="shrink-0 text-currant">
                {state === 'done' ? (
                  <circle cx="7" cy="7" r="6" fill="currentColor" />
                ) : state === 'now' ? (
                  <>
                    <circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" strokeWidth="2" />
                    <path d="M7 1.75a5.25 5.25 0 0 1 0 10.5z" fill="currentColor" />
                  </>
                ) : (
                  <circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" strokeWidth="2" />
                )}
              </svg>
              <span>
                {i + 1}. {name}
                <span className="sr-only">{state === 'done' ? ' (done)' : state === 'now' ? ' (now)' : ' (to come)'}</span>
              </span>
            </li>
          );
        })}
      </ol>
    </section>
  );
}
