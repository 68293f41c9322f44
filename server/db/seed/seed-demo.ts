// Writes the demo cooperative (demo-data.ts) into an empty database: people, farms, the
// species and variety lists, the pest catalogue, some two hundred mother plants with their
// inspection history, four closed winters of wood exchange (offers, requests, approved
// rounds, bundles, strike reports, plants raised from bundles) and an open season.
//
// Everything is built in memory first, deterministically (a seeded PRNG, our own UUIDs),
// with dates relative to `now`, then written in one transaction with bulk inserts.
// Invented figures are demo data only; trade figures cite CHECK-VALUES.md in demo-data.ts.
import { destination, distanceM } from '../../../shared/geo.js';
import { count, sql } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import type { Db, Tx } from '../client.js';
import * as t from '../schema/index.js';
import type { HealthStatus, PlantRole, Treatment } from '../../../shared/domain.js';
import {
  CLEAN_NOTES,
  COOPERATIVE,
  DEMO_PASSWORD,
  DISTRICT_NOTES,
  FARMS,
  HEALTH_PLAN,
  FORCED_EXCHANGES,
  LINEAGE_ROOT_CODE,
  PEOPLE,
  PESTS,
  PLANT_NOTES,
  ROLE_CAPS,
  SPECIES,
  STALE_PLANTS,
  STRIKE_NOTES,
  SUPPLIERS,
  VARIETIES,
  type FarmSeed,
  type PersonSeed,
  type SpeciesKey,
  type SpeciesSeed,
} from './demo-data.js';

export type SeedSummary = {
  users: number;
  farms: number;
  species: number;
  varieties: number;
  plants: number;
  inspections: number;
  seasons: number;
  bundles: number;
  strikeReports: number;
  /** Code of the bought plant at the root of the seeded four-generation lineage. */
  lineageRootCode: string;
};

export type SeedOptions = { hashPassword: (password: string) => Promise<string>; now?: Date };

export async function seedDemo(db: Db, opts: SeedOptions): Promise<SeedSummary> {
  const now = opts.now ?? new Date();
  // Refuse early, before the slow password hash; checked again inside the transaction.
  if (await hasAnyData(db)) throw new Error('database already has data; demo seed skipped');
  const passwordHash = await opts.hashPassword(DEMO_PASSWORD);
  const demo = buildDemo(now, passwordHash);

  await db.transaction(async (tx) => {
    if (await hasAnyData(tx)) throw new Error('database already has data; demo seed skipped');
    const r = demo.rows;
    await insertAll(tx, t.user, r.users);
    await insertAll(tx, t.account, r.accounts);
    await insertAll(tx, t.settings, r.settings);
    await insertAll(tx, t.farms, r.farms);
    await insertAll(tx, t.farmMemberships, r.memberships);
    await insertAll(tx, t.species, r.species);
    await insertAll(tx, t.varieties, r.varieties);
    await insertAll(tx, t.pests, r.pests);
    await insertAll(tx, t.motherPlants, r.plants);
    await insertAll(tx, t.inspections, r.inspections);
    await insertAll(tx, t.findings, r.findings);
    await insertAll(tx, t.districtNotes, r.districtNotes);
    await insertAll(tx, t.seasons, r.seasons);
    await insertAll(tx, t.pickupWindows, r.pickupWindows);
    await insertAll(tx, t.woodOffers, r.offers);
    await insertAll(tx, t.woodRequests, r.requests);
    await insertAll(tx, t.requestLines, r.lines);
    await insertAll(tx, t.allocationRounds, r.rounds);
    await insertAll(tx, t.bundles, r.bundles);
    await insertAll(tx, t.strikeReports, r.strikeReports);
    // Plants raised from bundles point back at their bundle; bundles point at plants, so
    // the links are set once both exist.
    if (demo.sourceLinks.length > 0) {
      const values = sql.join(
        demo.sourceLinks.map(([plantId, bundleId]) => sql`(${plantId}::uuid, ${bundleId}::uuid)`),
        sql`, `,
      );
      await tx.execute(
        sql`update mother_plants set source_bundle_id = v.bundle_id from (values ${values}) as v(plant_id, bundle_id) where mother_plants.id = v.plant_id`,
      );
    }
    await insertAll(tx, t.auditLog, r.audit);
  });

  return demo.summary;
}

async function hasAnyData(db: Db | Tx): Promise<boolean> {
  const [u] = await db.select({ n: count() }).from(t.user);
  const [f] = await db.select({ n: count() }).from(t.farms);
  return u.n > 0 || f.n > 0;
}

/** Multi-row inserts, as few statements as PostgreSQL's 65,535 bind parameters allow. */
async function insertAll<T extends PgTable>(tx: Tx, table: T, rows: T['$inferInsert'][]): Promise<void> {
  if (rows.length === 0) return;
  const size = Math.max(1, Math.floor(60_000 / Object.keys(rows[0] as object).length));
  for (let i = 0; i < rows.length; i += size) {
    await tx.insert(table).values(rows.slice(i, i + size) as never);
  }
}

// ---------------------------------------------------------------------------------------
// Deterministic randomness
// ---------------------------------------------------------------------------------------

/** mulberry32: a small, well-mixed 32-bit generator; plenty for spreading demo data. */
class Rand {
  private a: number;
  constructor(seed: number) {
    this.a = seed >>> 0;
  }
  next(): number {
    this.a = (this.a + 0x6d2b79f5) >>> 0;
    let x = this.a;
    x = Math.imul(x ^ (x >>> 15), x | 1);
    x ^= x + Math.imul(x ^ (x >>> 7), x | 61);
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  }
  int(lo: number, hi: number): number {
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }
  chance(p: number): boolean {
    return this.next() < p;
  }
  pick<T>(xs: readonly T[]): T {
    return xs[Math.floor(this.next() * xs.length)];
  }
  weighted<T>(xs: readonly (readonly [T, number])[]): T {
    const total = xs.reduce((s, [, w]) => s + w, 0);
    let u = this.next() * total;
    for (const [x, w] of xs) {
      u -= w;
      if (u < 0) return x;
    }
    return xs[xs.length - 1][0];
  }
  shuffle<T>(xs: readonly T[]): T[] {
    const out = xs.slice();
    for (let i = out.length - 1; i > 0; i--) {
      const j = Math.floor(this.next() * (i + 1));
      [out[i], out[j]] = [out[j], out[i]];
    }
    return out;
  }
  binomial(n: number, p: number): number {
    let k = 0;
    for (let i = 0; i < n; i++) if (this.next() < p) k++;
    return k;
  }
}

class Ids {
  private r: Rand;
  constructor(seed: number) {
    this.r = new Rand(seed);
  }
  uuid(): string {
    const b = Array.from({ length: 16 }, () => this.r.int(0, 255));
    b[6] = (b[6] & 0x0f) | 0x40;
    b[8] = (b[8] & 0x3f) | 0x80;
    const h = b.map((x) => x.toString(16).padStart(2, '0')).join('');
    return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
  }
  token(prefix: string, length = 16): string {
    const alphabet = 'abcdefghijkmnpqrstuvwxyz23456789';
    let s = prefix;
    for (let i = 0; i < length; i++) s += alphabet[this.r.int(0, alphabet.length - 1)];
    return s;
  }
}

