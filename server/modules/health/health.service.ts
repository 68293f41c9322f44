// The coordinator's health view across farms: what needs attention, findings over time,
// and district-wide notes.
import { and, asc, desc, eq, gte, inArray, isNull, lt, ne, or, sql } from 'drizzle-orm';
import { lookbackStart } from '../../../shared/health-rules.js';
import type { HealthOverview } from '../../../shared/schemas/health.js';
import type { Db } from '../../db/client.js';
import { districtNotes, farms, findings, inspections, motherPlants, pests, species, user, varieties } from '../../db/schema/index.js';
import { healthLookbackMonths } from '../mother-plants/mother-plants.service.js';

export async function healthOverview(db: Db, now = new Date()): Promise<HealthOverview> {
  const lookbackMonths = await healthLookbackMonths(db);
  const since = lookbackStart(lookbackMonths, now);
  const stale = or(isNull(motherPlants.lastInspectedOn), lt(motherPlants.lastInspectedOn, since))!;

  const statusCounts = await db
    .select({ status: motherPlants.healthStatus, n: sql<number>`count(*)::int` })
    .from(motherPlants)
    .groupBy(motherPlants.healthStatus);
  const [{ n: staleCount }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(motherPlants)
    .where(and(ne(motherPlants.healthStatus, 'retired'), stale));
  const counts = { clean: 0, watch: 0, hold: 0, retired: 0, stale: staleCount };
  for (const c of statusCounts) counts[c.status] = c.n;

  const attentionRows = await db
    .select({
      id: motherPlants.id,
      code: motherPlants.code,
      farmName: farms.name,
      speciesName: species.commonName,
      varietyName: varieties.name,
      healthStatus: motherPlants.healthStatus,
      lastInspectedOn: motherPlants.lastInspectedOn,
    })
    .from(motherPlants)
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .leftJoin(varieties, eq(varieties.id, motherPlants.varietyId))
    .where(and(ne(motherPlants.healthStatus, 'retired'), or(inArray(motherPlants.healthStatus, ['hold', 'watch']), stale)))
    .orderBy(sql`case ${motherPlants.healthStatus} when 'hold' then 0 when 'watch' then 1 else 2 end`, asc(farms.name), asc(motherPlants.code))
    .limit(500);
  const attention = attentionRows.map((r) => ({
    ...r,
    healthStatus: r.healthStatus as 'watch' | 'hold' | 'clean',
    reason:
      r.healthStatus === 'hold'
        ? 'On hold: a finding that travels in wood'
        : r.healthStatus === 'watch'
          ? 'Watch: a finding to follow'
          : r.lastInspectedOn
            ? `Not inspected since ${r.lastInspectedOn}`
            : 'Never inspected',
  }));

  const findingsByMonth = await db
    .select({
      month: sql<string>`to_char(${inspections.inspectedOn}, 'YYYY-MM')`,
      farmName: farms.name,
      speciesName: species.commonName,
      pestName: pests.name,
      n: sql<number>`count(*)::int`,
    })
    .from(findings)
    .innerJoin(inspections, eq(inspections.id, findings.inspectionId))
    .innerJoin(pests, eq(pests.id, findings.pestId))
    .innerJoin(motherPlants, eq(motherPlants.id, inspections.plantId))
    .innerJoin(farms, eq(farms.id, motherPlants.farmId))
    .innerJoin(species, eq(species.id, motherPlants.speciesId))
    .where(gte(inspections.inspectedOn, lookbackStart(36, now)))
    .groupBy(sql`1`, farms.name, species.commonName, pests.name)
    .orderBy(desc(sql`1`), asc(farms.name));

  const notes = await db
    .select({
      id: districtNotes.id,
      body: districtNotes.body,
      notedOn: districtNotes.notedOn,
      authorName: user.name,
      lat: districtNotes.lat,
      lon: districtNotes.lon,
    })
    .from(districtNotes)
    .leftJoin(user, eq(user.id, districtNotes.authorId))
    .orderBy(desc(districtNotes.notedOn), desc(districtNotes.createdAt))
    .limit(100);

  return { lookbackMonths, counts, attention, findingsByMonth, notes };
}
