import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { RoundBundle, RoundLine, RoundView } from '../../../../shared/schemas/allocation';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { PageHeader } from '../../../components/ui/page-header';
import { roundStatusKind, StatusBadge } from '../../../components/ui/status-badge';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime, plural } from '../../../lib/format';
import type { RoundAndMail } from '../api/approve-round';
import { isSolving, useRound } from '../api/get-round';
import { useRerunRound } from '../api/rerun-round';
import { approvalPlan, liveBundles } from '../lib/round-facts';
import { AddBundleDialog } from './add-bundle-dialog';
import { ApproveDialog } from './approve-dialog';
import { BundlesTable } from './bundles-table';
import { EmailLog } from './email-log';
import { RemoveBundleDialog } from './remove-bundle-dialog';
import { RequestLines } from './request-lines';
import { RoundContext } from './round-context';
import { RoundProgress } from './round-progress';
import { RoundSummary } from './round-summary';
import { SupplyTable } from './supply-table';

function Section({ id, title, lead, children }: { id: string; title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-title`} id={id} className="mt-10 scroll-mt-6">
      <h2 id={`${id}-title`} className="text-xl font-semibold">
        {title}
      </h2>
      {lead ? <p className="mt-1 max-w-prose text-ink-soft">{lead}</p> : null}
      <div className="mt-4">{children}</div>
    </section>
  );
}

function ReviewActions({ round, onApprove }: { round: RoundView; onApprove: () => void }) {
  const rerun = useRerunRound();
  const plan = approvalPlan(round);
  const locked = liveBundles(round).filter((b) => b.locked).length;
  const problems = round.bundles.filter((b) => b.problem).length;
  return (
    <div className="flex flex-col gap-3 rounded-card border border-paper-edge bg-white/60 p-4 sm:p-5">
      <div className="flex flex-wrap gap-3">
        <Button onClick={onApprove} disabled={plan.bundles === 0}>
          Approve and send pickup slips
        </Button>
        <Button variant="secondary" onClick={() => rerun.mutate(round.id)} busy={rerun.isPending}>
          Run again (keeps locked bundles)
        </Button>
      </div>
      <p className="text-sm text-ink-soft">
        {locked
          ? `${plural(locked, 'locked bundle')} ${locked === 1 ? 'stays' : 'stay'} as set on a re-run; the rest is worked out again from the current offers and requests.`
          : 'A re-run works everything out again from the current offers and requests. A bundle you edit or add is locked and kept.'}
        {problems ? ` ${plural(problems, 'bundle')} must be changed before approval.` : ''}
      </p>
      {rerun.isError ? <Alert tone="danger">{errorMessage(rerun.error)}</Alert> : null}
    </div>
  );
}

/** The review page of one round: progress while solving, then the proposal to edit and approve. */
export function RoundReview({ roundId }: { roundId: string }) {
  const query = useRound(roundId);
  const rerun = useRerunRound();
  const [approveOpen, setApproveOpen] = useState(false);
  const [approved, setApproved] = useState<RoundAndMail | null>(null);
  const [refusal, setRefusal] = useState<{ ids: Set<string>; message: string } | null>(null);
  const [removing, setRemoving] = useState<RoundBundle | null>(null);
  const [adding, setAdding] = useState<RoundLine | null>(null);

  if (query.isPending) {
    return (
      <>
        <title>Allocation round · Heelwood</title>
        <Loading label="Loading the round…" />
      </>
    );
  }
  if (query.isError) {
    return (
      <>
        <title>Allocation round · Heelwood</title>
        <Alert tone="danger" title="The round did not load">
          {errorMessage(query.error)}
        </Alert>
      </>
    );
  }
  const round = query.data;
  const solving = isSolving(round);
  const editable = round.status === 'proposed' && !solving;
  const done = round.status === 'approved' || round.status === 'notified';
  const heldIds = refusal?.ids ?? new Set<string>();

  return (
    <RoundContext.Provider value={{ round, editable, heldIds, askRemove: setRemoving, askAdd: setAdding }}>
      <title>{`Round ${round.number} · ${round.seasonName} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.seasonRounds(round.seasonId)}>All rounds of {round.seasonName}</Link>
      </p>
      <PageHeader
        title={`Allocation round ${round.number}`}
        lead={`${round.seasonName}. Started ${formatDateTime(round.createdAt)}${round.approvedAt ? `; approved ${formatDateTime(round.approvedAt)}` : ''}.`}
        actions={<StatusBadge status={roundStatusKind(round.status)} className="text-base" />}
      />

      {solving ? <RoundProgress round={round} /> : null}

      {round.error && !solving ? (
        <Alert tone="danger" title="The solver stopped with an error" className="mb-6">
          <p>{round.error}</p>
          <Button className="mt-3" variant="secondary" onClick={() => rerun.mutate(round.id)} busy={rerun.isPending}>
            Run again
          </Button>
          {rerun.isError ? <p className="mt-2">{errorMessage(rerun.error)}</p> : null}
        </Alert>
      ) : null}

      {approved ? (
        <Alert tone={approved.mail.failed ? 'warning' : 'success'} title="Round approved" className="mb-6">
          The wood is reserved and the bundles have codes. {plural(approved.mail.sent, 'e-mail')} sent
          {approved.mail.duplicate ? `, ${approved.mail.duplicate} already sent before` : ''}
          {approved.mail.failed ? `, ${approved.mail.failed} failed: send them again below` : ''}.
        </Alert>
      ) : null}

      {refusal ? (
        <Alert tone="danger" title="Approval refused" className="mb-6">
          {refusal.message} The bundles concerned are marked in the bundle list below.{' '}
          <a href="#round-bundles">Go to the bundles</a>
        </Alert>
      ) : null}

      {!solving && round.stats ? (
        <>
          <nav aria-label="On this page" className="mb-2 flex flex-wrap gap-x-5 gap-y-1 text-sm">
            <a href="#round-summary">Summary</a>
            {done ? <a href="#round-emails">E-mails</a> : null}
            <a href="#round-lines">Request lines</a>
            <a href="#round-supply">Supply and demand</a>
            <a href="#round-bundles">Bundles</a>
          </nav>
          <Section id="round-summary" title="Summary">
            <RoundSummary stats={round.stats} bundles={liveBundles(round).length} lines={round.lines.length} />
            {editable ? (
              <div className="mt-5">
                <ReviewActions round={round} onApprove={() => setApproveOpen(true)} />
              </div>
            ) : null}
          </Section>
        </>
      ) : null}

      {done ? (
        <Section id="round-emails" title="E-mails" lead="A pickup slip for each grower and a collection list for each farm, each sent once.">
          <EmailLog round={round} />
        </Section>
      ) : null}

      {!solving && !round.error ? (
        <>
          <Section
            id="round-lines"
            title="Request lines"
            lead="What each line gets, from which plant and farm, how far away, and why a line gets less than it asked."
          >
            <RequestLines />
          </Section>
          <Section id="round-supply" title="Supply and demand" lead="Per variety: wood still free on offer (not reserved by an approved round), asked for, and allocated in this round. Lines that take any variety are counted under the species.">
            <SupplyTable supply={round.supply} />
          </Section>
          <Section
            id="round-bundles"
            title="Bundles"
            lead={editable ? 'Change the cuttings of a bundle in place: the server checks it at once and locks the bundle, so a re-run keeps it.' : undefined}
          >
            <BundlesTable />
            {editable ? (
              <div className="mt-5">
                <ReviewActions round={round} onApprove={() => setApproveOpen(true)} />
              </div>
            ) : null}
          </Section>
        </>
      ) : null}

      <ApproveDialog
        round={round}
        open={approveOpen}
        onClose={() => setApproveOpen(false)}
        onApproved={(result) => {
          setApproveOpen(false);
          setRefusal(null);
          setApproved(result);
          window.scrollTo({ top: 0 });
        }}
        onRefused={(ids, message) => {
          setApproveOpen(false);
          setRefusal({ ids: new Set(ids), message });
        }}
      />
      <RemoveBundleDialog roundId={round.id} bundle={removing} onClose={() => setRemoving(null)} />
      <AddBundleDialog line={adding} onClose={() => setAdding(null)} />
    </RoundContext.Provider>
  );
}
