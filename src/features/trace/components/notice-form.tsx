import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { noticeSchema, type Exposure, type ExposureFinding, type NoticeInput } from '../../../../shared/schemas/trace';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, TextArea, namedError } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { formatDay, plural } from '../../../lib/format';
import { useSendNotices } from '../api/send-notices';
import { defaultNote, NOTE_MAX, noticeSubject, outcomeWords } from '../lib/notice-words';
import { pestTitle } from './exposure-view';

/** What every grower's notice says, outlined here; the server writes each one with that grower's bundles. */
function NoticeOutline({ exposure, finding, note }: { exposure: Exposure; finding: ExposureFinding; note: string }) {
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-paper-edge bg-white/80 p-4" aria-label="What each grower receives" role="group">
      <p>
        <span className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Subject</span>
        <span className="block font-semibold">{noticeSubject(finding.pest.name)}</span>
      </p>
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">The finding</p>
        <p>
          {pestTitle(finding)} was recorded on mother plant {exposure.plant.code} at {exposure.plant.farmName}, severity {finding.severity}. It can travel in cutting
          wood; the plant is on hold.
        </p>
      </div>
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Their wood</p>
        <p>The grower's own bundles from this plant or plants raised from it{exposure.since ? `, collected since ${formatDay(exposure.since)}` : ''}, and any plants they registered as raised from them.</p>
      </div>
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">What to look for</p>
        <p className="whitespace-pre-wrap">{finding.pest.signs || 'See the advice of your local plant-health authority.'}</p>
      </div>
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">What to do</p>
        {finding.pest.advice ? <p className="whitespace-pre-wrap">{finding.pest.advice}</p> : null}
        <ul className="list-disc pl-6">
          <li>Check the cuttings and any plants raised from them; keep them apart from other stock until then.</li>
          <li>Give away, sell or offer nothing from them until they are inspected and found clean.</li>
          <li>Contact the local plant-health authority: some findings must be reported, and rules on moving plant material differ from place to place.</li>
        </ul>
      </div>
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Your note</p>
        {note.trim() ? <p className="whitespace-pre-wrap">{note.trim()}</p> : <p className="italic text-ink-soft">No note.</p>}
      </div>
      <p className="text-sm text-ink-soft">Heelwood advises and keeps the cooperative's records; it does not certify plant health.</p>
    </div>
  );
}

/**
 * The coordinator's notice to the growers who got wood that may carry the finding: a note
 * to edit, a confirm step that says who gets it, then the server's count of what went.
 * The server sends each grower one notice per finding, however often this is used.
 */
export function NoticeForm({ plantId, exposure, finding, signedBy }: { plantId: string; exposure: Exposure; finding: ExposureFinding; signedBy?: string | null }) {
  const send = useSendNotices();
  const [confirming, setConfirming] = useState<NoticeInput | null>(null);
  const form = useForm<NoticeInput>({ resolver: zodResolver(noticeSchema), defaultValues: { findingId: finding.id, note: defaultNote(signedBy) } });
  const note = form.watch('note') ?? '';
  const due = exposure.growers.filter((g) => !g.notified);
  const done = exposure.growers.length - due.length;

  const review = form.handleSubmit((values) => {
    send.reset();
    setConfirming(values);
  });
  const confirm = async () => {
    if (!confirming) return;
    const input = { plantId, findingId: finding.id, note: confirming.note?.trim() ? confirming.note.trim() : undefined };
    try {
      await send.mutateAsync(input);
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['note']);
    }
    setConfirming(null);
  };

  if (exposure.growers.length === 0) {
    return <p className="text-ink-soft">No grower received wood that may carry this finding, so there is no notice to send.</p>;
  }
  const outcome = send.data ? outcomeWords(send.data) : null;

  return (
    <div className="flex flex-col gap-4">
      <p>
        {due.length === 0
          ? `Every one of the ${plural(exposure.growers.length, 'grower')} has had this notice. Sending again e-mails nobody: each grower gets it once per finding.`
          : `${plural(due.length, 'grower')} ${due.length === 1 ? 'has' : 'have'} not had this notice yet${done ? `; ${done} already ${done === 1 ? 'has' : 'have'} and will not get it again` : ''}. Each grower gets it once per finding.`}
      </p>
      {outcome ? (
        <Alert tone={outcome.tone} title={outcome.title}>
          <p data-testid="notice-outcome">{outcome.body}</p>
        </Alert>
      ) : null}
      {send.isError ? <Alert tone="danger">{errorMessage(send.error)}</Alert> : null}
      <form onSubmit={review} noValidate className="flex flex-col gap-4">
        <div className="grid items-start gap-5 lg:grid-cols-2">
          <Field
            label="Note from the coordinator"
            optional
            hint={`Added at the end of every notice, after the finding, the grower's bundles, what to look for and what to do. At most ${NOTE_MAX.toLocaleString('en')} characters.`}
            error={namedError('Note', form.formState.errors.note?.message)}
          >
            <TextArea rows={9} maxLength={NOTE_MAX + 200} {...form.register('note')} />
          </Field>
          <NoticeOutline exposure={exposure} finding={finding} note={note} />
        </div>
        <div>
          <Button type="submit">Review and send the notice</Button>
        </div>
      </form>
      <Dialog open={confirming !== null} onClose={() => setConfirming(null)} title="Send the plant-health notice?">
        <div className="flex flex-col gap-4">
          <p>
            {due.length > 0
              ? `An e-mail goes to ${plural(due.length, 'grower')} about ${finding.pest.name} on ${exposure.plant.code}:`
              : 'Every grower has had this notice already: nobody will be e-mailed again.'}
          </p>
          {due.length > 0 ? (
            <ul className="list-disc pl-6">
              {due.map((g) => (
                <li key={g.id}>
                  {g.name} <span className="text-ink-soft">({g.email})</span>
                </li>
              ))}
            </ul>
          ) : null}
          {done > 0 && due.length > 0 ? <p className="text-ink-soft">{plural(done, 'grower')} already had it and will not get it again.</p> : null}
          <p className="rounded-lg bg-paper-deep px-4 py-3 text-ink-soft">A notice cannot be taken back once sent. It goes once per grower and finding.</p>
          <div className="flex flex-wrap gap-3">
            <Button onClick={confirm} busy={send.isPending}>
              Yes, send the notice
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(null)}>
              Cancel
            </Button>
          </div>
        </div>
      </Dialog>
    </div>
  );
}
