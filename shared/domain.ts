// The product's vocabulary, shared by client, server and database constraints.
// Adding a value here needs a migration too: the database checks these lists.

export const USER_ROLES = ['coordinator', 'member'] as const;
export type UserRole = (typeof USER_ROLES)[number];

export const USER_STATUSES = ['pending', 'active', 'suspended'] as const;
export type UserStatus = (typeof USER_STATUSES)[number];

export const FARM_ROLES = ['lead', 'hand'] as const;
export type FarmRole = (typeof FARM_ROLES)[number];

export const PROPAGATION_METHODS = ['hardwood', 'leafy', 'scion', 'live_stake'] as const;
export type PropagationMethod = (typeof PROPAGATION_METHODS)[number];

export const PLANT_ROLES = ['stock_bed', 'fruiting_bush'] as const;
export type PlantRole = (typeof PLANT_ROLES)[number];

export const PROVENANCES = ['bought', 'seed', 'exchange'] as const;
export type Provenance = (typeof PROVENANCES)[number];

export const HEALTH_STATUSES = ['clean', 'watch', 'hold', 'retired'] as const;
export type HealthStatus = (typeof HEALTH_STATUSES)[number];

export const FINDING_KINDS = ['pest', 'disease', 'disorder'] as const;
export const SEVERITIES = ['minor', 'moderate', 'severe'] as const;
export type Severity = (typeof SEVERITIES)[number];

export const SEASON_KINDS = ['dormant_hardwood', 'leafy_summer', 'scion'] as const;
export type SeasonKind = (typeof SEASON_KINDS)[number];

export const SEASON_STAGES = ['planning', 'requests_open', 'allocating', 'collections', 'closed'] as const;
export type SeasonStage = (typeof SEASON_STAGES)[number];

export const HEMISPHERES = ['north', 'south'] as const;
export type Hemisphere = (typeof HEMISPHERES)[number];

export const TREATMENTS = ['none', 'willow', 'hormone', 'both'] as const;
export type Treatment = (typeof TREATMENTS)[number];

export const REQUEST_STATUSES = ['draft', 'filed', 'withdrawn'] as const;
export const ROUND_STATUSES = ['draft', 'proposed', 'approved', 'notified'] as const;
export type RoundStatus = (typeof ROUND_STATUSES)[number];

export const BUNDLE_STATUSES = ['reserved', 'ready', 'collected', 'cancelled'] as const;
export type BundleStatus = (typeof BUNDLE_STATUSES)[number];

export const EMAIL_STATUSES = ['queued', 'sent', 'failed'] as const;

/** Plain words for the screens; the codes above stay in the data. */
export const LABELS = {
  role: { coordinator: 'Coordinator', member: 'Member' },
  status: { pending: 'Awaiting admission', active: 'Admitted', suspended: 'Suspended' },
  farmRole: { lead: 'Farm lead', hand: 'Farm hand' },
  plantRole: { stock_bed: 'Stock bed', fruiting_bush: 'Fruiting bush' },
  health: { clean: 'Clean', watch: 'Watch', hold: 'Hold', retired: 'Retired' },
  seasonKind: {
    dormant_hardwood: 'Dormant hardwood cuttings',
    leafy_summer: 'Late-summer leafy cuttings',
    scion: 'Scion wood',
  },
  seasonStage: {
    planning: 'Planning',
    requests_open: 'Requests open',
    allocating: 'Allocating',
    collections: 'Collections',
    closed: 'Closed',
  },
  treatment: { none: 'None', willow: 'Willow soak', hormone: 'Rooting hormone', both: 'Willow soak and hormone' },
} as const;
