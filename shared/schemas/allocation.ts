import { z } from 'zod';
import type { BundleStatus, RoundStatus } from '../domain.js';
import { uuidParam } from './common.js';

export const LINE_REASONS = ['filled', 'partly', 'no_compatible_offer', 'beyond_distance', 'variety_not_offered', 'shared_out'] as const;
export type LineReason = (typeof LINE_REASONS)[number];

export const REASON_TEXT: Record<LineReason, string> = {
  filled: 'Filled in full',
  partly: 'Partly filled: the wood was shared out',
  no_compatible_offer: 'Nothing of this species is on offer',
  beyond_distance: 'Wood is on offer, but only farther than the grower will travel',
  variety_not_offered: 'This variety is not on offer, and substitutes are not allowed',
  shared_out: 'Scarce wood was shared with other growers first',
};

export const bundleEditSchema = z.object({
  cuttings: z.number({ error: 'Cuttings must be a number' }).int('Cuttings is a whole number').min(1, 'At least 1 cutting; remove the bundle instead').max(100000),
});

export const bundleAddSchema = z.object({
  offerId: uuidParam,
  lineId: uuidParam,
  cuttings: z.number({ error: 'Cuttings must be a number' }).int('Cuttings is a whole number').min(1, 'At least 1 cutting').max(100000),
});

export const collectionSchema = z.object({ collected: z.boolean({ error: 'Say whether the bundle was collected' }) });

export type RoundBundle = {
  id: string;
  code: string | null;
  offerId: string;
  lineId: string;
  plantId: string;
  plantCode: string;
  plantStatus: string;
  farmId: string;
  farmName: string;
  growerId: string;
  growerName: string;
  speciesName: string;
  varietyName: string | null;
  cuttings: number;
  distanceKm: number | null;
  locked: boolean;
  status: BundleStatus;
  /** Set when the source plant can no longer give wood (put on hold since). */
  problem: string | null;
};

export type RoundLine = {
  lineId: string;
  growerId: string;
  growerName: string;
  speciesName: string;
  varietyName: string | null;
  substitutesAllowed: boolean;
  maxDistanceKm: number;
  asked: number;
  allocated: number;
  fill: number;
  reason: LineReason;
};

export type RoundView = {
  id: string;
  seasonId: string;
  seasonName: string;
  number: number;
  status: RoundStatus;
  running: { stage: string; startedAt: string } | null;
  error: string | null;
  createdAt: string;
  approvedAt: string | null;
  notifiedAt: string | null;
  stats: {
    arcs: number;
    minFill: number;
    totalCuttings: number;
    travelKm: number;
    optimal: boolean;
    gap: number;
    seconds: number;
    stages: { name: string; objective: number; status: string; seconds: number }[];
  } | null;
  bundles: RoundBundle[];
  lines: RoundLine[];
  supply: { speciesName: string; varietyName: string | null; offered: number; asked: number; allocated: number }[];
  emails: { kind: string; to: string; status: string; attempts: number; lastError: string | null }[];
};

export type RoundSummary = { id: string; number: number; status: RoundStatus; createdAt: string; approvedAt: string | null; bundles: number; cuttings: number };

export type PickupBundle = {
  id: string;
  code: string | null;
  speciesName: string;
  varietyName: string | null;
  plantCode: string;
  cuttings: number;
  status: BundleStatus;
};

export type PickupStop = {
  farmId: string;
  farmName: string;
  address: string;
  directions: string;
  lat: number;
  lon: number;
  timezone: string;
  windows: { startsAt: string; endsAt: string; note: string }[];
  bundles: PickupBundle[];
  distanceKm: number;
};

export type PickupSlip = {
  seasonId: string;
  seasonName: string;
  seasonKind: string;
  growerName: string;
  start: { lat: number; lon: number; label: string };
  stops: PickupStop[];
  visitingOrder: string[];
  roundTripKm: number;
  cautions: string[];
};

export type FarmCollection = {
  bundleId: string;
  code: string | null;
  growerName: string;
  growerEmail: string;
  plantCode: string;
  speciesName: string;
  varietyName: string | null;
  cuttings: number;
  status: BundleStatus;
  window: { startsAt: string; endsAt: string } | null;
};
