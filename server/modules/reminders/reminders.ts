// Strike-report reminders: once a day (croner, 07:00 server time) every collected bundle with
// no strike report whose report is due (report-due.ts) gets one e-mail to its grower. The
// e-mail log's dedupe key `strike-reminder:bundle:<id>` makes each reminder go out once, even
// when two servers or two runs overlap; a failed send is tried again on the next run.
// Tests call runReminders(ctx, now) directly; the job never starts under NODE_ENV=test.
import { Cron } from 'croner';
import { sql } from 'drizzle-orm';
import type { Hemisphere, SeasonKind } from '../../../shared/domain.js';
import type { AppContext } from '../../context.js';
import type { OutgoingMail } from '../mail/mailer.js';
import { localDate, reminderDue, reportDueOn } from './report-due.js';

export const REMINDER_KIND = 'strike_reminder';
export const reminderKey = (bundleId: string) => `strike-reminder:bundle:${bundleId}`;
/** Every day at 07:00, in the server's time zone (or REMINDER_TIMEZONE given to startReminderJob). */
export const REMINDER_SCHEDULE = '0 7 * * *';

type Candidate = {
  id: string;
  code: string | null;
  cuttings: number;
  collected_at: Date | string;
  timezone: string;
  grower_id: string;
  grower_name: string;
  grower_email: string;
  season_name: string;
  kind: SeasonKind;
  hemisphere: Hemisphere;
  plant_code: string;
  farm_name: string;
  species_name: string;
  variety_name: string | null;
  treatment: string;
};

export type ReminderOutcome = { due: number; sent: number; duplicate: number; failed: number };

/** Collected bundles of admitted growers with no report and no reminder sent yet. */
async function candidates(ctx: AppContext, now: Date): Promise<Candidate[]> {
  const result = (await ctx.db.execute(sql`
    select b.id, b.code, b.cuttings, b.collected_at, fa.timezone,
           u.id as grower_id, u.name as grower_name, u.email as grower_email,
           se.name as season_name, se.kind, se.hemisphere,
           mp.code as plant_code, fa.name as farm_name, sp.common_name as species_name, v.name as variety_name,
           rl.treatment
    from bundles b
    join allocation_rounds ar on ar.id = b.round_id
    join seasons se on se.id = ar.season_id
    join "user" u on u.id = b.grower_id
    join farms fa on fa.id = b.farm_id
    join mother_plants mp on mp.id = b.plant_id
    join species sp on sp.id = mp.species_id
    left join varieties v on v.id = mp.variety_id
    join request_lines rl on rl.id = b.line_id
    where b.status = 'collected' and b.collected_at <= ${now.toISOString()}::timestamptz
      and u.status = 'active'
      and not exists (select 1 from strike_reports sr where sr.bundle_id = b.id)
      and not exists (select 1 from email_log el where el.dedupe_key = 'strike-reminder:bundle:' || b.id::text and el.status = 'sent')
    order by u.email, b.collected_at, b.code`)) as unknown as { rows: Candidate[] };
  return result.rows;
}

function reminderMail(c: Candidate, collectedOn: string, dueOn: string, publicUrl: string): OutgoingMail {
  const wood = `${c.cuttings} cuttings of ${c.species_name}${c.variety_name ? ` '${c.variety_name}'` : ''} from plant ${c.plant_code} (${c.farm_name})`;
  return {
    kind: REMINDER_KIND,
    to: c.grower_email,
    subject: `How did bundle ${c.code ?? ''} root? A strike report for Heelwood`.replace('  ', ' '),
    text: [
      `Hello ${c.grower_name},`,
      '',
      `You collected bundle ${c.code ?? '(no code)'} on ${collectedOn} in ${c.season_name}: ${wood}.`,
      c.kind === 'leafy_summer'
        ? 'Leafy cuttings usually show roots within a few weeks, so now is a good time to count them.'
        : 'The growing season is under way, so the cuttings that rooted are in leaf: now is a good time to count them.',
      '',
      'Please tell the cooperative how many you stuck and how many rooted, and how they were treated. Every report makes the strike rates the planner uses more honest for everyone.',
      `Report it in Heelwood under your collected bundles: ${publicUrl.replace(/\/$/, '')}/my-bundles`,
      '',
      'If you did not stick the cuttings, a report of what happened still helps the coordinator.',
      `(Reminder for the report due on ${dueOn}; you get it once for this bundle.)`,
      '',
      '— Heelwood, for your fruit-growing cooperative',
    ].join('\n'),
    dedupeKey: reminderKey(c.id),
    related: { bundleId: c.id, growerId: c.grower_id, dueOn },
  };
}

/** Sends every reminder due on `now`'s date; safe to run any number of times. */
export async function runReminders(ctx: AppContext, now: Date = new Date()): Promise<ReminderOutcome> {
  const outcome: ReminderOutcome = { due: 0, sent: 0, duplicate: 0, failed: 0 };
  for (const c of await candidates(ctx, now)) {
    const collectedOn = localDate(new Date(c.collected_at), c.timezone);
    const dueOn = reportDueOn(c.kind, c.hemisphere, collectedOn);
    if (!reminderDue(dueOn, localDate(now, c.timezone))) continue;
    outcome.due += 1;
    const r = await ctx.mailer.send(reminderMail(c, collectedOn, dueOn, ctx.config.publicUrl));
    outcome[r.status] += 1;
  }
  return outcome;
}

/**
 * Starts the daily job; returns the function that stops it (call it when the context closes).
 * Not started under NODE_ENV=test: tests call runReminders with a fixed `now`.
 */
export function startReminderJob(ctx: AppContext, opts: { schedule?: string; timezone?: string } = {}): () => void {
  if (ctx.config.env === 'test') return () => {};
  const job = new Cron(
    opts.schedule ?? REMINDER_SCHEDULE,
    {
      name: 'heelwood-strike-reminders',
      protect: true,
      timezone: opts.timezone,
      catch: (err) => console.error('[heelwood] strike-report reminders failed:', err),
    },
    async () => {
      const r = await runReminders(ctx, new Date());
      if (r.sent || r.failed) console.log(`[heelwood] strike-report reminders: ${r.sent} sent, ${r.failed} failed, ${r.duplicate} already sent`);
    },
  );
  return () => job.stop();
}
