// Bad input, issue 8: the 'register' routes of tests/integration/bad-input.routes.ts (see
// bad-input.test.ts). A file per group so vitest fuzzes the groups in parallel.
import { sql } from 'drizzle-orm';
import { expect, it } from 'vitest';
import { fuzzGroup } from './bad-input.fuzz.js';

const fixture = fuzzGroup('register');

// Found while fixing the empty edit: the edit schema was speciesSchema.partial(), and zod
// still applies a default inside partial(), so changing only the notes put softTipCm,
// priorStrength, shadeTolerant and firstCropYears back to their defaults.
it('an edit of one species field leaves the fields it does not name', async () => {
  const { app, ids, callers } = fixture();
  const row = async () =>
    ((await app.ctx.db.execute(sql`select soft_tip_cm, prior_strength, shade_tolerant, first_crop_years, notes from species where id = ${ids.speciesBlackcurrant}`)) as unknown as { rows: Record<string, unknown>[] }).rows[0];
  const before = await row();
  await callers.coordinator.json('PATCH', `/api/species/${ids.speciesBlackcurrant}`, { softTipCm: 12.5, priorStrength: 37, shadeTolerant: true, firstCropYears: 2 });
  await callers.coordinator.json('PATCH', `/api/species/${ids.speciesBlackcurrant}`, { notes: 'Only the notes change.' });
  expect(before.notes).not.toBe('Only the notes change.');
  const after = await row();
  expect({ ...after, soft_tip_cm: Number(after.soft_tip_cm) }).toEqual({ soft_tip_cm: 12.5, prior_strength: 37, shade_tolerant: true, first_crop_years: 2, notes: 'Only the notes change.' });
});
