// Every write route of the API, with what the bad-input fuzz needs to call it: who is
// allowed to (so the validation path runs, not the guard), how to fill its address from the
// demo cooperative, the schema its body is checked with and one valid body to mutate.
//
// bad-input.test.ts compares this list with the routes the Express app really has
// (walked from its router stack) and fails when a write route is missing here, so a new
// route gets fuzzed as soon as it is mounted. Each route names the test file (group) that
// fuzzes it; the files run in parallel.
import { sql } from 'drizzle-orm';
import type { Express } from 'express';
import type { ZodType } from 'zod';
import { bundleAddSchema, bundleEditSchema, collectionSchema } from '../../shared/schemas/allocation.js';
import { districtNoteSchema, inspectionCreateSchema, pestSchema } from '../../shared/schemas/health.js';
import { farmMembershipSchema, memberPatchSchema, signInSchema, signUpSchema } from '../../shared/schemas/members.js';
import { plannerEstimateSchema } from '../../shared/schemas/planner.js';
import { liftHoldSchema, plantCreateSchema, plantUpdateSchema, retireSchema, speciesPatchSchema, speciesSchema, varietyPatchSchema, varietySchema } from '../../shared/schemas/register.js';
import { offerInputSchema, pickupWindowSchema, seasonCreateSchema, seasonStageSchema, woodRequestSchema } from '../../shared/schemas/seasons.js';
import { raisePlantsSchema, strikeReportCreateSchema } from '../../shared/schemas/strike-reports.js';
import { noticeSchema } from '../../shared/schemas/trace.js';
import { outlineSchema } from '../../server/modules/map/map.router.js';
import { photoFieldsSchema, reportPhotoFieldsSchema } from '../../server/modules/photos/photos.router.js';
import { makeImage } from '../fixtures/images.js';
import type { TestApp } from '../fixtures/test-app.js';

export const DEMO_PASSWORD = 'heelwood-demo';

/** The test files, one per group: tests/integration/bad-input-<group>.test.ts ('main' is bad-input.test.ts). */
export const GROUPS = ['main', 'register', 'exchange', 'rounds', 'uploads'] as const;
export type Group = (typeof GROUPS)[number];
export const groupFile = (g: Group) => (g === 'main' ? 'bad-input.test.ts' : `bad-input-${g}.test.ts`);

export type Method = 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export type Who = 'coordinator' | 'anonymous';

/** Ids from the demo data (and a few rows the setup makes), filled by loadIds and setups. */
export type Ids = Record<string, string>;

/**
 * A JSON body checked with a zod schema. limit is the JSON parser's limit for this route.
 * unique names a top-level text field that must differ between creates (e-mail, code, name):
 * each run gets its own value, so valid bodies get past "already taken" to the insert.
 */
export type JsonBody = { kind: 'json'; schema: ZodType; valid: (ids: Ids) => Record<string, unknown>; limit: number; unique?: { field: string; make: (n: number) => string } };
/** The route reads no body: whatever is sent must be ignored or refused by the parser. */
export type NoBody = { kind: 'none'; why: string };
/** multipart/form-data with one file in `photo` and text fields checked by `fields`. */
export type MultipartBody = { kind: 'multipart'; fields: ZodType | null; writes: boolean };
/** The plant CSV import: text/csv or JSON { csv }. */
export type CsvBody = { kind: 'csv' };

export type WriteRoute = {
  method: Method;
  /** As Express has it, prefix and route joined: /api/seasons/:seasonId/offers/:plantId */
  path: string;
  group: Group;
  caller: Who;
  params?: (ids: Ids) => Record<string, string>;
  query?: string;
  body: JsonBody | NoBody | MultipartBody | CsvBody;
  /** Runs for this route as a share of HEELWOOD_FUZZ_RUNS (1 unless the report says why). */
  runShare?: number;
  /** Rows or state this route needs before the fuzz; runs once in the group's beforeAll. */
  setup?: (fx: SetupContext) => Promise<void>;
};

