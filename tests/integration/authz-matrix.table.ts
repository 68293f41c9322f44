// The authorization matrix: every route of the app against every kind of caller, with the
// status each must get. authz-matrix.test.ts walks the Express router and better-auth's
// endpoint list and fails on any route that is neither a row here nor excluded below with a
// reason, so a new route must be added here (with its expected statuses) before the suite passes.
//
// Callers (roles and statuses from shared/domain.ts, guards in server/auth/guards.ts, farm
// rules in server/modules/mother-plants/plant-access.ts). "The farm" is WTH (Wetherstone Farm)
// of the demo cooperative; targets belong to it unless a row says otherwise.
//   anon         no session cookie
//   pending      signed up, not admitted (demo: Chris Hallam, status pending)
//   suspended    signed in as lead of WTH, then suspended by the coordinator, which ends their sessions (still sends the cookie)
//   member       an admitted grower on no farm (demo: Sam Okafor, grower@heelwood.test)
//   otherLead    lead of another farm (demo: Megan Pritchard, lead of ARB)
//   hand         farm hand of WTH (demo: Kasia Nowak)
//   lead         farm lead of WTH (demo: Tom Bevan)
//   coordinator  active coordinator (demo: Ruth Gwillim)
// Expected statuses come from the guards (401 no or suspended session; 403 pending, or not a
// coordinator on requireCoordinator) and the services (403 not of the farm / not the grower;
// 404 for a plant or photo the caller may not see at all, so its existence does not leak).
// Every answer of 400 or more is a refusal: the test checks that the database (every table's
// rows) and the photo folder are unchanged afterwards.

import { makeImage } from '../fixtures/images.js';

export const CALLERS = ['anon', 'pending', 'suspended', 'member', 'otherLead', 'hand', 'lead', 'coordinator'] as const;
export type CallerKind = (typeof CALLERS)[number];
export type Expect = Record<CallerKind, number>;
export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** What one request sends. `session`: 'clone' copies the caller's cookies into a throwaway
 *  client (for calls that replace the session cookie); 'spare' uses a second session of the
 *  same person (for sign-out, which ends the session it is sent with). */
export type Call = {
  params?: Record<string, string>;
  query?: Record<string, string>;
  body?: unknown;
  /** Multipart upload (photos). */
  form?: () => Promise<FormData>;
  session?: 'clone' | 'spare';
};

/** A season with one offer from a fresh clean WTH plant and filed requests, made in the database. */
export type Exchange = {
  seasonId: string;
  plantId: string;
  offerId: string;
  /** The member's filed line, which the bundle (if any) fills. */
  lineId: string;
  /** A second filed line (the lead's), without a bundle. */
  spareLineId: string;
  roundId: string;
  bundleId: string;
};

export type ExchangeOptions = {
  stage: 'allocating' | 'collections';
  /** No round; or a proposed round (one bundle); or an approved round (bundle coded). */
  round: 'none' | 'proposed' | 'approved';
  bundle?: 'reserved' | 'collected';
  /** Who receives the bundle. */
  grower?: 'member' | 'hand';
  /** Add a strike report of this many rooted cuttings (collected bundles). */
  rooted?: number;
};

/** Demo data and fresh targets, built in authz-matrix.test.ts. */
export type Fx = {
  ids: {
    wth: string;
    arb: string;
    /** Demo: the clean WTH plant with the lowest code. */
    plant: string;
    /** Made: a WTH plant on hold, which people of other farms may not see. */
    heldPlant: string;
    /** Made: a clean WTH plant inspected today, so it may give wood. */
    eligiblePlant: string;
    /** Made: a WTH plant with a finding of a pest that travels in wood, and no bundles. */
    travellingPlant: string;
    species: string;
    variety: string;
    /** Demo: the season taking requests now. */
    openSeason: string;
    /** Demo: the most recent closed season and its approved round. */
    closedSeason: string;
    approvedRound: string;
    /** Uploaded: a photo of `plant`, and one attached to a finding on `plant`. */
    photo: string;
    findingPhoto: string;
    /** Uploaded by the member: a photo of a strike report the member filed. */
    reportPhoto: string;
    /** Made: a mailbox message with one attachment. */
    mail: string;
  };
  userId(kind: Exclude<CallerKind, 'anon'>): string;
  /** A short tag unique in this run, for names and codes. */
  tag(): string;
  /** A date inside the open season's collection window. */
  windowDate: string;
  today: string;
  freshPlant(opts?: { status?: 'clean' | 'hold'; farm?: 'wth' | 'arb' }): Promise<string>;
  freshUser(status: 'pending' | 'active'): Promise<string>;
  /** A new active member who is farm hand of WTH. */
  freshWthHand(): Promise<string>;
  freshSeason(stage: 'planning' | 'allocating'): Promise<string>;
  /** An offer (nothing reserved) in the open season from a fresh eligible WTH plant. */
  freshOffer(): Promise<{ seasonId: string; plantId: string }>;
  /** A WTH pickup window in the open season. */
  freshWindow(): Promise<string>;
  freshPhoto(): Promise<string>;
  /** A strike report by the member on a bundle the member collected ('photos': a second such bundle). */
  freshStrikeReport(bundle?: 'reporting' | 'photos'): Promise<string>;
  /** A photo, uploaded by the member, of a fresh strike report of the member's. */
  freshReportPhoto(): Promise<string>;
  /** Makes sure this caller has a filed request in the open season (active people only). */
  ensureRequest(kind: CallerKind): Promise<void>;
  exchange(opts: ExchangeOptions): Promise<Exchange>;
  /** One shared value per key (a target every caller may use without using it up). */
  once<T>(key: string, make: () => Promise<T>): Promise<T>;
};