// ---------------------------------------------------------------------------------------
// Dates (Europe/London) and positions
// ---------------------------------------------------------------------------------------

const DAY = 86_400_000;
const addDays = (d: Date, n: number) => new Date(d.getTime() + n * DAY);
const addMinutes = (d: Date, n: number) => new Date(d.getTime() + n * 60_000);
const ymd = (d: Date) => d.toISOString().slice(0, 10);
const minDate = (a: Date, b: Date) => (a < b ? a : b);
const maxDate = (a: Date, b: Date) => (a > b ? a : b);

const londonOffsetFormat = new Intl.DateTimeFormat('en-GB', { timeZone: 'Europe/London', timeZoneName: 'shortOffset' });

const offsetCache = new Map<number, number>();

/** Offset of Europe/London from UTC in minutes, cached by hour (summer time starts and ends on the hour). */
function londonOffsetMinutes(d: Date): number {
  const hour = Math.floor(d.getTime() / 3_600_000);
  let cached = offsetCache.get(hour);
  if (cached === undefined) {
    cached = londonOffsetUncached(d);
    offsetCache.set(hour, cached);
  }
  return cached;
}

function londonOffsetUncached(d: Date): number {
  const name = londonOffsetFormat.formatToParts(d).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
  const m = /GMT([+-]\d+)(?::(\d+))?/.exec(name);
  if (!m) return 0;
  const h = Number(m[1]);
  return h * 60 + Math.sign(h) * Number(m[2] ?? 0);
}

/** A wall-clock time in Europe/London as an instant. */
function london(y: number, month: number, day: number, hour = 12, minute = 0): Date {
  const guess = Date.UTC(y, month - 1, day, hour, minute);
  return new Date(guess - londonOffsetMinutes(new Date(guess)) * 60_000);
}

function londonAtDay(d: Date, hour: number, minute = 0): Date {
  return london(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), hour, minute);
}

/** Saturdays from start to end inclusive, as UTC-noon dates. */
function saturdays(start: Date, end: Date): Date[] {
  const out: Date[] = [];
  let d = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), start.getUTCDate(), 12));
  while (d.getUTCDay() !== 6) d = addDays(d, 1);
  for (; d <= end; d = addDays(d, 7)) out.push(d);
  return out;
}