export type SetupContext = {
  app: TestApp;
  ids: Ids;
  /** JSON request as the coordinator; throws unless the answer is 2xx. */
  coordinator(method: Method, path: string, body?: unknown): Promise<any>;
  /** multipart upload as the coordinator. */
  upload(path: string, file: Buffer): Promise<any>;
};

const API_JSON_LIMIT = 1024 * 1024; // express.json({ limit: '1mb' }) in server/app.ts
const AUTH_JSON_LIMIT = 32 * 1024; // express.json({ limit: '32kb' }) in server/auth/auth.router.ts

const json = (schema: ZodType, valid: (ids: Ids) => Record<string, unknown>, limit = API_JSON_LIMIT, unique?: JsonBody['unique']): JsonBody => ({ kind: 'json', schema, valid, limit, unique });
const none = (why: string): NoBody => ({ kind: 'none', why });

/** better-auth's own endpoints are its business; sign-up and sign-in go through our forms router. */
export const EXCLUDED_PATHS: { path: string; why: string }[] = [
  { path: '/api/auth/*splat', why: "better-auth's internal endpoints (session, sign-out, password reset), every method" },
];

const today = () => new Date().toISOString().slice(0, 10);
const dayBefore = (d: string) => new Date(Date.parse(`${d}T00:00:00Z`) - 864e5).toISOString().slice(0, 10);
const thisYear = () => new Date().getUTCFullYear();

