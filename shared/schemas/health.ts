import { z } from 'zod';
import { FINDING_KINDS, SEVERITIES } from '../domain.js';
import { uuidParam } from './common.js';

const isoDate = z
  .string({ error: 'Date is required' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Date looks like 2026-11-30')
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)), 'Not a real date');

export const findingInputSchema = z.object({
  pestId: uuidParam,
  severity: z.enum(SEVERITIES, { error: 'Severity must be minor, moderate or severe' }),
  notes: z.string().trim().max(2000, 'Notes are at most 2000 characters').optional().default(''),
});

export const inspectionCreateSchema = z.object({
  inspectedOn: isoDate.refine((d) => d <= new Date(Date.now() + 36e5 * 14).toISOString().slice(0, 10), 'An inspection cannot be in the future'),
  notes: z.string().trim().max(4000, 'Notes are at most 4000 characters').optional().default(''),
  findings: z.array(findingInputSchema).max(20, 'At most 20 findings in one inspection').default([]),
});
export type InspectionCreate = z.input<typeof inspectionCreateSchema>;

export const districtNoteSchema = z
  .object({
    body: z.string({ error: 'Note is required' }).trim().min(3, 'Write at least 3 characters').max(2000, 'A note is at most 2000 characters'),
    notedOn: isoDate,
    lat: z.number().min(-90).max(90).nullable().optional(),
    lon: z.number().min(-180).max(180).nullable().optional(),
  })
  .refine((v) => (v.lat == null) === (v.lon == null), { message: 'Give both latitude and longitude, or neither', path: ['lat'] });

export const pestSchema = z.object({
  code: z.string().trim().toLowerCase().regex(/^[a-z0-9-]{2,40}$/, 'Code is 2-40 lowercase letters, digits or dashes'),
  name: z.string({ error: 'Name is required' }).trim().min(2, 'Name is at least 2 characters').max(120),
  scientificName: z.string().trim().max(120).nullable().optional(),
  kind: z.enum(FINDING_KINDS, { error: 'Kind must be pest, disease or disorder' }),
  travelsInWood: z.boolean({ error: 'Say whether it travels in cutting wood' }),
  genera: z.array(z.string().trim().min(2).max(60)).max(20).default([]),
  signs: z.string().trim().max(2000).default(''),
  advice: z.string().trim().max(2000).default(''),
  source: z.string().trim().max(500).default(''),
});

export type Pest = z.output<typeof pestSchema> & { id: string };

export type HealthOverview = {
  lookbackMonths: number;
  counts: Record<'clean' | 'watch' | 'hold' | 'retired' | 'stale', number>;
  attention: {
    id: string;
    code: string;
    farmName: string;
    speciesName: string;
    varietyName: string | null;
    healthStatus: 'watch' | 'hold' | 'clean';
    lastInspectedOn: string | null;
    reason: string;
  }[];
  findingsByMonth: { month: string; farmName: string; speciesName: string; pestName: string; n: number }[];
  notes: { id: string; body: string; notedOn: string; authorName: string | null; lat: number | null; lon: number | null }[];
};