export type MatrixRow = {
  method: Method;
  /** The Express path pattern, as the router walk prints it. */
  path: string;
  /** What the params point at, when a route has more than one row. */
  target?: string;
  call?: (fx: Fx, caller: CallerKind) => Call | Promise<Call>;
  expect: Expect;
  /** What the answer must say, by status, where the status alone could come from a mistake
   *  in the request (a 400 that is really a refusal). */
  says?: Partial<Record<number, RegExp>>;
  /** The guard or rule behind the expectations. */
  why: string;
};

// Expectation shapes ----------------------------------------------------------------------

const everyone = (s: number): Expect => ({ anon: s, pending: s, suspended: s, member: s, otherLead: s, hand: s, lead: s, coordinator: s });
/** requireUser: any signed-in person who is not suspended. */
const signedIn = (s: number): Expect => ({ ...everyone(s), anon: 401, suspended: 401 });
/** requireActive: admitted members and coordinators. */
const admitted = (s: number): Expect => ({ ...signedIn(s), pending: 403 });
/** requireCoordinator. */
const coordinatorOnly = (s: number): Expect => ({ ...admitted(403), coordinator: s });
/** The people of the farm (lead or hand) or a coordinator. */
const farmPeople = (s: number): Expect => ({ ...admitted(403), hand: s, lead: s, coordinator: s });
/** The farm's lead or a coordinator. */
const farmLead = (s: number): Expect => ({ ...farmPeople(s), hand: 403 });
/** A plant the caller may not see at all answers 404, not 403. */
const hiddenFromOthers = (e: Expect): Expect => ({ ...e, member: 404, otherLead: 404 });

const outline = {
  type: 'FeatureCollection',
  features: [
    {
      type: 'Feature',
      properties: { kind: 'outline', label: 'Matrix field' },
      geometry: {
        type: 'Polygon',
        coordinates: [
          [
            [-2.506, 51.992],
            [-2.504, 51.992],
            [-2.504, 51.994],
            [-2.506, 51.994],
            [-2.506, 51.992],
          ],
        ],
      },
    },
  ],
};

const offerBody = { directCount: 40, offered: 10 };
const requestBody = (fx: Fx) => ({
  destinationLat: 51.99,
  destinationLon: -2.5,
  maxDistanceKm: 30,
  lines: [{ speciesId: fx.ids.species, cuttings: 5 }],
});

// The matrix --------------------------------------------------------------------------------