export const ROUTES: WriteRoute[] = [
  // Sign-up and sign-in: anyone may call them.
  {
    method: 'POST',
    path: '/api/auth/sign-up/email',
    group: 'main',
    caller: 'anonymous',
    body: json(signUpSchema, () => ({ name: 'Fuzz Grower', email: 'fuzz.grower@example.org', password: 'a long enough password', placeName: 'Kington', application: 'Two rows of currants.' }), AUTH_JSON_LIMIT, {
      field: 'email',
      make: (n) => `fuzz.grower.${n}@example.org`,
    }),
  },
  {
    method: 'POST',
    path: '/api/auth/sign-in/email',
    group: 'main',
    caller: 'anonymous',
    body: json(signInSchema, () => ({ email: 'grower@heelwood.test', password: DEMO_PASSWORD }), AUTH_JSON_LIMIT),
  },
  // Members and farms.
  {
    method: 'PATCH',
    path: '/api/members/:id',
    group: 'main',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.memberId }),
    body: json(memberPatchSchema, () => ({ status: 'active', role: 'member', reason: 'Checked the application' })),
  },
  {
    method: 'PUT',
    path: '/api/farms/:farmId/members/:userId',
    group: 'main',
    caller: 'coordinator',
    params: (ids) => ({ farmId: ids.farmWTH, userId: ids.memberId }),
    body: json(farmMembershipSchema, () => ({ farmRole: 'hand' })),
  },
  {
    method: 'DELETE',
    path: '/api/farms/:farmId/members/:userId',
    group: 'main',
    caller: 'coordinator',
    params: (ids) => ({ farmId: ids.farmARB, userId: ids.arbHandId }),
    body: none('removes a membership; the address says which'),
  },
  {
    method: 'PUT',
    path: '/api/farms/:farmId/outline',
    group: 'main',
    caller: 'coordinator',
    params: (ids) => ({ farmId: ids.farmWTH }),
    body: json(outlineSchema, () => ({
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          properties: { kind: 'outline', label: 'Home field' },
          geometry: { type: 'Polygon', coordinates: [[[-2.7, 52.05], [-2.69, 52.05], [-2.69, 52.06], [-2.7, 52.05]]] },
        },
        { type: 'Feature', properties: { kind: 'row', label: 'Row 1' }, geometry: { type: 'LineString', coordinates: [[-2.699, 52.051], [-2.691, 52.051]] } },
      ],
    })),
  },
  // Species, varieties, pests, district notes, the planner.
  {
    method: 'POST',
    path: '/api/species',
    group: 'register',
    caller: 'coordinator',
    body: json(speciesSchema, () => ({
      scientificName: 'Ribes fuzzense',
      commonName: 'Fuzz currant',
      genus: 'Ribes',
      propagationMethods: ['hardwood'],
      defaultCuttingLengthCm: 20,
      defaultCuttingDiameterMm: 6,
      softTipCm: 10,
      strikeRatePrior: 0.8,
      priorStrength: 20,
      shadeTolerant: false,
      firstCropYears: 3,
      restrictionNote: null,
      notes: 'Made by the bad-input test.',
    }), API_JSON_LIMIT, { field: 'scientificName', make: (n) => `Ribes fuzzense ${n}` }),
  },
  {
    method: 'PATCH',
    path: '/api/species/:id',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.speciesQuince }),
    body: json(speciesPatchSchema, () => ({ notes: 'Edited by the bad-input test.', firstCropYears: 4 })),
  },
  {
    method: 'POST',
    path: '/api/species/varieties',
    group: 'register',
    caller: 'coordinator',
    body: json(varietySchema, (ids) => ({ speciesId: ids.speciesQuince, name: 'Fuzz Quince', description: 'Made by the bad-input test.' }), API_JSON_LIMIT, {
      field: 'name',
      make: (n) => `Fuzz Quince ${n}`,
    }),
  },
  {
    method: 'PATCH',
    path: '/api/species/varieties/:id',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.varietyId }),
    body: json(varietyPatchSchema, () => ({ description: 'Edited by the bad-input test.' })),
  },
  {
    method: 'POST',
    path: '/api/pests',
    group: 'register',
    caller: 'coordinator',
    body: json(pestSchema, () => ({ code: 'fuzz-mite', name: 'Fuzz mite', scientificName: null, kind: 'pest', travelsInWood: false, genera: ['Ribes'], signs: 'Small holes.', advice: 'Watch.', source: '' }), API_JSON_LIMIT, {
      field: 'code',
      make: (n) => `fuzz-mite-${n}`,
    }),
  },
  {
    method: 'POST',
    path: '/api/health/notes',
    group: 'register',
    caller: 'coordinator',
    body: json(districtNoteSchema, () => ({ body: 'Aphids on the currants along the lane.', notedOn: dayBefore(today()), lat: 52.06, lon: -2.7 })),
  },
  {
    method: 'POST',
    path: '/api/planner/estimate',
    group: 'register',
    caller: 'coordinator',
    body: json(plannerEstimateSchema, (ids) => ({ lengthM: 20, spacingM: 0.5, rows: 2, cuttingsPerPosition: 2, speciesId: ids.speciesBlackcurrant, treatment: 'none', target: { rooted: 50, confidence: 0.9 } })),
  },
  // Mother plants.
  {
    method: 'POST',
    path: '/api/mother-plants',
    group: 'register',
    caller: 'coordinator',
    body: json(plantCreateSchema, (ids) => ({
      farmId: ids.farmWTH,
      speciesId: ids.speciesBlackcurrant,
      varietyId: null,
      plantingYear: 2020,
      role: 'stock_bed',
      provenance: 'bought',
      supplier: 'Tanhouse',
      lat: 52.05,
      lon: -2.7,
      bedRow: 'Bed 3',
      notes: 'Made by the bad-input test.',
    })),
  },
  {
    method: 'PATCH',
    path: '/api/mother-plants/:id',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantEdit }),
    body: json(plantUpdateSchema, () => ({ notes: 'Edited by the bad-input test.', bedRow: 'Bed 4', lat: 52.051, lon: -2.701, reason: 'Moved the label' })),
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/retire',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantRetire }),
    body: json(retireSchema, () => ({ reason: 'Grubbed out by the bad-input test' })),
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/lift-hold',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantHold }),
    body: json(liftHoldSchema, () => ({ to: 'watch', reason: 'Re-inspected by the bad-input test' })),
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/inspections',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantInspect }),
    body: json(inspectionCreateSchema, (ids) => ({ inspectedOn: dayBefore(today()), notes: 'Looked fine.', findings: [{ pestId: ids.pestId, severity: 'minor', notes: 'One leaf' }] })),
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/notices',
    group: 'register',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantExposed }),
    body: json(noticeSchema, () => ({ note: 'Check your currants for swollen buds.' })),
  },
  // Seasons, offers, windows, requests.
  {
    method: 'POST',
    path: '/api/seasons',
    group: 'exchange',
    caller: 'coordinator',
    body: json(seasonCreateSchema, () => ({
      name: 'Fuzz scion season',
      kind: 'scion',
      hemisphere: 'north',
      requestDeadline: `${thisYear() + 2}-01-10T18:00:00Z`,
      collectionStart: `${thisYear() + 2}-01-15`,
      collectionEnd: `${thisYear() + 2}-02-28`,
      lookbackMonths: 12,
      notes: 'Made by the bad-input test.',
    }), API_JSON_LIMIT, { field: 'name', make: (n) => `Fuzz scion season ${n}` }),
  },
  {
    method: 'POST',
    path: '/api/seasons/:id/stage',
    group: 'exchange',
    caller: 'coordinator',
    // A season of its own, so moving it does not close the current one for the other routes.
    setup: async (fx) => {
      const y = thisYear() + 3;
      const s = await fx.coordinator('POST', '/api/seasons', {
        name: 'Stage fuzz season',
        kind: 'leafy_summer',
        hemisphere: 'north',
        requestDeadline: `${y}-06-01T12:00:00Z`,
        collectionStart: `${y}-08-01`,
        collectionEnd: `${y}-09-15`,
      });
      fx.ids.stageSeason = s.id;
    },
    params: (ids) => ({ id: ids.stageSeason }),
    body: json(seasonStageSchema, () => ({ stage: 'requests_open' })),
  },
  {
    method: 'PUT',
    path: '/api/seasons/:seasonId/offers/:plantId',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ seasonId: ids.season, plantId: ids.offerPlant }),
    body: json(offerInputSchema, () => ({ shootCount: 20, meanShootLengthCm: 60, directCount: null, offered: 10 })),
  },
  {
    method: 'DELETE',
    path: '/api/seasons/:seasonId/offers/:plantId',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ seasonId: ids.season, plantId: ids.withdrawPlant }),
    body: none('withdraws the offer the address names'),
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/farms/:farmId/windows',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ seasonId: ids.season, farmId: ids.farmWTH }),
    body: json(pickupWindowSchema, (ids) => ({ date: ids.seasonCollectionStart, from: '09:30', to: '12:00', note: 'Ring the bell.' })),
  },
  {
    method: 'DELETE',
    path: '/api/windows/:windowId',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ windowId: ids.windowId }),
    body: none('removes the window the address names'),
  },
  {
    method: 'PUT',
    path: '/api/seasons/:seasonId/my-request',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ seasonId: ids.season }),
    body: json(woodRequestSchema, (ids) => ({
      destinationLat: 52.06,
      destinationLon: -2.71,
      destinationLabel: 'Home',
      maxDistanceKm: 30,
      notes: 'For a hedge.',
      status: 'filed',
      lines: [{ speciesId: ids.speciesBlackcurrant, varietyId: null, cuttings: 20, substitutesAllowed: true, treatment: 'none', plan: { rows: 1, lengthM: 10 } }],
    })),
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/my-request/withdraw',
    group: 'exchange',
    caller: 'coordinator',
    params: (ids) => ({ seasonId: ids.season }),
    body: none("withdraws the caller's request"),
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/rounds',
    group: 'exchange',
    caller: 'coordinator',
    // The current season takes requests, so a round is refused (409) whatever is sent: a
    // round that solved on every run would measure HiGHS, not input handling.
    params: (ids) => ({ seasonId: ids.season }),
    body: none('starts a round for the season in the address'),
  },
  // Allocation rounds and bundles: a proposed round of the current season, made in setup.
  {
    method: 'PATCH',
    path: '/api/rounds/:roundId/bundles/:bundleId',
    group: 'rounds',
    caller: 'coordinator',
    setup: proposedRound,
    params: (ids) => ({ roundId: ids.proposedRound, bundleId: ids.proposedBundle }),
    body: json(bundleEditSchema, () => ({ cuttings: 3 })),
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/bundles',
    group: 'rounds',
    caller: 'coordinator',
    setup: proposedRound,
    params: (ids) => ({ roundId: ids.proposedRound }),
    body: json(bundleAddSchema, (ids) => ({ offerId: ids.proposedOffer, lineId: ids.proposedLine, cuttings: 1 })),
  },
  {
    method: 'DELETE',
    path: '/api/rounds/:roundId/bundles/:bundleId',
    group: 'rounds',
    caller: 'coordinator',
    setup: proposedRound,
    params: (ids) => ({ roundId: ids.proposedRound, bundleId: ids.removeBundle }),
    body: none('removes the bundle the address names'),
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/rerun',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ roundId: ids.approvedRound }),
    body: none('re-solves the round in the address (an approved one: refused)'),
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/approve',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ roundId: ids.approvedRound }),
    body: none('approves the round in the address (already approved: refused)'),
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/resend',
    group: 'rounds',
    caller: 'coordinator',
    // The proposed round: nothing to send, so it answers at once. On an approved round each
    // call builds every grower's pickup slip before the e-mail log says they went (about 2 s).
    setup: proposedRound,
    params: (ids) => ({ roundId: ids.proposedRound }),
    body: none('sends the unsent pickup slips of the round in the address'),
  },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/collection',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ bundleId: ids.collectBundle }),
    body: json(collectionSchema, () => ({ collected: true })),
  },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/strike-reports',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ bundleId: ids.reportBundle }),
    body: json(strikeReportCreateSchema, () => ({ stuck: 2, rooted: 1, assessedOn: dayBefore(today()), treatment: 'willow', notes: 'Rooted in a pot.' })),
  },
  {
    method: 'DELETE',
    path: '/api/strike-reports/:id',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.strikeReportId }),
    body: none('removes the report the address names'),
  },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/raise-plants',
    group: 'rounds',
    caller: 'coordinator',
    params: (ids) => ({ bundleId: ids.raiseBundle }),
    body: json(raisePlantsSchema, (ids) => ({ farmId: ids.raiseFarm, count: 1, role: 'stock_bed', plantingYear: thisYear(), bedRow: 'Nursery', notes: 'Raised in the bad-input test.' })),
  },
  // Uploads: photos (multipart) and the plant CSV.
  {
    method: 'POST',
    path: '/api/mother-plants/:id/photos',
    group: 'uploads',
    caller: 'coordinator',
    params: (ids) => ({ id: ids.plantPhoto }),
    body: { kind: 'multipart', fields: photoFieldsSchema, writes: true },
  },
  {
    method: 'POST',
    path: '/api/strike-reports/:id/photos',
    group: 'uploads',
    caller: 'coordinator',
    // Only the reporter may add photos, so the coordinator files the report the fuzz photographs.
    // Once it holds three photos every further upload is refused (409) before its body is read.
    setup: async (fx) => {
      const report = await fx.coordinator('POST', `/api/bundles/${fx.ids.reportBundle}/strike-reports`, { stuck: 2, rooted: 1, assessedOn: dayBefore(today()) });
      fx.ids.photoReport = report.id;
    },
    params: (ids) => ({ id: ids.photoReport }),
    body: { kind: 'multipart', fields: reportPhotoFieldsSchema, writes: true },
  },
  {
    method: 'POST',
    path: '/api/photos/read-gps',
    group: 'uploads',
    caller: 'coordinator',
    body: { kind: 'multipart', fields: null, writes: false },
  },
  {
    method: 'DELETE',
    path: '/api/photos/:id',
    group: 'uploads',
    caller: 'coordinator',
    setup: async (fx) => {
      const photo = await fx.upload(`/api/mother-plants/${fx.ids.plantPhoto}/photos`, await makeImage('jpeg'));
      fx.ids.photoId = photo.photo.id;
    },
    params: (ids) => ({ id: ids.photoId }),
    body: none('removes the photo the address names'),
  },
  {
    method: 'POST',
    path: '/api/mother-plants/import',
    group: 'uploads',
    caller: 'coordinator',
    body: { kind: 'csv' },
  },
];