/** Metres east/north of a point, as lat/lon (a geodesic step on WGS84). */
function offsetPoint(lat: number, lon: number, east: number, north: number): { lat: number; lon: number } {
  const azimuth = (Math.atan2(east, north) * 180) / Math.PI;
  const p = destination({ lat, lon }, azimuth, Math.hypot(east, north));
  return { lat: round6(p.lat), lon: round6(p.lon) };
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

function demoDistanceM(aLat: number, aLon: number, bLat: number, bLon: number): number {
  return Math.round(distanceM({ lat: aLat, lon: aLon }, { lat: bLat, lon: bLon }));
}

// ---------------------------------------------------------------------------------------
// In-memory model
// ---------------------------------------------------------------------------------------

export type Rows = {
  users: (typeof t.user.$inferInsert)[];
  accounts: (typeof t.account.$inferInsert)[];
  settings: (typeof t.settings.$inferInsert)[];
  farms: (typeof t.farms.$inferInsert)[];
  memberships: (typeof t.farmMemberships.$inferInsert)[];
  species: (typeof t.species.$inferInsert)[];
  varieties: (typeof t.varieties.$inferInsert)[];
  pests: (typeof t.pests.$inferInsert)[];
  plants: (typeof t.motherPlants.$inferInsert)[];
  inspections: (typeof t.inspections.$inferInsert)[];
  findings: (typeof t.findings.$inferInsert)[];
  districtNotes: (typeof t.districtNotes.$inferInsert)[];
  seasons: (typeof t.seasons.$inferInsert)[];
  pickupWindows: (typeof t.pickupWindows.$inferInsert)[];
  offers: (typeof t.woodOffers.$inferInsert)[];
  requests: (typeof t.woodRequests.$inferInsert)[];
  lines: (typeof t.requestLines.$inferInsert)[];
  rounds: (typeof t.allocationRounds.$inferInsert)[];
  bundles: (typeof t.bundles.$inferInsert)[];
  strikeReports: (typeof t.strikeReports.$inferInsert)[];
  audit: (typeof t.auditLog.$inferInsert)[];
};

type Person = { seed: PersonSeed; id: string; joinedAt: Date; farmCodes: string[] };
type Farm = {
  seed: FarmSeed;
  id: string;
  index: number;
  lead: Person;
  hand: Person | null;
  createdAt: Date;
  nextNo: number;
  exchangeCount: number;
  beds: Map<string, { lat: number; lon: number }[]>;
};
type InspectionModel = { id: string; date: Date; inspectorId: string; notes: string; finding: { pest: string; severity: 'minor' | 'moderate' | 'severe'; notes: string } | null };
type Plant = {
  id: string;
  code: string;
  farm: Farm;
  species: SpeciesSeed;
  varietyKey: string | null;
  plantingYear: number;
  role: PlantRole;
  child: boolean;
  lineage: string | null;
  status: HealthStatus;
  retiredAt: Date | null;
  /** Spans when the plant was not clean (watch, hold, retired). */
  notClean: { from: Date; to: Date | null }[];
  inspections: InspectionModel[];
  row: typeof t.motherPlants.$inferInsert;
};
type SeasonCtx = {
  id: string;
  year: number;
  deadline: Date;
  collectionEnd: Date;
  windows: Map<string, { id: string; startsAt: Date; endsAt: Date }[]>;
};
type Offer = { id: string; plant: Plant; offered: number; remaining: number; row: typeof t.woodOffers.$inferInsert };
type Line = {
  id: string;
  species: SpeciesSeed;
  varietyKey: string | null;
  cuttings: number;
  substitutesAllowed: boolean;
  treatment: Treatment;
};
type Request = { id: string; grower: Person; lat: number; lon: number; maxKm: number; lines: Line[] };
type BundleModel = {
  id: string;
  offer: Offer;
  line: Line;
  request: Request;
  cuttings: number;
  forced: boolean;
  forcedLabel: string | null;
  row: typeof t.bundles.$inferInsert;
};

const TREATMENT_WEIGHTS: [Treatment, number][] = [
  ['none', 35],
  ['willow', 30],
  ['hormone', 20],
  ['both', 15],
];

// Demo strike rates: the species' untreated reference plus a treatment gain. For Ribes this
// gives about 0.70 untreated, 0.75 willow soak, 0.85 hormone, 0.90 both — CHECK-VALUES:
// 70-80 % with willow soak and about +10 points with hormone, common practice. Grape: about
// half untreated, over 0.70 with IBA — published: Iowa State 1999; Keeley et al. 2004.
const TREATMENT_GAIN: Record<Treatment, number> = { none: 0, willow: 0.05, hormone: 0.15, both: 0.2 };

// How often growers ask for each species in a dormant-hardwood season (demo only).
const DEMAND_WEIGHTS: [SpeciesKey, number][] = [
  ['blackcurrant', 30],
  ['redcurrant', 14],
  ['gooseberry', 14],
  ['jostaberry', 5],
  ['elder', 8],
  ['willow', 9],
  ['grape', 6],
  ['fig', 3],
  ['mulberry', 1],
  ['quince', 2],
];

function seasonName(year: number): string {
  return `Dormant hardwood ${year}–${String((year + 1) % 100).padStart(2, '0')}`;
}

// ---------------------------------------------------------------------------------------
// The build
// ---------------------------------------------------------------------------------------

/** The whole demo as rows, without touching a database (exported for tests). */
export function buildDemo(now: Date, passwordHash: string): { rows: Rows; sourceLinks: [string, string][]; summary: SeedSummary } {
  const r = new Rand(0x4ee1d00d);
  const ids = new Ids(0x5eedf00d);
  const rows: Rows = {
    users: [],
    accounts: [],
    settings: [],
    farms: [],
    memberships: [],
    species: [],
    varieties: [],
    pests: [],
    plants: [],
    inspections: [],
    findings: [],
    districtNotes: [],
    seasons: [],
    pickupWindows: [],
    offers: [],
    requests: [],
    lines: [],
    rounds: [],
    bundles: [],
    strikeReports: [],
    audit: [],
  };
  const sourceLinks: [string, string][] = [];

  // The open season's winter: collections start about five weeks from now.
  const collectionStartOpen = addDays(now, 35);
  const openYear = collectionStartOpen.getUTCMonth() >= 6 ? collectionStartOpen.getUTCFullYear() : collectionStartOpen.getUTCFullYear() - 1;
  const registerStart = london(openYear - 8, 1, 15, 10);
  const notAfter = (d: Date, slackDays = 1) => minDate(d, addDays(now, -slackDays));

  // ---- People --------------------------------------------------------------------------
  const people = new Map<string, Person>();
  for (const p of PEOPLE) {
    const id = ids.token('usr_');
    const joinedAt =
      p.status === 'pending' ? addDays(now, -r.int(2, 9)) : notAfter(london(openYear - p.joinedAgo, r.int(1, 3), r.int(1, 28), r.int(9, 20)), 30);
    people.set(p.key, { seed: p, id, joinedAt, farmCodes: p.farm ? [p.farm.code] : [] });
  }
  const person = (key: string) => {
    const p = people.get(key);
    if (!p) throw new Error(`demo data: no person ${key}`);
    return p;
  };
  const coordinator = person('coord');

  // ---- Farms ---------------------------------------------------------------------------
  const farms = new Map<string, Farm>();
  FARMS.forEach((f, index) => {
    const members = [...people.values()].filter((p) => p.seed.farm?.code === f.code);
    const lead = members.find((p) => p.seed.farm?.role === 'lead');
    if (!lead) throw new Error(`demo data: farm ${f.code} has no lead`);
    const createdAt = maxDate(lead.joinedAt, registerStart);
    farms.set(f.code, { seed: f, id: ids.uuid(), index, lead, hand: members.find((p) => p.seed.farm?.role === 'hand') ?? null, createdAt, nextNo: 1, exchangeCount: 0, beds: new Map() });
  });
  const farm = (code: string) => {
    const f = farms.get(code);
    if (!f) throw new Error(`demo data: no farm ${code}`);
    return f;
  };

  for (const p of people.values()) {
    const f = p.seed.farm ? farm(p.seed.farm.code) : null;
    const home = p.seed.home ?? (f ? { place: f.seed.name, lat: f.seed.lat, lon: f.seed.lon } : null);
    rows.users.push({
      id: p.id,
      name: p.seed.name,
      email: p.seed.email,
      emailVerified: true,
      role: p.seed.role,
      status: p.seed.status,
      application: p.seed.application ?? null,
      placeName: home?.place ?? null,
      homeLat: home?.lat ?? null,
      homeLon: home?.lon ?? null,
      createdAt: p.joinedAt,
      updatedAt: p.joinedAt,
    });
    rows.accounts.push({
      id: ids.token('acc_'),
      accountId: p.id,
      providerId: 'credential',
      userId: p.id,
      password: passwordHash,
      createdAt: p.joinedAt,
      updatedAt: p.joinedAt,
    });
    if (f && p.seed.farm) rows.memberships.push({ farmId: f.id, userId: p.id, farmRole: p.seed.farm.role, createdAt: p.joinedAt });
  }

  // ---- Settings ------------------------------------------------------------------------
  rows.settings.push(
    { key: 'cooperative', value: { name: COOPERATIVE.name, region: COOPERATIVE.region, hemisphere: COOPERATIVE.hemisphere, valuePerPlant: COOPERATIVE.valuePerPlant, currency: COOPERATIVE.currency }, updatedAt: now },
    { key: 'roleCaps', value: { ...ROLE_CAPS }, updatedAt: now },
    { key: 'seededAt', value: now.toISOString(), updatedAt: now },
  );

  // ---- Species, varieties, pests -------------------------------------------------------
  const speciesIds = new Map<SpeciesKey, string>();
  for (const s of SPECIES) {
    const id = ids.uuid();
    speciesIds.set(s.key, id);
    rows.species.push({
      id,
      scientificName: s.scientificName,
      commonName: s.commonName,
      genus: s.genus,
      propagationMethods: s.propagationMethods,
      defaultCuttingLengthCm: s.defaultCuttingLengthCm,
      defaultCuttingDiameterMm: s.defaultCuttingDiameterMm,
      softTipCm: s.softTipCm,
      strikeRatePrior: s.strikeRatePrior,
      priorStrength: s.priorStrength,
      shadeTolerant: s.shadeTolerant,
      firstCropYears: s.firstCropYears,
      restrictionNote: s.restrictionNote,
      notes: s.notes,
      createdAt: registerStart,
    });
  }
  const speciesByKey = new Map(SPECIES.map((s) => [s.key, s]));
  const varietyIds = new Map<string, string>();
  const varietySpecies = new Map<string, SpeciesKey>();
  for (const v of VARIETIES) {
    const id = ids.uuid();
    varietyIds.set(v.key, id);
    varietySpecies.set(v.key, v.species);
    rows.varieties.push({ id, speciesId: speciesIds.get(v.species)!, name: v.name, description: v.description, createdAt: registerStart });
  }
  const varietiesOf = (sp: SpeciesKey) => VARIETIES.filter((v) => v.species === sp).map((v) => v.key);
  const pestIds = new Map<string, string>();
  for (const p of PESTS) {
    const id = ids.uuid();
    pestIds.set(p.code, id);
    rows.pests.push({ id, code: p.code, name: p.name, scientificName: p.scientificName, kind: p.kind, travelsInWood: p.travelsInWood, genera: p.genera, signs: p.signs, advice: p.advice, source: p.source });
  }

  // ---- Mother plants -------------------------------------------------------------------
  const plants: Plant[] = [];
  const plantByLabel = new Map<string, Plant>();

  function placePlant(f: Farm, bed: string, east: number, north: number) {
    const pos = offsetPoint(f.seed.lat, f.seed.lon, east + (r.next() - 0.5) * 0.3, north + (r.next() - 0.5) * 0.3);
    const list = f.beds.get(bed) ?? [];
    list.push(pos);
    f.beds.set(bed, list);
    return pos;
  }

  function newPlant(args: {
    f: Farm;
    species: SpeciesSeed;
    varietyKey: string | null;
    plantingYear: number;
    role: PlantRole;
    provenance: 'bought' | 'seed' | 'exchange';
    supplier: string | null;
    pos: { lat: number; lon: number };
    bedRow: string;
    notes: string;
    child: boolean;
    parent: Plant | null;
    createdAt: Date;
  }): Plant {
    const code = `${args.f.seed.code}-${String(args.f.nextNo++).padStart(4, '0')}`;
    const p: Plant = {
      id: ids.uuid(),
      code,
      farm: args.f,
      species: args.species,
      varietyKey: args.varietyKey,
      plantingYear: args.plantingYear,
      role: args.role,
      child: args.child,
      lineage: null,
      status: 'clean',
      retiredAt: null,
      notClean: [],
      inspections: [],
      row: {
        code,
        farmId: args.f.id,
        speciesId: speciesIds.get(args.species.key)!,
        varietyId: args.varietyKey ? varietyIds.get(args.varietyKey)! : null,
        plantingYear: args.plantingYear,
        lat: args.pos.lat,
        lon: args.pos.lon,
        bedRow: args.bedRow,
        role: args.role,
        provenance: args.provenance,
        parentPlantId: args.parent?.id ?? null,
        supplier: args.supplier,
        notes: args.notes,
        createdBy: args.f.lead.id,
        createdAt: args.createdAt,
      },
    };
    p.row.id = p.id;
    plants.push(p);
    return p;
  }

  // Beds: stock beds north of the yard, fruiting beds and orchard rows to the south.
  for (const f of farms.values()) {
    let xNorth = -40;
    let xSouth = -40;
    for (const bed of f.seed.beds) {
      const north = bed.role === 'stock_bed';
      let x = north ? xNorth : xSouth;
      const y0 = north ? 25 : -45;
      bed.rows.forEach((row, ri) => {
        const speciesKey = (varietySpecies.get(row.v) ?? row.v) as SpeciesKey;
        const sp = speciesByKey.get(speciesKey);
        if (!sp) throw new Error(`demo data: unknown variety or species ${row.v}`);
        // Currants 0.9-1.2 m in the row, rows 1.8-2.4 m apart (CHECK-VALUES "Planting and
        // crop", published: Penn State Extension; OMAFRA); stock beds closer in the row.
        const tree = sp.tree && bed.role === 'fruiting_bush';
        const rowGap = tree ? 6 : bed.role === 'stock_bed' ? 2 : 2.4;
        const inRow = tree ? 5 : bed.role === 'stock_bed' ? 1 : 1.5;
        const plantingYear = openYear - row.ago;
        const supplier = row.seed ? null : SUPPLIERS[(f.index + ri) % SUPPLIERS.length];
        for (let i = 0; i < row.n; i++) {
          const pos = placePlant(f, bed.name, x, y0 + i * inRow);
          newPlant({
            f,
            species: sp,
            varietyKey: varietySpecies.has(row.v) ? row.v : null,
            plantingYear,
            role: bed.role,
            provenance: row.seed ? 'seed' : 'bought',
            supplier,
            pos,
            bedRow: `${bed.name}, row ${ri + 1}, no. ${i + 1}`,
            notes: row.seed ? 'Seedling raised on the farm; no named variety.' : r.chance(0.35) ? r.pick(PLANT_NOTES) : '',
            child: false,
            parent: null,
            createdAt: notAfter(maxDate(london(plantingYear, 11, r.int(1, 28), 15), addDays(f.createdAt, r.int(0, 60))), 30),
          });
        }
        x += rowGap;
      });
      if (north) xNorth = x + 8;
      else xSouth = x + 8;
    }
  }
  const root = plants.find((p) => p.code === LINEAGE_ROOT_CODE);
  if (!root || root.species.key !== 'blackcurrant') throw new Error('demo data: lineage root must be a blackcurrant');
  root.lineage = 'root';
  plantByLabel.set('root', root);
  root.row.notes = 'Bought as certified stock; the oldest line of this variety in the cooperative. Wood from it has been raised on four farms.';

  // ---- Inspections and health ----------------------------------------------------------
  const audit = (plant: Plant, at: Date, actorId: string, before: HealthStatus, after: HealthStatus, reason: string) =>
    rows.audit.push({ id: ids.uuid(), actorId, entity: 'mother_plant', entityId: plant.id, action: 'status', reason, before: { healthStatus: before }, after: { healthStatus: after }, at });

  function inspectorFor(p: Plant, latest: boolean, date: Date): string {
    const hand = p.farm.hand;
    if (latest && hand && hand.joinedAt < date && r.chance(0.5)) return hand.id;
    return p.farm.lead.id;
  }

  type HealthKind = 'clean' | 'stale' | 'hold' | 'watch' | 'retired' | 'lifted';
  function schedule(p: Plant, kind: HealthKind, plan?: (typeof HEALTH_PLAN)[number], previousOn?: Date) {
    // Inspections start once the plant is on the register.
    const lower = p.row.createdAt ?? registerStart;
    let latest: Date;
    let retiredAt: Date | null = null;
    switch (kind) {
      case 'stale':
        latest = addDays(now, -r.int(430, 700));
        break;
      case 'hold':
        latest = addDays(now, -r.int(8, 45));
        break;
      case 'watch':
        latest = addDays(now, -r.int(15, 100));
        break;
      case 'retired':
        retiredAt = addDays(now, -r.int(150, 1000));
        latest = addDays(retiredAt, -r.int(5, 30));
        break;
      default:
        latest = addDays(now, -r.int(14, 150));
    }
    const dates: Date[] = [];
    const start = previousOn && previousOn >= lower ? previousOn : latest;
    if (start !== latest) dates.push(latest);
    for (let d = start; d >= lower; d = addDays(d, -r.int(330, 362))) dates.push(d);
    if (dates.length === 0 && kind !== 'clean' && kind !== 'stale') dates.push(latest);
    dates.reverse();
    p.inspections = dates.map((d, i) => {
      const last = i === dates.length - 1;
      const at = londonAtDay(d, r.int(9, 16), r.pick([0, 15, 30, 45]));
      return { id: ids.uuid(), date: at, inspectorId: inspectorFor(p, last, at), notes: r.pick(CLEAN_NOTES), finding: null };
    });
    const last = p.inspections[p.inspections.length - 1];
    if (plan && last) {
      last.finding = { pest: plan.pest, severity: plan.severity, notes: plan.finding };
      last.notes = plan.status === 'watch' ? 'Minor problem noted; plant on watch.' : 'Found at inspection; see finding.';
      const travels = PESTS.find((x) => x.code === plan.pest)?.travelsInWood ?? false;
      if (plan.status === 'hold') {
        p.status = 'hold';
        p.notClean.push({ from: last.date, to: null });
        audit(p, last.date, last.inspectorId, 'clean', 'hold', plan.reason);
      } else if (plan.status === 'watch') {
        p.status = 'watch';
        p.notClean.push({ from: last.date, to: null });
        audit(p, last.date, last.inspectorId, 'clean', 'watch', plan.reason);
      } else {
        p.status = 'retired';
        p.retiredAt = londonAtDay(retiredAt ?? addDays(last.date, 14), 16);
        p.notClean.push({ from: last.date, to: null });
        if (travels) {
          audit(p, last.date, last.inspectorId, 'clean', 'hold', `${PESTS.find((x) => x.code === plan.pest)?.name} suspected at inspection.`);
          audit(p, p.retiredAt, coordinator.id, 'hold', 'retired', plan.reason);
        } else {
          audit(p, p.retiredAt, coordinator.id, 'clean', 'retired', plan.reason);
        }
      }
    }
    if (kind === 'lifted' && p.inspections.length >= 2) {
      const earlier = p.inspections[p.inspections.length - 2];
      earlier.finding = { pest: 'CCM', severity: 'minor', notes: 'One wilted shoot; suspected clearwing.' };
      earlier.notes = 'Possible clearwing; plant on hold until stems are checked.';
      const lifted = londonAtDay(addDays(earlier.date, 30), 11);
      p.notClean.push({ from: earlier.date, to: lifted });
      audit(p, earlier.date, earlier.inspectorId, 'clean', 'hold', 'Suspected currant clearwing in one shoot.');
      audit(p, lifted, coordinator.id, 'hold', 'clean', 'Cut twelve stems: clean pith, no tunnels. Wilted shoot was wind damage; hold lifted.');
    }
    p.row.healthStatus = p.status;
    p.row.retiredAt = p.retiredAt;
    p.row.lastInspectedOn = last ? ymd(last.date) : null;
    p.row.updatedAt = p.retiredAt ?? last?.date ?? p.row.createdAt;
  }

  const assigned = new Set<Plant>([root]);
  const candidates = (plan: (typeof HEALTH_PLAN)[number]) =>
    r.shuffle(
      plants.filter(
        (p) =>
          !assigned.has(p) &&
          (plan.species === 'any' || plan.species.includes(p.species.key)) &&
          (!plan.farm || p.farm.seed.code === plan.farm) &&
          (plan.status !== 'retired' || p.plantingYear <= openYear - 6),
      ),
    );
  for (const plan of HEALTH_PLAN) {
    const chosen = candidates(plan).slice(0, plan.n);
    if (chosen.length < plan.n) throw new Error(`demo data: not enough plants for ${plan.status} ${plan.pest}`);
    chosen.forEach((p, i) => {
      assigned.add(p);
      const labelled = i === 0 && plan.label !== undefined;
      if (labelled) plantByLabel.set(plan.label!, p);
      schedule(p, plan.status, plan, labelled ? london(openYear - 1, 9, r.int(8, 20), 11) : undefined);
    });
  }
  const lifted = r.shuffle(plants.filter((p) => !assigned.has(p) && p.species.key === 'redcurrant' && p.plantingYear <= openYear - 4))[0];
  assigned.add(lifted);
  schedule(lifted, 'lifted');
  for (const p of r.shuffle(plants.filter((p) => !assigned.has(p))).slice(0, STALE_PLANTS)) {
    assigned.add(p);
    schedule(p, 'stale');
  }
  for (const p of plants) if (!assigned.has(p)) schedule(p, 'clean');

  // ---- Exchange history ----------------------------------------------------------------
  const growers = [...people.values()].filter((p) => p.seed.role === 'member' && p.seed.status !== 'pending');
  const suspendedOn = london(openYear - 2, 3, 14, 10);

  function eligible(p: Plant, s: SeasonCtx): boolean {
    if (!p.species.propagationMethods.some((m) => m === 'hardwood' || m === 'live_stake')) return false;
    if (p.plantingYear > s.year - 1) return false;
    if (p.retiredAt && p.retiredAt <= s.collectionEnd) return false;
    const from = addDays(s.deadline, -30);
    if (p.notClean.some((n) => n.from <= s.collectionEnd && (n.to === null || n.to >= from))) return false;
    const lookback = addDays(s.deadline, -365);
    return p.inspections.some((i) => i.date >= lookback && i.date <= s.deadline);
  }

  function makeOffer(p: Plant, s: SeasonCtx, createdAt: Date, minimum = 0): Offer | null {
    const g = p.species.growth;
    const stock = p.role === 'stock_bed';
    const cap = ROLE_CAPS[p.role];
    const cut = p.species.defaultCuttingLengthCm;
    const tip = p.species.softTipCm;
    const direct = minimum === 0 && r.chance(0.06);
    let shootCount = r.int(...(stock ? g.stockShoots : g.bushShoots));
    const meanLen = Math.round(r.int(...(stock ? g.stockLenCm : g.bushLenCm)) / 5) * 5;
    // DESIGN "Yield of a plant": cuttings per shoot = floor((mean length - soft tip) /
    // cutting length); yield = shoots x that; offered = floor(yield x role cap).
    const perShoot = Math.max(1, Math.floor((meanLen - tip) / cut));
    let yieldN = direct ? r.int(10, 40) : shootCount * perShoot;
    while (Math.floor(yieldN * cap) < minimum) {
      shootCount += 2;
      yieldN = shootCount * perShoot;
    }
    const offered = Math.floor(yieldN * cap);
    if (offered < 1) return null;
    const id = ids.uuid();
    const o: Offer = {
      id,
      plant: p,
      offered,
      remaining: offered,
      row: {
        id,
        seasonId: s.id,
        plantId: p.id,
        shootCount: direct ? null : shootCount,
        meanShootLengthCm: direct ? null : meanLen,
        directCount: direct ? yieldN : null,
        estimatedYield: yieldN,
        capFraction: cap,
        offered,
        reserved: 0,
        createdBy: p.farm.lead.id,
        createdAt,
        updatedAt: createdAt,
      },
    };
    rows.offers.push(o.row);
    return o;
  }

  function windowsFor(seasonId: string, start: Date, end: Date, slots: (fi: number) => number[]): Map<string, { id: string; startsAt: Date; endsAt: Date }[]> {
    const sats = saturdays(start, end);
    const out = new Map<string, { id: string; startsAt: Date; endsAt: Date }[]>();
    for (const f of farms.values()) {
      const list = [...new Set(slots(f.index))]
        .filter((i) => i < sats.length)
        .map((i) => {
          const startsAt = londonAtDay(sats[i], 9, 30);
          return { id: ids.uuid(), startsAt, endsAt: addMinutes(startsAt, 180) };
        });
      for (const w of list) rows.pickupWindows.push({ id: w.id, seasonId, farmId: f.id, startsAt: w.startsAt, endsAt: w.endsAt, note: f.seed.pickupNote });
      out.set(f.seed.code, list);
    }
    return out;
  }

  function makeLine(sp: SpeciesSeed, varietyKey: string | null, cuttings: number, treatment: Treatment, subs: boolean, plan: unknown, createdAt: Date, requestId: string): Line {
    const id = ids.uuid();
    rows.lines.push({
      id,
      requestId,
      speciesId: speciesIds.get(sp.key)!,
      varietyId: varietyKey ? varietyIds.get(varietyKey)! : null,
      cuttings,
      substitutesAllowed: subs,
      treatment,
      priority: 1,
      plan,
      createdAt,
    });
    return { id, species: sp, varietyKey, cuttings, substitutesAllowed: subs, treatment };
  }

  /** A grower's planting turned into a number of cuttings (DESIGN "Planner"). */
  function randomLine(requestId: string, createdAt: Date, allowed: (k: SpeciesKey) => boolean): Line {
    const sp = speciesByKey.get(r.weighted(DEMAND_WEIGHTS.filter(([k]) => allowed(k))))!;
    const byVariety = r.chance(0.55);
    const varietyKey = byVariety ? r.pick(varietiesOf(sp.key)) : null;
    const subs = byVariety ? r.chance(0.5) : true;
    const treatment = r.weighted(TREATMENT_WEIGHTS);
    // Cuttings per planting position: 2 — CHECK-VALUES, common practice; one live stake each.
    const perPosition = sp.key === 'willow' ? 1 : 2;
    let plan: Record<string, unknown>;
    let positions: number;
    if (sp.key === 'willow') {
      positions = r.int(15, 50);
      plan = { kind: 'positions', positions, cuttingsPerPosition: perPosition, purpose: 'Live stakes along a ditch bank' };
    } else if (sp.tree || sp.key === 'grape') {
      positions = r.int(3, 10);
      plan = { kind: 'positions', positions, cuttingsPerPosition: perPosition, purpose: 'Nursery bed' };
    } else if (r.chance(0.6)) {
      const lengthM = r.int(2, 8) * 5;
      // In-row spacing: currants 0.9-1.2 m, gooseberries 1.2-1.5 m — CHECK-VALUES, published:
      // Penn State Extension; ATTRA/NCAT; OMAFRA 98-095. Elder: demo choice.
      const spacingM = sp.key === 'gooseberry' ? 1.2 : sp.key === 'elder' ? 1.5 : 1.0;
      const rowsN = r.chance(0.25) ? 2 : 1;
      positions = rowsN * (Math.floor(lengthM / spacingM) + 1);
      plan = { kind: 'hedgerow', lengthM, spacingM, rows: rowsN, positions, cuttingsPerPosition: perPosition };
    } else {
      positions = r.int(6, 30);
      plan = { kind: 'positions', positions, cuttingsPerPosition: perPosition, purpose: r.pick(['Shrubs beside orchard trees', 'Nursery bed', 'Garden row']) };
    }
    return makeLine(sp, varietyKey, positions * perPosition, treatment, subs, { ...plan, treatment }, createdAt, requestId);
  }

  function makeRequest(s: { id: string }, grower: Person, createdAt: Date, status: 'draft' | 'filed', maxKm: number, notes = ''): Request {
    const f = grower.farmCodes[0] ? farm(grower.farmCodes[0]) : null;
    const home = grower.seed.home ?? { place: f!.seed.name, lat: f!.seed.lat, lon: f!.seed.lon };
    const id = ids.uuid();
    rows.requests.push({
      id,
      seasonId: s.id,
      growerId: grower.id,
      status,
      destinationLat: home.lat,
      destinationLon: home.lon,
      destinationLabel: home.place,
      maxDistanceKm: maxKm,
      notes,
      createdAt,
      updatedAt: createdAt,
    });
    return { id, grower, lat: home.lat, lon: home.lon, maxKm, lines: [] };
  }

  /** A simple greedy share-out for past seasons (the product's rounds use the solver). */
  function allocate(requests: Request[], offers: Offer[], taken: Map<string, number>): { offer: Offer; line: Line; request: Request; cuttings: number }[] {
    const out: { offer: Offer; line: Line; request: Request; cuttings: number }[] = [];
    const work = r.shuffle(requests.flatMap((q) => q.lines.map((l) => ({ q, l }))));
    for (const { q, l } of work) {
      let need = l.cuttings - out.filter((b) => b.line === l).reduce((s, b) => s + b.cuttings, 0);
      const cands = offers
        .filter(
          (o) =>
            o.remaining > 0 &&
            o.plant.species === l.species &&
            (l.varietyKey === null || o.plant.varietyKey === l.varietyKey || l.substitutesAllowed) &&
            !q.grower.farmCodes.includes(o.plant.farm.seed.code),
        )
        .map((o) => ({ o, d: demoDistanceM(q.lat, q.lon, o.plant.farm.seed.lat, o.plant.farm.seed.lon) }))
        .filter(({ d }) => d <= q.maxKm * 1000)
        .sort((a, b) => Number(b.o.plant.varietyKey === l.varietyKey) - Number(a.o.plant.varietyKey === l.varietyKey) || a.d - b.d || b.o.remaining - a.o.remaining);
      let n = 0;
      for (const { o } of cands) {
        if (need <= 0 || n >= 3) break;
        const key = `${q.grower.id}/${o.plant.farm.seed.code}`;
        const limit = o.plant.farm.seed.perGrowerLimit;
        const room = limit === null ? Infinity : limit - (taken.get(key) ?? 0);
        const amount = Math.min(need, o.remaining, room);
        if (amount < Math.min(5, need)) continue;
        o.remaining -= amount;
        need -= amount;
        taken.set(key, (taken.get(key) ?? 0) + amount);
        out.push({ offer: o, line: l, request: q, cuttings: amount });
        n++;
      }
    }
    return out;
  }

  function strikeRate(sp: SpeciesSeed, treatment: Treatment): number {
    const gain = sp.key === 'grape' && treatment !== 'none' && treatment !== 'willow' ? TREATMENT_GAIN[treatment] + 0.05 : TREATMENT_GAIN[treatment];
    return Math.min(0.95, Math.max(0.05, sp.strikeRatePrior + gain + (r.next() - 0.5) * 0.1));
  }

  function raiseChild(b: BundleModel, season: SeasonCtx, label: string | null): Plant {
    const f = farm(b.request.grower.farmCodes[0]);
    const idx = f.exchangeCount++;
    const rowNo = Math.floor(idx / 8);
    const no = idx % 8;
    const pos = placePlant(f, 'Exchange bed', -70 + rowNo * 2, -10 + no * 1);
    const parent = b.offer.plant;
    const plantingYear = season.year + 1;
    const child = newPlant({
      f,
      species: parent.species,
      varietyKey: parent.varietyKey,
      plantingYear,
      role: 'stock_bed',
      provenance: 'exchange',
      supplier: null,
      pos,
      bedRow: `Exchange bed, row ${rowNo + 1}, no. ${no + 1}`,
      notes: `Raised from bundle ${b.row.code} of ${parent.code} (${parent.farm.seed.name}).`,
      child: true,
      parent,
      createdAt: notAfter(london(plantingYear, 11, r.int(1, 25), 16), 7),
    });
    child.lineage = label;
    if (label) plantByLabel.set(label, child);
    sourceLinks.push([child.id, b.id]);
    schedule(child, 'clean');
    return child;
  }

  const closedYears = [openYear - 7, openYear - 5, openYear - 3, openYear - 1];
  const grower = person('grower');
  const derek = person('derek');
  for (const year of closedYears) {
    const seasonAgo = openYear - year;
    const season: SeasonCtx = {
      id: ids.uuid(),
      year,
      deadline: london(year, 10, 31, 18),
      collectionEnd: london(year + 1, 2, 28, 18),
      windows: new Map(),
    };
    rows.seasons.push({
      id: season.id,
      name: seasonName(year),
      kind: 'dormant_hardwood',
      hemisphere: 'north',
      stage: 'closed',
      requestDeadline: season.deadline,
      collectionStart: `${year}-12-01`,
      collectionEnd: `${year + 1}-02-28`,
      lookbackMonths: 12,
      notes: 'Dormant hardwood cuttings of this summer’s growth, cut after leaf fall.',
      createdBy: coordinator.id,
      createdAt: london(year, 9, 1, 10),
    });
    season.windows = windowsFor(season.id, london(year, 12, 1), london(year + 1, 2, 28), (fi) => [(fi % 3) + 1, (fi % 3) + 6]);

    // Offers from plants that were clean and inspected within the look-back then.
    const steps = FORCED_EXCHANGES.filter((s) => s.seasonAgo === seasonAgo);
    const forcedPlants = new Map<Plant, number>();
    for (const step of steps) {
      const from = plantByLabel.get(step.from);
      if (!from) throw new Error(`demo data: lineage plant ${step.from} missing`);
      forcedPlants.set(from, (forcedPlants.get(from) ?? 0) + step.to.reduce((s, x) => s + x.cuttings, 0));
    }
    const offers: Offer[] = [];
    for (const p of plants) {
      const forced = forcedPlants.get(p);
      if (forced === undefined && (!eligible(p, season) || !r.chance(0.75))) continue;
      const o = makeOffer(p, season, london(year, 10, r.int(1, 25), r.int(17, 21)), forced ? forced + 6 : 0);
      if (o) offers.push(o);
    }

    // Requests: growers who were members then, some farm leads, and the lineage steps.
    const requests = new Map<Person, Request>();
    const requestFor = (g: Person) => {
      let q = requests.get(g);
      if (!q) {
        q = makeRequest({ id: season.id }, g, london(year, 10, r.int(2, 30), r.int(8, 21)), 'filed', g.seed.maxKm ?? 50);
        requests.set(g, q);
      }
      return q;
    };
    const forcedBundles: { from: Plant; line: Line; request: Request; label: string | null; cuttings: number }[] = [];
    for (const step of steps) {
      const from = plantByLabel.get(step.from)!;
      for (const to of step.to) {
        const q = requestFor(person(to.grower));
        const l = makeLine(from.species, from.varietyKey, to.cuttings, to.treatment, false, { kind: 'positions', positions: to.cuttings / 2, cuttingsPerPosition: 2, purpose: 'New stock-bed row', treatment: to.treatment }, addDays(season.deadline, -r.int(3, 20)), q.id);
        q.lines.push(l);
        forcedBundles.push({ from, line: l, request: q, label: to.label ?? null, cuttings: to.cuttings });
      }
    }
    for (const g of growers) {
      if (g.joinedAt > season.deadline) continue;
      if (g === derek && year > suspendedOn.getUTCFullYear()) continue;
      const isLead = g.farmCodes.length > 0;
      const must = (g === grower && seasonAgo <= 3) || (g === derek && seasonAgo <= 5);
      if (!must && !r.chance(isLead ? 0.5 : 0.8)) continue;
      const q = requestFor(g);
      const n = r.int(1, isLead ? 2 : 3);
      for (let i = 0; i < n; i++) q.lines.push(randomLine(q.id, addDays(season.deadline, -r.int(2, 25)), (k) => speciesByKey.get(k)!.propagationMethods.some((m) => m === 'hardwood' || m === 'live_stake')));
    }

    // The round: lineage bundles first, then a greedy share of the rest.
    const roundId = ids.uuid();
    const approvedAt = london(year, 11, 10, 14);
    rows.rounds.push({ id: roundId, seasonId: season.id, number: 1, status: 'approved', createdBy: coordinator.id, approvedBy: coordinator.id, approvedAt, createdAt: london(year, 11, 8, 10) });
    const taken = new Map<string, number>();
    const shares: { offer: Offer; line: Line; request: Request; cuttings: number; forced: boolean; label: string | null }[] = [];
    for (const fb of forcedBundles) {
      const o = offers.find((x) => x.plant === fb.from)!;
      o.remaining -= fb.cuttings;
      const key = `${fb.request.grower.id}/${o.plant.farm.seed.code}`;
      taken.set(key, (taken.get(key) ?? 0) + fb.cuttings);
      shares.push({ offer: o, line: fb.line, request: fb.request, cuttings: fb.cuttings, forced: true, label: fb.label });
    }
    const forcedLines = new Set(forcedBundles.map((f) => f.line));
    const open = [...requests.values()].map((q) => ({ ...q, lines: q.lines.filter((l) => !forcedLines.has(l)) }));
    for (const s of allocate(open, offers, taken)) shares.push({ ...s, forced: false, label: null });

    // Bundles, numbered by farm and grower so labels read in pickup order.
    shares.sort((a, b) => a.offer.plant.farm.seed.code.localeCompare(b.offer.plant.farm.seed.code) || a.request.grower.seed.name.localeCompare(b.request.grower.seed.name) || a.offer.plant.code.localeCompare(b.offer.plant.code));
    const yy = String(year % 100).padStart(2, '0');
    const bundles: BundleModel[] = shares.map((s, i) => {
      const id = ids.uuid();
      const farmWindows = season.windows.get(s.offer.plant.farm.seed.code)!;
      const w = farmWindows[(s.request.grower.seed.name.length + s.offer.plant.farm.index) % farmWindows.length];
      const cancelled = !s.forced && (s.request.grower === derek || r.chance(0.05));
      const collectedAt = cancelled ? null : addMinutes(w.startsAt, r.int(5, 170));
      const b: BundleModel = {
        id,
        offer: s.offer,
        line: s.line,
        request: s.request,
        cuttings: s.cuttings,
        forced: s.forced,
        forcedLabel: s.label,
        row: {
          id,
          code: `B${yy}-${String(i + 1).padStart(4, '0')}`,
          roundId,
          offerId: s.offer.id,
          lineId: s.line.id,
          plantId: s.offer.plant.id,
          farmId: s.offer.plant.farm.id,
          growerId: s.request.grower.id,
          cuttings: s.cuttings,
          status: cancelled ? 'cancelled' : 'collected',
          pickupWindowId: w.id,
          distanceM: demoDistanceM(s.request.lat, s.request.lon, s.offer.plant.farm.seed.lat, s.offer.plant.farm.seed.lon),
          collectedAt,
          createdAt: approvedAt,
        },
      };
      rows.bundles.push(b.row);
      if (!cancelled) s.offer.row.reserved = (s.offer.row.reserved ?? 0) + s.cuttings;
      return b;
    });

    // Strike reports the summer after; plants raised from bundles on members' farms.
    for (const b of bundles) {
      if (b.row.status !== 'collected') continue;
      const assessed = london(year + 1, 9, r.int(5, 28), 19);
      const reported = b.forced || (r.chance(0.85) && !(b.request.grower === grower && seasonAgo === 1));
      if (reported && assessed < now) {
        const stuck = Math.max(1, b.cuttings - (r.chance(0.3) ? r.int(1, 2) : 0));
        const rooted = r.binomial(stuck, strikeRate(b.line.species, b.line.treatment));
        rows.strikeReports.push({
          id: ids.uuid(),
          bundleId: b.id,
          reporterId: b.request.grower.id,
          stuck,
          rooted,
          assessedOn: ymd(assessed),
          treatment: b.line.treatment,
          notes: r.pick(STRIKE_NOTES),
          createdAt: assessed,
        });
      }
      if (b.request.grower.farmCodes.length === 0) continue;
      if (b.forcedLabel) raiseChild(b, season, b.forcedLabel);
      else if (!b.forced && r.chance(0.4)) {
        raiseChild(b, season, null);
        if (r.chance(0.25)) raiseChild(b, season, null);
      }
    }
  }

  // ---- The open season -----------------------------------------------------------------
  const openSeasonId = ids.uuid();
  const deadlineDay = addDays(now, 21);
  const openStart = addDays(now, 35);
  const openEnd = addDays(now, 84);
  const openDeadline = londonAtDay(deadlineDay, 18);
  rows.seasons.push({
    id: openSeasonId,
    name: seasonName(openYear),
    kind: 'dormant_hardwood',
    hemisphere: 'north',
    stage: 'requests_open',
    requestDeadline: openDeadline,
    collectionStart: ymd(openStart),
    collectionEnd: ymd(openEnd),
    lookbackMonths: 12,
    notes: 'Dormant hardwood cuttings of this summer’s growth, cut after leaf fall. Reject any blackcurrant wood with swollen round buds.',
    createdBy: coordinator.id,
    createdAt: notAfter(addDays(now, -20), 0),
  });
  windowsFor(openSeasonId, openStart, openEnd, (fi) => (fi % 3 === 0 ? [fi % 2, (fi % 2) + 3, (fi % 2) + 5] : [fi % 2, (fi % 2) + 3]));
  const freshSince = addDays(now, -330);
  for (const p of plants) {
    if (p.status !== 'clean') continue;
    if (!p.species.propagationMethods.some((m) => m === 'hardwood' || m === 'live_stake')) continue;
    if (p.plantingYear > openYear - 1) continue;
    const last = p.inspections[p.inspections.length - 1];
    if (!last || last.date < freshSince) continue;
    if (!r.chance(0.85) && p.lineage === null) continue;
    makeOffer(p, { id: openSeasonId, year: openYear, deadline: openDeadline, collectionEnd: openEnd, windows: new Map() }, notAfter(addDays(now, -r.int(1, 14)), 0));
  }
  // A few requests already filed; grower@heelwood.test has none yet (the demo files one).
  const openRequesters: [string, 'filed' | 'draft', number][] = [
    ['joan', 'filed', 2],
    ['ben', 'filed', 1],
    ['fatima', 'filed', 3],
    ['rosa', 'filed', 2],
    ['mair', 'filed', 1],
    ['ewan', 'draft', 2],
    ['grs', 'filed', 1],
    ['lyn', 'filed', 2],
  ];
  for (const [key, status, n] of openRequesters) {
    const g = person(key);
    const maxKm = Math.min(40, Math.max(10, g.seed.maxKm ?? 40));
    const createdAt = notAfter(addDays(now, -r.int(1, 10)), 0);
    const q = makeRequest({ id: openSeasonId }, g, createdAt, status, maxKm, status === 'draft' ? 'Still measuring the hedge line.' : '');
    for (let i = 0; i < n; i++) q.lines.push(randomLine(q.id, createdAt, (k) => speciesByKey.get(k)!.propagationMethods.some((m) => m === 'hardwood' || m === 'live_stake')));
  }

  // ---- Inspections and findings rows ---------------------------------------------------
  for (const p of plants) {
    for (const i of p.inspections) {
      rows.inspections.push({ id: i.id, plantId: p.id, inspectedOn: ymd(i.date), inspectorId: i.inspectorId, notes: i.notes, createdAt: i.date });
      if (i.finding) rows.findings.push({ id: ids.uuid(), inspectionId: i.id, pestId: pestIds.get(i.finding.pest)!, severity: i.finding.severity, notes: i.finding.notes });
    }
    rows.plants.push(p.row);
  }

  // ---- District notes, the suspended member, farm outlines -------------------------------
  for (const n of DISTRICT_NOTES) {
    const d = addDays(now, -n.daysAgo);
    rows.districtNotes.push({ id: ids.uuid(), authorId: person(n.author).id, body: n.body, lat: n.lat, lon: n.lon, notedOn: ymd(d), createdAt: d });
  }
  rows.audit.push({
    id: ids.uuid(),
    actorId: coordinator.id,
    entity: 'user',
    entityId: derek.id,
    action: 'status',
    reason: 'Reserved wood left uncollected two seasons running; suspended until the committee meets.',
    before: { status: 'active' },
    after: { status: 'suspended' },
    at: suspendedOn,
  });
  rows.users.find((u) => u.id === derek.id)!.updatedAt = suspendedOn;

  for (const f of farms.values()) {
    const features: unknown[] = [];
    const all: { lat: number; lon: number }[] = [{ lat: f.seed.lat, lon: f.seed.lon }];
    for (const [name, pts] of f.beds) {
      all.push(...pts);
      features.push(boxFeature(pts, 1.5, { kind: 'bed', label: name }));
    }
    features.unshift(boxFeature(all, 30, { kind: 'outline', label: f.seed.name }));
    rows.farms.push({
      id: f.id,
      code: f.seed.code,
      name: f.seed.name,
      address: f.seed.address,
      directions: f.seed.directions,
      lat: f.seed.lat,
      lon: f.seed.lon,
      timezone: COOPERATIVE.timezone,
      contactEmail: f.lead.seed.email,
      perGrowerLimit: f.seed.perGrowerLimit,
      outline: { type: 'FeatureCollection', features },
      createdAt: f.createdAt,
    });
  }

  const summary: SeedSummary = {
    users: rows.users.length,
    farms: rows.farms.length,
    species: rows.species.length,
    varieties: rows.varieties.length,
    plants: rows.plants.length,
    inspections: rows.inspections.length,
    seasons: rows.seasons.length,
    bundles: rows.bundles.length,
    strikeReports: rows.strikeReports.length,
    lineageRootCode: root.code,
  };
  return { rows, sourceLinks, summary };
}

/** A GeoJSON rectangle round some points, with a margin in metres. */
function boxFeature(pts: { lat: number; lon: number }[], marginM: number, properties: Record<string, string>) {
  const lats = pts.map((p) => p.lat);
  const lons = pts.map((p) => p.lon);
  const sw = offsetPoint(Math.min(...lats), Math.min(...lons), -marginM, -marginM);
  const ne = offsetPoint(Math.max(...lats), Math.max(...lons), marginM, marginM);
  return {
    type: 'Feature',
    properties,
    geometry: {
      type: 'Polygon',
      coordinates: [
        [
          [sw.lon, sw.lat],
          [ne.lon, sw.lat],
          [ne.lon, ne.lat],
          [sw.lon, ne.lat],
          [sw.lon, sw.lat],
        ],
      ],
    },
  };
}
