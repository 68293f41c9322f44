import { Link, useNavigate } from 'react-router-dom';
import type { SeasonStage } from '../../../../shared/domain';
import type { RoundSummary } from '../../../../shared/schemas/allocation';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { roundStatusKind, StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { useRounds } from '../api/get-rounds';
import { useStartRound } from '../api/start-round';
import { count } from '../lib/round-facts';

export type RoundsSeason = { id: string; name: string; stage: SeasonStage };

function RunRound({ season, underReview }: { season: RoundsSeason; underReview: RoundSummary | undefined }) {
  const start = useStartRound();
  const navigate = useNavigate();
  const allocating = season.stage === 'allocating';

  return (
    <section aria-labelledby="run-round-title" className="rounded-card border border-currant/40 bg-currant-light/50 p-5 sm:p-6">
      <h2 id="run-round-title" className="mb-2 text-lg font-semibold">
        Run an allocation round
      </h2>
      <p className="max-w-prose">
        Heelwood shares the offered wood among the filed request lines: first the largest equal share of every request, then the most cuttings, then the
        least travel. You review the proposal, change bundles by hand if needed, and approve it; only approval reserves wood and sends e-mail.
      </p>
      {!allocating ? (
        <Alert tone="info" className="mt-4">
          Rounds run while the season is in <strong>Allocating</strong>: requests are closed, so the lines no longer change. Move the season on from{' '}
          <Link to={paths.season(season.id)}>the season's page</Link>.
        </Alert>
      ) : underReview ? (
        <div className="mt-4 flex flex-col gap-3">
          <p>
            Round {underReview.number} is {underReview.status === 'draft' ? 'being worked out' : 'waiting for your review'}. Approve it or run it again
            before starting another.
          </p>
          <div>
            <ButtonLink to={paths.round(underReview.id)}>Review round {underReview.number}</ButtonLink>
          </div>
        </div>
      ) : (
        <div className="mt-4 flex flex-wrap items-center gap-3">
          <Button
            busy={start.isPending}
            onClick={async () => {
              try {
                const round = await start.mutateAsync(season.id);
                navigate(paths.round(round.id));
              } catch {
                // Shown below from the mutation's error.
              }
            }}
          >
            Run an allocation round
          </Button>
          <span className="text-ink-soft">Usually done within a minute; the next page shows the progress.</span>
        </div>
      )}
      {start.isError ? (
        <Alert tone="danger" className="mt-4">
          {errorMessage(start.error)}
        </Alert>
      ) : null}
    </section>
  );
}

function RoundsTable({ rounds }: { rounds: RoundSummary[] }) {
  return (
    <TableShell caption="Allocation rounds of this season" tableClassName="min-w-[40rem]">
      <thead>
        <tr>
          <th scope="col" className={th}>
            Round
          </th>
          <th scope="col" className={th}>
            Status
          </th>
          <th scope="col" className={th}>
            Started
          </th>
          <th scope="col" className={th}>
            Approved
          </th>
          <th scope="col" className={`${th} text-right`}>
            Bundles
          </th>
          <th scope="col" className={`${th} text-right`}>
            Cuttings
          </th>
        </tr>
      </thead>
      <tbody>
        {rounds.map((r) => (
          <tr key={r.id}>
            <th scope="row" className={`${td} text-left`}>
              <Link to={paths.round(r.id)} className="font-semibold">
                Round {r.number}
              </Link>
            </th>
            <td className={td}>
              <StatusBadge status={roundStatusKind(r.status)} />
            </td>
            <td className={td}>{formatDateTime(r.createdAt)}</td>
            <td className={td}>{r.approvedAt ? formatDateTime(r.approvedAt) : <span className="text-ink-faint">Not yet</span>}</td>
            <td className={`${td} text-right tabular-nums`}>{count(r.bundles)}</td>
            <td className={`${td} text-right tabular-nums`}>{count(r.cuttings)}</td>
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}

/** A season's rounds for the coordinator: start one, or open one to review. */
export function SeasonRounds({ season }: { season: RoundsSeason }) {
  const rounds = useRounds(season.id);
  const items = [...(rounds.data?.items ?? [])].sort((a, b) => b.number - a.number);
  const underReview = items.find((r) => r.status === 'draft' || r.status === 'proposed');

  return (
    <div className="flex flex-col gap-8">
      <RunRound season={season} underReview={underReview} />
      <section aria-labelledby="rounds-title">
        <h2 id="rounds-title" className="mb-4 text-xl font-semibold">
          Rounds so far
        </h2>
        {rounds.isPending ? (
          <Loading label="Loading the rounds…" />
        ) : rounds.isError ? (
          <Alert tone="danger">The rounds did not load: {errorMessage(rounds.error)}</Alert>
        ) : items.length === 0 ? (
          <EmptyState title="No rounds yet">
            {season.stage === 'allocating' ? 'Run the first round above.' : 'Once the season is in Allocating, run the first round from this page.'}
          </EmptyState>
        ) : (
          <RoundsTable rounds={items} />
        )}
      </section>
    </div>
  );
}