/** The current season moves to allocating and one round is solved, so bundles can be edited. */
async function proposedRound(fx: SetupContext) {
  if (fx.ids.proposedRound) return;
  await fx.coordinator('POST', `/api/seasons/${fx.ids.season}/stage`, { stage: 'allocating' });
  const round = await fx.coordinator('POST', `/api/seasons/${fx.ids.season}/rounds?wait=true`);
  if (round.status !== 'proposed' || round.bundles.length < 2) throw new Error(`setup: round is ${round.status} with ${round.bundles.length} bundles`);
  fx.ids.proposedRound = round.id;
  fx.ids.proposedBundle = round.bundles[0].id;
  fx.ids.removeBundle = round.bundles[1].id;
  // An offer and a line the round did not pair, for adding a bundle by hand.
  const paired = new Set(round.bundles.map((b: { offerId: string; lineId: string }) => `${b.offerId}/${b.lineId}`));
  const line = round.lines[0].lineId;
  const offer = round.bundles.map((b: { offerId: string }) => b.offerId).find((o: string) => !paired.has(`${o}/${line}`)) ?? round.bundles[0].offerId;
  fx.ids.proposedOffer = offer;
  fx.ids.proposedLine = line;
}

const key = (method: string, path: string) => `${method} ${path}`;
export const routeKey = (r: { method: string; path: string }) => key(r.method, r.path);

