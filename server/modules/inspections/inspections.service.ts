// Recording an inspection: the findings, the plant's last-inspected date, and its status
// moved by the rules in shared/health-rules.ts, all in one transaction.
import { and, eq, inArray, isNull, ne } from 'drizzle-orm';
import { statusAfterInspection } from '../../../shared/health-rules.js';
import type { InspectionCreate } from '../../../shared/schemas/health.js';
import type { Actor } from '../../auth/guards.js';
import type { Db } from '../../db/client.js';
import { findings, inspections, pests, seasons, species, woodOffers } from '../../db/schema/index.js';
import { badRequest, conflict, forbidden } from '../../lib/http-error.js';
import { writeAudit } from '../audit/audit.repo.js';
import { mayInspect } from '../mother-plants/plant-access.js';
import { updatePlant } from '../mother-plants/mother-plants.repo.js';
import { visiblePlant } from '../mother-plants/mother-plants.service.js';

export async function recordInspection(db: Db, a: Actor, plantId: string, input: Required<Pick<InspectionCreate, 'inspectedOn'>> & InspectionCreate) {
  return db.transaction(async (tx) => {
    const plant = await visiblePlant(tx, a, plantId);
    if (!mayInspect(a, plant.farmId)) throw forbidden('Only the people of that farm, or a coordinator, record inspections.');
    if (plant.healthStatus === 'retired') throw conflict('A retired plant is no longer inspected.');
    const found = input.findings ?? [];
    const pestIds = [...new Set(found.map((f) => f.pestId))];
    const pestRows = pestIds.length ? await tx.select().from(pests).where(inArray(pests.id, pestIds)) : [];
    const byId = new Map(pestRows.map((p) => [p.id, p]));
    const fields: Record<string, string> = {};
    found.forEach((f, i) => {
      if (!byId.has(f.pestId)) fields[`findings.${i}.pestId`] = 'not in the catalogue';
    });
    if (Object.keys(fields).length) throw badRequest('Choose findings from the catalogue.', fields);
    const [sp] = await tx.select({ genus: species.genus }).from(species).where(eq(species.id, plant.speciesId));
    found.forEach((f, i) => {
      const genera = byId.get(f.pestId)!.genera;
      if (genera.length && sp && !genera.includes(sp.genus)) fields[`findings.${i}.pestId`] = `does not affect ${sp.genus}`;
    });
    if (Object.keys(fields).length) throw badRequest('A finding does not apply to this species.', fields);

    const [inspection] = await tx
      .insert(inspections)
      .values({ plantId, inspectedOn: input.inspectedOn, inspectorId: a.id, notes: input.notes ?? '' })
      .returning();
    if (found.length) {
      await tx.insert(findings).values(
        found.map((f) => ({ inspectionId: inspection.id, pestId: f.pestId, severity: f.severity, notes: f.notes ?? '' })),
      );
    }
    // An older inspection entered late must not overwrite a newer state.
    const isLatest = !plant.lastInspectedOn || input.inspectedOn >= plant.lastInspectedOn;
    const facts = found.map((f) => ({ travelsInWood: byId.get(f.pestId)!.travelsInWood, severity: f.severity }));
    const { status, rule } = isLatest || facts.some((f) => f.travelsInWood)
      ? statusAfterInspection(plant.healthStatus, facts)
      : { status: plant.healthStatus, rule: 'an older inspection does not change the status' };
    await updatePlant(tx, plantId, {
      healthStatus: status,
      ...(isLatest ? { lastInspectedOn: input.inspectedOn } : {}),
    });
    if (status !== plant.healthStatus) {
      await writeAudit(tx, {
        actorId: a.id,
        entity: 'mother_plant',
        entityId: plantId,
        action: 'status',
        reason: `Inspection ${input.inspectedOn}: ${rule}`,
        before: { healthStatus: plant.healthStatus },
        after: { healthStatus: status },
      });
    }
    let withdrawnOffers = 0;
    if (status === 'hold') {
      // Wood from a plant on hold is never offered: withdraw open offers at once.
      const withdrawn = await tx
        .update(woodOffers)
        .set({ withdrawnAt: new Date(), withdrawnReason: `Plant put on hold after inspection ${input.inspectedOn}` })
        .where(
          and(
            eq(woodOffers.plantId, plantId),
            isNull(woodOffers.withdrawnAt),
            inArray(woodOffers.seasonId, tx.select({ id: seasons.id }).from(seasons).where(ne(seasons.stage, 'closed'))),
          ),
        )
        .returning({ id: woodOffers.id });
      withdrawnOffers = withdrawn.length;
    }
    return { inspection, statusBefore: plant.healthStatus, statusAfter: status, rule, withdrawnOffers };
  });
}

