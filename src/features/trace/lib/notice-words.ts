// Words for the plant-health notice form: the coordinator's note as it starts out, and the
// outcome the server returns put into a sentence. The rest of the notice (the finding, the
// grower's bundles, what to look for, what to do) is written by the server for each grower.
import type { NoticeOutcome } from '../../../../shared/schemas/trace';
import { plural } from '../../../lib/format';

export const NOTE_MAX = 1000;

/** A note the coordinator can send as it is, or change. */
export function defaultNote(signedBy?: string | null): string {
  const lines = [
    'Please look over the cuttings listed above, and any plants you raised from them, within the next two weeks, and keep them apart from your other stock until you have.',
    `If you see any of the signs described above, or if you passed any of this wood or these plants on to someone else, please tell ${signedBy ? 'me' : 'your coordinator'} so the cooperative can follow it up.`,
    'Your local plant-health authority can tell you whether this must be reported where you are.',
  ];
  if (signedBy) lines.push(`${signedBy}, coordinator`);
  return lines.join('\n');
}

export function noticeSubject(pestName: string): string {
  return `Plant-health notice: ${pestName} on a plant your wood came from`;
}

/** The server's answer, in a sentence, and how it should look. */
export function outcomeWords(o: NoticeOutcome): { tone: 'success' | 'info' | 'warning'; title: string; body: string } {
  const dup = o.duplicate ? ` ${plural(o.duplicate, 'grower')} already had this notice for this finding and ${o.duplicate === 1 ? 'was' : 'were'} not e-mailed again.` : '';
  if (o.failed) {
    return {
      tone: 'warning',
      title: `${plural(o.failed, 'notice')} could not be sent`,
      body: `Sent now: ${o.sent}.${dup} The mail server refused ${o.failed}; send again and only those go out.`,
    };
  }
  if (o.sent === 0) {
    return {
      tone: 'info',
      title: 'Nothing new was sent',
      body: `Every one of the ${plural(o.recipients, 'grower')} already had this notice for this finding. Heelwood sends it once per grower and finding.`,
    };
  }
  return { tone: 'success', title: `Notice sent to ${plural(o.sent, 'grower')}`, body: `Sent now: ${o.sent}.${dup} Each grower gets it once for this finding; the Mailbox holds a copy.` };
}