type Layer = { rawPath?: string | string[]; route?: { path: string; methods: Record<string, boolean> }; handle: { stack?: Layer[] } };

/** Method and full path of every route the app has, read from Express's router stack. */
export function appRoutes(app: Express): { method: string; path: string }[] {
  const out: { method: string; path: string }[] = [];
  const join = (a: string, b: string) => (a + (b === '/' ? '' : b)).replace(/\/+$/, '') || '/';
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [m, on] of Object.entries(layer.route.methods)) if (on) out.push({ method: m === '_all' ? 'ALL' : m.toUpperCase(), path: join(prefix, layer.route.path) });
      } else if (layer.handle.stack) {
        const raw = layer.rawPath;
        if (typeof raw !== 'string') throw new Error(`a router is mounted on a path the walk cannot read: ${String(raw)}`);
        walk(layer.handle.stack, join(prefix, raw));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out;
}

const WRITE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
export const isApiWrite = (r: { method: string; path: string }) => WRITE.has(r.method) && r.path.startsWith('/api/');

/** Ids from the demo cooperative that the routes above use. */
export async function loadIds(app: TestApp): Promise<Ids> {
  const one = async (query: ReturnType<typeof sql>, what: string): Promise<Record<string, string>> => {
    const { rows } = (await app.ctx.db.execute(query)) as unknown as { rows: Record<string, string>[] };
    if (!rows.length) throw new Error(`demo data has no ${what}`);
    return rows[0];
  };
  const farm = async (code: string) => (await one(sql`select id from farms where code = ${code}`, `farm ${code}`)).id;
  const user = async (email: string) => (await one(sql`select id from "user" where email = ${email}`, email)).id;
  const speciesId = async (name: string) => (await one(sql`select id from species where common_name = ${name}`, name)).id;
  const season = await one(sql`select id, collection_start::text as start from seasons where stage = 'requests_open' order by collection_start desc limit 1`, 'season taking requests');
  const ids: Ids = {
    farmWTH: await farm('WTH'),
    farmARB: await farm('ARB'),
    memberId: await user('mair.lewis@heelwood.test'),
    arbHandId: await user('liam.probert@heelwood.test'),
    speciesQuince: await speciesId('Quince'),
    speciesBlackcurrant: await speciesId('Blackcurrant'),
    season: season.id,
    seasonCollectionStart: season.start,
  };
  ids.varietyId = (await one(sql`select id from varieties where species_id = ${ids.speciesQuince} limit 1`, 'quince variety')).id;
  ids.pestId = (await one(sql`select id from pests where travels_in_wood = false order by code limit 1`, 'pest')).id;
  // Plants of WTH that are clean and not offered this season: one each to edit, retire, inspect, photograph.
  const { rows: clean } = (await app.ctx.db.execute(
    sql`select p.id from mother_plants p where p.farm_id = ${ids.farmWTH} and p.health_status = 'clean'
        and not exists (select 1 from wood_offers o where o.plant_id = p.id) order by p.code limit 4`,
  )) as unknown as { rows: { id: string }[] };
  if (clean.length < 4) throw new Error('demo data: too few clean plants at WTH');
  [ids.plantEdit, ids.plantRetire, ids.plantInspect, ids.plantPhoto] = clean.map((r) => r.id);
  ids.plantHold = (await one(sql`select id from mother_plants where health_status = 'hold' order by code limit 1`, 'plant on hold')).id;
  ids.plantExposed = (
    await one(
      sql`select p.id from mother_plants p join inspections i on i.plant_id = p.id join findings f on f.inspection_id = i.id
          join pests x on x.id = f.pest_id where x.travels_in_wood and p.health_status = 'hold' order by p.code limit 1`,
      'plant with a finding that travels in wood',
    )
  ).id;
  // Offers of the current season with nothing reserved: one to change, one to withdraw.
  const { rows: offers } = (await app.ctx.db.execute(
    sql`select plant_id from wood_offers where season_id = ${ids.season} and reserved = 0 and withdrawn_at is null order by id limit 2`,
  )) as unknown as { rows: { plant_id: string }[] };
  if (offers.length < 2) throw new Error('demo data: too few offers this season');
  [ids.offerPlant, ids.withdrawPlant] = offers.map((r) => r.plant_id);
  ids.windowId = (await one(sql`select id from pickup_windows where season_id = ${ids.season} limit 1`, 'pickup window')).id;
  ids.approvedRound = (await one(sql`select id from allocation_rounds where status = 'approved' order by created_at desc limit 1`, 'approved round')).id;
  // Collected bundles: one to mark, one to report on, one whose grower can raise plants on a farm.
  ids.collectBundle = (await one(sql`select id from bundles where status = 'collected' order by code desc limit 1`, 'collected bundle')).id;
  ids.reportBundle = (
    await one(
      sql`select b.id from bundles b where b.status = 'collected' and b.id <> ${ids.collectBundle}
          and b.cuttings > coalesce((select sum(stuck) from strike_reports r where r.bundle_id = b.id), 0) + 5 order by b.code limit 1`,
      'bundle with cuttings left to report',
    )
  ).id;
  const raise = await one(
    sql`select b.id, m.farm_id from bundles b join farm_memberships m on m.user_id = b.grower_id
        where b.status = 'collected' and b.id not in (${ids.collectBundle}, ${ids.reportBundle})
        and exists (select 1 from strike_reports r where r.bundle_id = b.id and r.rooted > 0) order by b.code limit 1`,
    'bundle of a farm grower with rooted cuttings',
  );
  ids.raiseBundle = raise.id;
  ids.raiseFarm = raise.farm_id;
  ids.strikeReportId = (
    await one(
      sql`select r.id from strike_reports r where r.bundle_id not in (${ids.collectBundle}, ${ids.reportBundle}, ${ids.raiseBundle}) order by r.id limit 1`,
      'strike report',
    )
  ).id;
  return ids;
}
