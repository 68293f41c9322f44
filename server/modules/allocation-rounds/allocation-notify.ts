// After approval: one pickup slip per grower and one collection list per farm, each sent at
// most once per round (dedupe keys in the e-mail log). Failed sends stay in the log and are
// sent again by "resend"; the round is "notified" once every message went out.
import { and, asc, eq, inArray } from 'drizzle-orm';
import type { AppContext } from '../../context.js';
import { allocationRounds, bundles, farmMemberships, farms, user } from '../../db/schema/index.js';
import { farmCollections, pickupSlip, slipCalendars, slipText } from '../bundles/pickup-slip.js';

export type NotifyOutcome = { sent: number; duplicate: number; failed: number };

export async function notifyRound(ctx: AppContext, roundId: string): Promise<NotifyOutcome> {
  const [round] = await ctx.db.select().from(allocationRounds).where(eq(allocationRounds.id, roundId));
  if (!round || (round.status !== 'approved' && round.status !== 'notified')) return { sent: 0, duplicate: 0, failed: 0 };
  const outcome: NotifyOutcome = { sent: 0, duplicate: 0, failed: 0 };
  const count = (s: 'sent' | 'failed' | 'duplicate') => {
    outcome[s] += 1;
  };

  const growers = await ctx.db
    .selectDistinct({ id: bundles.growerId, email: user.email })
    .from(bundles)
    .innerJoin(user, eq(user.id, bundles.growerId))
    .where(eq(bundles.roundId, roundId))
    .orderBy(asc(user.email));
  for (const g of growers) {
    const slip = await pickupSlip(ctx.db, g.id, round.seasonId);
    if (!slip) continue;
    const r = await ctx.mailer.send({
      kind: 'pickup_slip',
      to: g.email,
      subject: `Your Heelwood pickup slip: ${slip.seasonName}`,
      text: slipText(slip),
      attachments: slipCalendars(slip, roundId).map((c) => ({ filename: c.filename, content: c.content, contentType: 'text/calendar; charset=utf-8; method=PUBLISH' })),
      dedupeKey: `round:${roundId}:grower:${g.id}`,
      related: { roundId, growerId: g.id },
    });
    count(r.status);
  }

  const farmIds = (await ctx.db.selectDistinct({ id: bundles.farmId }).from(bundles).where(eq(bundles.roundId, roundId))).map((f) => f.id);
  for (const farmId of farmIds) {
    const [farm] = await ctx.db.select().from(farms).where(eq(farms.id, farmId));
    const leads = await ctx.db
      .select({ email: user.email })
      .from(farmMemberships)
      .innerJoin(user, eq(user.id, farmMemberships.userId))
      .where(and(eq(farmMemberships.farmId, farmId), inArray(farmMemberships.farmRole, ['lead'])));
    const to = farm.contactEmail ?? leads[0]?.email;
    if (!to) continue;
    const list = await farmCollections(ctx.db, farmId, round.seasonId);
    const text = [
      `Collections at ${farm.name} for this season's approved wood:`,
      '',
      ...list.map((b) => `- ${b.code}: ${b.growerName} <${b.growerEmail}> takes ${b.cuttings} cuttings of ${b.speciesName}${b.varietyName ? ` '${b.varietyName}'` : ''} from ${b.plantCode}${b.window ? ` (window from ${new Date(b.window.startsAt).toLocaleString('en-GB', { timeZone: farm.timezone })})` : ''}`),
      '',
      'Cut from the named plants only, label each bundle with its code, keep the wood cool and moist, and mark bundles collected in Heelwood.',
      'Sharp tools: cut away from the body, clean blades between plants.',
      '',
      '— Heelwood',
    ].join('\n');
    const r = await ctx.mailer.send({
      kind: 'farm_collections',
      to,
      subject: `Heelwood collections at ${farm.name}`,
      text,
      dedupeKey: `round:${roundId}:farm:${farmId}`,
      related: { roundId, farmId },
    });
    count(r.status);
  }

  if (outcome.failed === 0 && round.status === 'approved') {
    await ctx.db.update(allocationRounds).set({ status: 'notified', notifiedAt: new Date() }).where(eq(allocationRounds.id, roundId));
  }
  return outcome;
}
