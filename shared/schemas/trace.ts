// Trace: where a plant came from and where its wood went; exposure after a finding that
// travels in wood, and the health notices sent to the growers who received that wood.
import { z } from 'zod';
import type { BundleStatus, HealthStatus, Severity } from '../domain.js';
import { uuidParam } from './common.js';

/** The bundle through which a plant came to its farm. */
export type TraceVia = {
  bundleId: string;
  code: string | null;
  seasonId: string;
  seasonName: string;
  /** Null when the caller may not see who received it. */
  growerName: string | null;
};

export type TraceNode = {
  id: string;
  code: string;
  farmId: string;
  farmName: string;
  speciesName: string;
  varietyName: string | null;
  healthStatus: HealthStatus;
  /** Generations from the traced plant: 1 = parent (or child), 2 = grandparent … */
  depth: number;
  /** The plant this one was raised from, when it is in the trace. */
  parentId: string | null;
  via: TraceVia | null;
  /** True when the caller sees the full record of this plant. */
  full: boolean;
};

export type TraceBundle = {
  id: string;
  code: string | null;
  status: BundleStatus;
  cuttings: number;
  collectedAt: string | null;
  seasonId: string;
  seasonName: string;
  growerId: string;
  growerName: string;
  fromPlantId: string;
  fromPlantCode: string;
  farmName: string;
  /** Plants registered as raised from this bundle. */
  raised: number;
};

export type Trace = {
  plant: TraceNode;
  ancestors: TraceNode[];
  descendants: TraceNode[];
  bundles: TraceBundle[];
  /** Plants and bundles in the lineage the caller may not see. */
  hidden: { plants: number; bundles: number };
};

export const exposureQuerySchema = z.object({
  /** Which finding; the latest finding that travels in wood when left out. */
  findingId: uuidParam.optional(),
});

export const noticeSchema = z.object({
  findingId: uuidParam.optional(),
  /** A few words from the coordinator, added to every notice. */
  note: z.string({ error: 'The note must be text' }).trim().max(1000, 'The note is at most 1,000 characters').optional(),
});
export type NoticeInput = z.input<typeof noticeSchema>;

export type ExposureFinding = {
  id: string;
  inspectionId: string;
  inspectedOn: string;
  severity: Severity;
  notes: string;
  pest: { id: string; code: string; name: string; scientificName: string | null; signs: string; advice: string };
};

export type ExposedBundle = {
  id: string;
  code: string | null;
  status: BundleStatus;
  cuttings: number;
  collectedAt: string | null;
  collectedOn: string | null;
  seasonName: string;
  fromPlantId: string;
  fromPlantCode: string;
  farmName: string;
  growerId: string;
  growerName: string;
};

export type ExposedPlant = { id: string; code: string; farmName: string; healthStatus: HealthStatus; depth: number; sourceBundleCode: string | null };

export type ExposedGrower = {
  id: string;
  name: string;
  email: string;
  bundles: string[];
  /** A notice for this finding already went to this grower. */
  notified: boolean;
};

export type Exposure = {
  plant: { id: string; code: string; farmName: string; speciesName: string; varietyName: string | null; healthStatus: HealthStatus };
  finding: ExposureFinding | null;
  /** The last clean inspection before the finding; null when there was none. */
  since: string | null;
  /** The rule, in words, for the page. */
  rule: string;
  bundles: ExposedBundle[];
  plants: ExposedPlant[];
  growers: ExposedGrower[];
  /** Approved bundles from exposed plants not yet collected: cancel them. */
  pending: ExposedBundle[];
};

export type NoticeOutcome = { sent: number; duplicate: number; failed: number; recipients: number };