export const MATRIX: MatrixRow[] = [
  // Public --------------------------------------------------------------------------------
  { method: 'GET', path: '/api/health', expect: everyone(200), why: 'liveness probe, no guard' },
  { method: 'GET', path: '/api/cooperative', expect: everyone(200), why: 'public: the sign-in page shows whose Heelwood it is' },
  { method: 'GET', path: '/tiles/meta.json', expect: everyone(200), why: 'the offline basemap is public (no member data)' },
  { method: 'GET', path: '/tiles/:z/:x/:y.png', call: () => ({ params: { z: '0', x: '0', y: '0' } }), expect: everyone(200), why: 'the offline basemap is public (no member data)' },

  // Sign-in (forms wrapper and better-auth) -------------------------------------------------
  {
    method: 'POST',
    path: '/api/auth/sign-up/email',
    call: (fx) => ({ session: 'clone', body: { name: 'Matrix Applicant', email: `applicant-${fx.tag()}@example.org`, password: 'correct horse battery' } }),
    expect: everyone(200),
    why: 'anyone may apply; the account starts pending (foundation.test.ts)',
  },
  {
    method: 'POST',
    path: '/api/auth/sign-in/email',
    call: () => ({ session: 'clone', body: { email: 'grower@heelwood.test', password: 'heelwood-demo' } }),
    expect: everyone(200),
    why: 'anyone may sign in with good credentials (suspended accounts are refused at session creation)',
  },
  { method: 'GET', path: '/api/auth/get-session', expect: everyone(200), why: 'better-auth: the session or null; never an error' },
  {
    method: 'POST',
    path: '/api/auth/sign-out',
    call: () => ({ session: 'spare', body: {} }),
    expect: everyone(200),
    why: 'better-auth: ends the session sent, if any',
  },
  {
    method: 'POST',
    path: '/api/auth/update-user',
    target: 'admitting oneself',
    call: () => ({ body: { status: 'active' } }),
    expect: { ...everyone(400), anon: 401 },
    says: { 400: /FIELD_NOT_ALLOWED/ },
    why: 'status is input: false in server/auth/auth.ts: nobody admits or reinstates themselves',
  },
  {
    method: 'POST',
    path: '/api/auth/update-user',
    target: 'making oneself coordinator',
    call: () => ({ body: { role: 'coordinator' } }),
    expect: { ...everyone(400), anon: 401 },
    says: { 400: /FIELD_NOT_ALLOWED/ },
    why: 'role is input: false in server/auth/auth.ts: nobody promotes themselves',
  },
  {
    method: 'POST',
    path: '/api/auth/delete-user',
    call: () => ({ body: {} }),
    expect: { ...everyone(404), anon: 401, suspended: 401 },
    why: 'account deletion is not enabled (better-auth answers 404): members are suspended, never deleted; a suspension ended the session (members.service.ts)',
  },
  {
    method: 'POST',
    path: '/api/auth/change-email',
    call: (fx) => ({ body: { newEmail: `moved-${fx.tag()}@example.org` } }),
    expect: { ...everyone(400), anon: 401, suspended: 401 },
    says: { 400: /CHANGE_EMAIL_DISABLED/ },
    why: 'changing the e-mail is not enabled; a suspension ended the session (members.service.ts)',
  },

  // Members and farms -----------------------------------------------------------------------
  { method: 'GET', path: '/api/me', expect: signedIn(200), why: 'requireUser: pending applicants see their own status' },
  { method: 'GET', path: '/api/members', expect: coordinatorOnly(200), why: 'requireCoordinator on the members router' },
  {
    method: 'PATCH',
    path: '/api/members/:id',
    target: 'admitting a fresh applicant',
    call: async (fx) => ({ params: { id: await fx.freshUser('pending') }, body: { status: 'active', reason: 'matrix' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator: only a coordinator admits, suspends or re-roles',
  },
  { method: 'GET', path: '/api/farms', expect: admitted(200), why: 'requireActive' },
  {
    method: 'PUT',
    path: '/api/farms/:farmId/members/:userId',
    target: 'making a fresh member hand of WTH',
    call: async (fx) => ({ params: { farmId: fx.ids.wth, userId: await fx.freshUser('active') }, body: { farmRole: 'hand' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator: a farm lead does not staff the farm',
  },
  {
    method: 'DELETE',
    path: '/api/farms/:farmId/members/:userId',
    target: 'a fresh hand of WTH',
    call: async (fx) => ({ params: { farmId: fx.ids.wth, userId: await fx.freshWthHand() } }),
    expect: coordinatorOnly(204),
    why: 'requireCoordinator',
  },

  // Mail ------------------------------------------------------------------------------------
  { method: 'GET', path: '/api/mail/status', expect: coordinatorOnly(200), why: 'requireCoordinator on the mail router' },
  { method: 'GET', path: '/api/mail', expect: coordinatorOnly(200), why: 'requireCoordinator: the mailbox holds every member\'s mail' },
  {
    method: 'GET',
    path: '/api/mail/:id/attachments/:index',
    call: (fx) => ({ params: { id: fx.ids.mail, index: '0' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },

  // Species and varieties -------------------------------------------------------------------
  { method: 'GET', path: '/api/species', expect: admitted(200), why: 'requireActive' },
  {
    method: 'POST',
    path: '/api/species',
    call: (fx) => {
      const t = fx.tag();
      return {
        body: {
          scientificName: `Ribes matrix${t}`,
          commonName: `Matrix currant ${t}`,
          genus: 'Ribes',
          propagationMethods: ['hardwood'],
          defaultCuttingLengthCm: 20,
          defaultCuttingDiameterMm: 7,
          strikeRatePrior: 0.7,
        },
      };
    },
    expect: coordinatorOnly(201),
    why: 'requireCoordinator: the coordinator keeps the species list',
  },
  {
    method: 'PATCH',
    path: '/api/species/:id',
    call: (fx) => ({ params: { id: fx.ids.species }, body: { notes: `Checked by the matrix ${fx.tag()}` } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/species/varieties',
    call: (fx) => ({ body: { speciesId: fx.ids.species, name: `Matrix ${fx.tag()}` } }),
    expect: coordinatorOnly(201),
    why: 'requireCoordinator',
  },
  {
    method: 'PATCH',
    path: '/api/species/varieties/:id',
    call: (fx) => ({ params: { id: fx.ids.variety }, body: { description: `Checked by the matrix ${fx.tag()}` } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },

  // Register: mother plants -----------------------------------------------------------------
  {
    method: 'POST',
    path: '/api/mother-plants/:id/inspections',
    target: 'clean plant of WTH',
    call: (fx) => ({ params: { id: fx.ids.plant }, body: { inspectedOn: fx.today, notes: 'Matrix: clean.' } }),
    expect: farmPeople(201),
    why: 'mayInspect: the people of the farm or a coordinator; a clean plant is visible to all, so 403',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/inspections',
    target: 'plant on hold at WTH',
    call: (fx) => ({ params: { id: fx.ids.heldPlant }, body: { inspectedOn: fx.today, notes: 'Matrix: still on hold.' } }),
    expect: hiddenFromOthers(farmPeople(201)),
    why: 'visiblePlant: a non-clean plant of another farm is not found',
  },
  { method: 'GET', path: '/api/mother-plants/export.csv', expect: admitted(200), why: 'requireActive; rows are trimmed by plant visibility' },
  {
    method: 'POST',
    path: '/api/mother-plants/import',
    target: 'one WTH row',
    call: () => ({ body: { csv: 'farm,species,planting_year,role,provenance\nWTH,Blackcurrant,2020,stock_bed,bought\n' } }),
    expect: { ...farmPeople(201), member: 400, otherLead: 400 },
    says: { 400: /You may not add plants to farm WTH/ },
    why: 'mayEdit per row: a row for a farm that is not yours fails the file (400 with the report), nothing written',
  },
  { method: 'GET', path: '/api/mother-plants', expect: admitted(200), why: 'requireActive; list filtered by visibility' },
  {
    method: 'POST',
    path: '/api/mother-plants',
    target: 'a plant on WTH',
    call: (fx) => ({ body: { farmId: fx.ids.wth, speciesId: fx.ids.species, plantingYear: 2020, role: 'stock_bed', provenance: 'bought' } }),
    expect: farmPeople(201),
    why: 'mayEdit: only the farm\'s people or a coordinator add plants to it',
  },
  {
    method: 'GET',
    path: '/api/mother-plants/:id',
    target: 'clean plant of WTH',
    call: (fx) => ({ params: { id: fx.ids.plant } }),
    expect: admitted(200),
    why: 'clean plants are shown to every member (trimmed for other farms)',
  },
  {
    method: 'GET',
    path: '/api/mother-plants/:id',
    target: 'plant on hold at WTH',
    call: (fx) => ({ params: { id: fx.ids.heldPlant } }),
    expect: hiddenFromOthers(admitted(200)),
    why: 'visiblePlant: a non-clean plant of another farm is not found',
  },
  {
    method: 'PATCH',
    path: '/api/mother-plants/:id',
    target: 'clean plant of WTH',
    call: (fx) => ({ params: { id: fx.ids.plant }, body: { notes: `Matrix note ${fx.tag()}` } }),
    expect: farmPeople(200),
    why: 'mayEdit: lead and hand keep their farm\'s register',
  },
  {
    method: 'PATCH',
    path: '/api/mother-plants/:id',
    target: 'plant on hold at WTH',
    call: (fx) => ({ params: { id: fx.ids.heldPlant }, body: { notes: `Matrix note ${fx.tag()}` } }),
    expect: hiddenFromOthers(farmPeople(200)),
    why: 'editPlant: not found for whoever may not see it',
  },
  {
    method: 'PATCH',
    path: '/api/mother-plants/:id',
    target: 'moving a fresh WTH plant to ARB',
    call: async (fx) => ({ params: { id: await fx.freshPlant() }, body: { farmId: fx.ids.arb, reason: 'Matrix transfer' } }),
    expect: { ...farmPeople(403), coordinator: 200 },
    why: 'editPlant: only a coordinator moves a plant to another farm',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/retire',
    target: 'a fresh clean WTH plant',
    call: async (fx) => ({ params: { id: await fx.freshPlant() }, body: { reason: 'Matrix: grubbed out' } }),
    expect: farmLead(200),
    why: 'mayRetire: the farm lead or a coordinator',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/retire',
    target: 'a fresh WTH plant on hold',
    call: async (fx) => ({ params: { id: await fx.freshPlant({ status: 'hold' }) }, body: { reason: 'Matrix: grubbed out' } }),
    expect: hiddenFromOthers(farmLead(200)),
    why: 'retirePlant: not found for whoever may not see the plant, like the other plant routes',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/lift-hold',
    target: 'a fresh WTH plant on hold',
    call: async (fx) => ({ params: { id: await fx.freshPlant({ status: 'hold' }) }, body: { to: 'watch', reason: 'Matrix: cleared' } }),
    expect: { ...farmPeople(403), coordinator: 200 },
    why: 'liftHold: only a coordinator lifts a hold (refused before the plant is looked up)',
  },

  // Health ------------------------------------------------------------------------------------
  { method: 'GET', path: '/api/pests', expect: admitted(200), why: 'requireActive' },
  {
    method: 'POST',
    path: '/api/pests',
    call: (fx) => ({ body: { code: `matrix-${fx.tag()}`, name: 'Matrix mite', kind: 'pest', travelsInWood: false } }),
    expect: coordinatorOnly(201),
    why: 'requireCoordinator: the coordinator keeps the catalogue',
  },
  { method: 'GET', path: '/api/health/overview', expect: coordinatorOnly(200), why: 'requireCoordinator' },
  {
    method: 'POST',
    path: '/api/health/notes',
    call: (fx) => ({ body: { body: 'Matrix: nothing seen on the lane.', notedOn: fx.today } }),
    expect: admitted(201),
    why: 'requireActive: any member reports what they saw in the district',
  },

  // Photos ------------------------------------------------------------------------------------
  {
    method: 'POST',
    path: '/api/mother-plants/:id/photos',
    target: 'clean plant of WTH',
    call: (fx) => ({ params: { id: fx.ids.plant }, form: photoForm }),
    expect: farmPeople(201),
    why: 'assertMayAddPhoto: the farm\'s people or a coordinator, checked before the upload is read',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/photos',
    target: 'plant on hold at WTH',
    call: (fx) => ({ params: { id: fx.ids.heldPlant }, form: photoForm }),
    expect: hiddenFromOthers(farmPeople(201)),
    why: 'assertMayAddPhoto: visiblePlant first',
  },
  { method: 'POST', path: '/api/photos/read-gps', call: () => ({ form: photoForm }), expect: admitted(200), why: 'requireActive; nothing is kept' },
  {
    method: 'GET',
    path: '/api/photos/:id/image',
    target: 'photo of a clean WTH plant',
    call: (fx) => ({ params: { id: fx.ids.photo } }),
    expect: admitted(200),
    why: 'visiblePhoto: photos of clean plants are shown to every member',
  },
  {
    method: 'GET',
    path: '/api/photos/:id/image',
    target: 'photo of a finding',
    call: (fx) => ({ params: { id: fx.ids.findingPhoto } }),
    expect: hiddenFromOthers(admitted(200)),
    why: 'visiblePhoto: finding photos are part of the farm\'s health record',
  },
  {
    method: 'GET',
    path: '/api/photos/:id/thumb',
    target: 'photo of a clean WTH plant',
    call: (fx) => ({ params: { id: fx.ids.photo } }),
    expect: admitted(200),
    why: 'as the image',
  },
  {
    method: 'GET',
    path: '/api/photos/:id/thumb',
    target: 'photo of a finding',
    call: (fx) => ({ params: { id: fx.ids.findingPhoto } }),
    expect: hiddenFromOthers(admitted(200)),
    why: 'as the image',
  },
  {
    method: 'DELETE',
    path: '/api/photos/:id',
    target: 'a fresh photo of a clean WTH plant',
    call: async (fx) => ({ params: { id: await fx.freshPhoto() } }),
    expect: farmPeople(204),
    why: 'removePhoto: mayEdit',
  },
  {
    method: 'POST',
    path: '/api/strike-reports/:id/photos',
    target: 'a fresh report by the member',
    call: async (fx) => ({ params: { id: await fx.freshStrikeReport('photos') }, form: photoForm }),
    expect: { ...admitted(404), member: 201, coordinator: 403 },
    why: 'assertMayAddReportPhoto: the reporter only, checked before the upload is read; hidden from all but the reporter and coordinators',
  },
  {
    method: 'GET',
    path: '/api/photos/:id/image',
    target: 'photo of a strike report by the member',
    call: (fx) => ({ params: { id: fx.ids.reportPhoto } }),
    expect: { ...admitted(404), member: 200, coordinator: 200 },
    why: 'visiblePhoto: strike-report photos are the reporter\'s and the coordinators\'',
  },
  {
    method: 'GET',
    path: '/api/photos/:id/thumb',
    target: 'photo of a strike report by the member',
    call: (fx) => ({ params: { id: fx.ids.reportPhoto } }),
    expect: { ...admitted(404), member: 200, coordinator: 200 },
    why: 'as the image',
  },
  {
    method: 'DELETE',
    path: '/api/photos/:id',
    target: 'a fresh photo of a strike report by the member',
    call: async (fx) => ({ params: { id: await fx.freshReportPhoto() } }),
    expect: { ...admitted(404), member: 204, coordinator: 403 },
    why: 'removePhoto: the reporter only (a coordinator sees it but removes the whole report instead)',
  },

  // Seasons, offers, windows, requests ---------------------------------------------------------
  { method: 'GET', path: '/api/seasons', expect: admitted(200), why: 'requireActive' },
  {
    method: 'GET',
    path: '/api/seasons/suggest',
    call: () => ({ query: { kind: 'dormant_hardwood' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator: a helper of the season form',
  },
  { method: 'GET', path: '/api/seasons/:id', call: (fx) => ({ params: { id: fx.ids.openSeason } }), expect: admitted(200), why: 'requireActive' },
  {
    method: 'POST',
    path: '/api/seasons',
    call: (fx) => ({
      body: {
        name: `Matrix season ${fx.tag()}`,
        kind: 'scion',
        hemisphere: 'north',
        requestDeadline: '2099-12-15T18:00:00Z',
        collectionStart: '2100-01-05',
        collectionEnd: '2100-02-28',
      },
    }),
    expect: coordinatorOnly(201),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/seasons/:id/stage',
    target: 'a fresh season in planning',
    call: async (fx) => ({ params: { id: await fx.freshSeason('planning') }, body: { stage: 'requests_open' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/farms/:farmId/offers',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason, farmId: fx.ids.wth } }),
    expect: farmPeople(200),
    why: 'assertFarmWorker: a farm\'s offer sheet is its own people\'s',
  },
  {
    method: 'PUT',
    path: '/api/seasons/:seasonId/offers/:plantId',
    target: 'eligible WTH plant, open season',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason, plantId: fx.ids.eligiblePlant }, body: offerBody }),
    expect: farmPeople(200),
    why: 'assertFarmWorker on the plant\'s farm',
  },
  {
    method: 'PUT',
    path: '/api/seasons/:seasonId/offers/:plantId',
    target: 'the WTH plant on hold',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason, plantId: fx.ids.heldPlant }, body: offerBody }),
    expect: hiddenFromOthers(farmPeople(400)),
    why: 'setOffer: a plant the caller may not see is not found; its own farm is told wood comes only from clean plants',
  },
  {
    method: 'DELETE',
    path: '/api/seasons/:seasonId/offers/:plantId',
    target: 'a fresh offer of WTH',
    call: async (fx) => ({ params: await fx.freshOffer() }),
    expect: farmPeople(204),
    why: 'assertFarmWorker on the offer\'s farm',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/windows',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason } }),
    expect: admitted(200),
    why: 'requireActive: growers choose when to collect',
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/farms/:farmId/windows',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason, farmId: fx.ids.wth }, body: { date: fx.windowDate, from: '09:00', to: '11:00', note: 'Matrix' } }),
    expect: farmLead(201),
    why: 'assertFarmWorker(leadOnly): the farm lead or a coordinator sets pickup windows',
  },
  {
    method: 'DELETE',
    path: '/api/windows/:windowId',
    target: 'a fresh WTH window',
    call: async (fx) => ({ params: { windowId: await fx.freshWindow() } }),
    expect: farmLead(204),
    why: 'assertFarmWorker(leadOnly)',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/my-request',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason } }),
    expect: admitted(200),
    why: 'requireActive; the caller\'s own request only',
  },
  {
    method: 'PUT',
    path: '/api/seasons/:seasonId/my-request',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason }, body: requestBody(fx) }),
    expect: admitted(200),
    why: 'requireActive; writes the caller\'s own request only',
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/my-request/withdraw',
    call: async (fx, caller) => {
      await fx.ensureRequest(caller);
      return { params: { seasonId: fx.ids.openSeason } };
    },
    expect: admitted(200),
    why: 'requireActive; withdraws the caller\'s own request only',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/requests',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator: everyone\'s requests',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/board',
    call: (fx) => ({ params: { seasonId: fx.ids.openSeason } }),
    expect: admitted(200),
    why: 'requireActive: totals by variety, no names',
  },
  {
    method: 'POST',
    path: '/api/planner/estimate',
    call: () => ({ body: { lengthM: 20, spacingM: 1, rows: 1, strikeRate: 0.7 } }),
    expect: admitted(200),
    why: 'requireActive; computes only',
  },

  // Allocation rounds (coordinator) -----------------------------------------------------------
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/rounds',
    call: (fx) => ({ params: { seasonId: fx.ids.closedSeason } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/seasons/:seasonId/rounds',
    target: 'a fresh allocating season',
    call: async (fx) => ({ params: { seasonId: (await fx.exchange({ stage: 'allocating', round: 'none' })).seasonId }, query: { wait: 'true' } }),
    expect: coordinatorOnly(202),
    why: 'requireCoordinator',
  },
  { method: 'GET', path: '/api/rounds/:roundId', call: (fx) => ({ params: { roundId: fx.ids.approvedRound } }), expect: coordinatorOnly(200), why: 'requireCoordinator' },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/rerun',
    target: 'a fresh proposed round',
    call: async (fx) => ({ params: { roundId: (await fx.exchange({ stage: 'allocating', round: 'proposed' })).roundId }, query: { wait: 'true' } }),
    expect: coordinatorOnly(202),
    why: 'requireCoordinator',
  },
  {
    method: 'PATCH',
    path: '/api/rounds/:roundId/bundles/:bundleId',
    target: 'a fresh proposed round',
    call: async (fx) => {
      const x = await fx.exchange({ stage: 'allocating', round: 'proposed' });
      return { params: { roundId: x.roundId, bundleId: x.bundleId }, body: { cuttings: 3 } };
    },
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/bundles',
    target: 'a fresh proposed round',
    call: async (fx) => {
      const x = await fx.exchange({ stage: 'allocating', round: 'proposed' });
      return { params: { roundId: x.roundId }, body: { offerId: x.offerId, lineId: x.spareLineId, cuttings: 2 } };
    },
    expect: coordinatorOnly(201),
    why: 'requireCoordinator',
  },
  {
    method: 'DELETE',
    path: '/api/rounds/:roundId/bundles/:bundleId',
    target: 'a fresh proposed round',
    call: async (fx) => {
      const x = await fx.exchange({ stage: 'allocating', round: 'proposed' });
      return { params: { roundId: x.roundId, bundleId: x.bundleId } };
    },
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/approve',
    target: 'a fresh proposed round',
    call: async (fx) => ({ params: { roundId: (await fx.exchange({ stage: 'allocating', round: 'proposed' })).roundId } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },
  {
    method: 'POST',
    path: '/api/rounds/:roundId/resend',
    target: 'a fresh approved round',
    call: async (fx) => ({ params: { roundId: (await fx.exchange({ stage: 'collections', round: 'approved' })).roundId } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },

  // Bundles, pickups, collections ----------------------------------------------------------------
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/my-pickups',
    call: (fx) => ({ params: { seasonId: fx.ids.closedSeason } }),
    expect: admitted(200),
    why: 'requireActive; the caller\'s own bundles only',
  },
  {
    method: 'GET',
    path: '/api/seasons/:seasonId/farms/:farmId/collections',
    call: (fx) => ({ params: { seasonId: fx.ids.closedSeason, farmId: fx.ids.wth } }),
    expect: farmPeople(200),
    why: 'the farm\'s people or a coordinator see its collections',
  },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/collection',
    target: 'an approved WTH bundle',
    call: async (fx) => ({
      params: { bundleId: (await fx.once('collection', () => fx.exchange({ stage: 'collections', round: 'approved' }))).bundleId },
      body: { collected: true },
    }),
    expect: farmPeople(200),
    why: 'the farm\'s people or a coordinator mark collections',
  },
  { method: 'GET', path: '/api/my/bundles', expect: admitted(200), why: 'requireActive; the caller\'s own bundles only' },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/strike-reports',
    target: 'a bundle the member collected',
    call: async (fx) => ({
      params: { bundleId: (await fx.once('reporting', () => fx.exchange({ stage: 'collections', round: 'approved', bundle: 'collected', grower: 'member' }))).bundleId },
      body: { stuck: 5, rooted: 4, assessedOn: fx.today },
    }),
    expect: { ...admitted(403), member: 201, coordinator: 201 },
    why: 'checkGrowerOrCoordinator: the grower who collected it, or a coordinator',
  },
  {
    method: 'DELETE',
    path: '/api/strike-reports/:id',
    target: 'a fresh report by the member',
    call: async (fx) => ({ params: { id: await fx.freshStrikeReport() } }),
    expect: { ...admitted(403), member: 204, coordinator: 204 },
    why: 'checkGrowerOrCoordinator',
  },
  {
    method: 'POST',
    path: '/api/bundles/:bundleId/raise-plants',
    target: 'a bundle the WTH hand collected',
    call: async (fx) => ({
      params: {
        bundleId: (await fx.once('raising', () => fx.exchange({ stage: 'collections', round: 'approved', bundle: 'collected', grower: 'hand', rooted: 20 }))).bundleId,
      },
      body: { farmId: fx.ids.wth, count: 1, role: 'stock_bed', plantingYear: new Date().getUTCFullYear() },
    }),
    expect: { ...admitted(403), hand: 201, coordinator: 201 },
    why: 'checkGrowerOrCoordinator: the bundle\'s grower (even the farm lead is not), or a coordinator',
  },
  { method: 'GET', path: '/api/strike-rates', expect: admitted(200), why: 'requireActive; pooled figures' },

  // Trace -----------------------------------------------------------------------------------------
  {
    method: 'GET',
    path: '/api/mother-plants/:id/trace',
    target: 'clean plant of WTH',
    call: (fx) => ({ params: { id: fx.ids.plant } }),
    expect: admitted(200),
    why: 'visiblePlant; the lineage is trimmed for others',
  },
  {
    method: 'GET',
    path: '/api/mother-plants/:id/trace',
    target: 'plant on hold at WTH',
    call: (fx) => ({ params: { id: fx.ids.heldPlant } }),
    expect: hiddenFromOthers(admitted(200)),
    why: 'visiblePlant',
  },
  {
    method: 'GET',
    path: '/api/mother-plants/:id/exposure',
    call: (fx) => ({ params: { id: fx.ids.travellingPlant } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator: names every grower who received the wood',
  },
  {
    method: 'POST',
    path: '/api/mother-plants/:id/notices',
    call: (fx) => ({ params: { id: fx.ids.travellingPlant }, body: { note: 'Matrix' } }),
    expect: coordinatorOnly(200),
    why: 'requireCoordinator',
  },

  // Figures and map ---------------------------------------------------------------------------------
  { method: 'GET', path: '/api/seasons/:id/figures', call: (fx) => ({ params: { id: fx.ids.closedSeason } }), expect: admitted(200), why: 'requireActive; scoped to the caller' },
  { method: 'GET', path: '/api/seasons/:id/figures.csv', call: (fx) => ({ params: { id: fx.ids.closedSeason } }), expect: admitted(200), why: 'requireActive; scoped to the caller' },
  { method: 'GET', path: '/api/map/features', expect: admitted(200), why: 'requireActive; plants trimmed by visibility' },
  {
    method: 'PUT',
    path: '/api/farms/:farmId/outline',
    call: (fx) => ({ params: { farmId: fx.ids.wth }, body: outline }),
    expect: farmLead(200),
    why: 'mayDrawOutline: the farm lead or a coordinator, checked before the body',
  },
];

async function photoForm(): Promise<FormData> {
  const form = new FormData();
  form.append('photo', new Blob([new Uint8Array(await makeImage('jpeg'))], { type: 'image/jpeg' }), 'leaf.jpg');
  return form;
}

/** Routes of the Express app that are not API routes, or are checked another way. */
export const EXCLUDED_ROUTES: Record<string, string> = {
  'ALL /api/auth/*splat': 'better-auth\'s own handler: its endpoints are listed from auth.api and checked one by one (below)',
  'GET /{*splat}': 'the client\'s pages (index.html): no data, every page fetches through the API',
};

/** better-auth endpoints without a row, by path, with the reason. */
export const EXCLUDED_AUTH_ENDPOINTS: Record<string, string> = {
  '/sign-in/social': 'no social providers are configured',
  '/callback/:id': 'OAuth callback: no social providers are configured',
  '/link-social': 'no social providers are configured',
  '/unlink-account': 'acts on the caller\'s own linked accounts; only e-mail and password exist',
  '/list-accounts': 'the caller\'s own accounts only',
  '/account-info': 'OAuth provider info for the caller\'s own account; no providers',
  '/refresh-token': 'OAuth tokens; no providers',
  '/get-access-token': 'OAuth tokens; no providers',
  '/reset-password': 'needs the token from the reset e-mail (foundation.test.ts covers reset)',
  '/reset-password/:token': 'the link in the reset e-mail; redirects only',
  '/request-password-reset': 'open to anyone by design; answers the same for known and unknown e-mails (foundation.test.ts)',
  '/verify-password': 'checks the caller\'s own password',
  '/verify-email': 'e-mail verification is not used (admission is by a coordinator)',
  '/send-verification-email': 'e-mail verification is not used (admission is by a coordinator)',
  '/change-password': 'the caller\'s own password, and needs the current one',
  '/update-session': 'the caller\'s own session; no additional session fields exist',
  '/list-sessions': 'the caller\'s own sessions only',
  '/revoke-session': 'the caller\'s own sessions only',
  '/revoke-sessions': 'the caller\'s own sessions only',
  '/revoke-other-sessions': 'the caller\'s own sessions only',
  '/delete-user/callback': 'account deletion is not enabled (see the delete-user row)',
  '/ok': 'better-auth\'s liveness answer',
  '/error': 'better-auth\'s error page',
};
