// The bad-input fuzz: generated bodies for every write route (see bad-input.routes.ts), sent
// by a caller who is allowed to use the route, so the validation path runs, not the guard.
//
// For every request: never a 5xx. A refusal (4xx) is in the API's one error shape
// { error: { code, message, fields? } } and writes nothing: no row of any table added,
// removed or changed (see the ledger below), no photo file left behind. A body the route's
// zod schema refuses is answered 400 with `fields` naming only paths that really are wrong,
// and a database constraint is never reported without its field. Accepted bodies (2xx) are
// fine: they were valid; the ledger checks their writes add up to the real row counts.
// Multipart (photos) and CSV routes run the same 1,000 times: fast enough here.
//
// HEELWOOD_FUZZ_RUNS (default 1000, the issue's figure) sets the runs per route and
// HEELWOOD_FUZZ_SEED (default below) the seed; a failure prints both, and fast-check's own
// seed and path, so it can be replayed.
import { readdirSync } from 'node:fs';
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import { PLANT_CSV_COLUMNS } from '../../shared/schemas/plants-csv.js';
import { photosDir } from '../../server/modules/photos/photos.service.js';
import { makeImage } from '../fixtures/images.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';
import {
  DEMO_PASSWORD,
  loadIds,
  ROUTES,
  routeKey,
  type CsvBody,
  type Group,
  type Ids,
  type JsonBody,
  type Method,
  type MultipartBody,
  type NoBody,
  type WriteRoute,
} from './bad-input.routes.js';

export const FUZZ_RUNS = Number(process.env.HEELWOOD_FUZZ_RUNS ?? 1000);
export const FUZZ_SEED = Number(process.env.HEELWOOD_FUZZ_SEED ?? 20_260_801);

// A caller --------------------------------------------------------------------------------

type Reply = { status: number; text: string; body: any };

/** A person with a cookie jar who can send any bytes with any content type. */
class Caller {
  private cookies = new Map<string, string>();
  constructor(private readonly base: string) {}

  async send(method: string, path: string, body?: string | Uint8Array, contentType?: string): Promise<Reply> {
    const headers: Record<string, string> = { origin: this.base };
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    if (contentType !== undefined) headers['content-type'] = contentType;
    // Sent as bytes, so fetch adds no content type of its own: only the one given, or none.
    const bytes = body === undefined ? undefined : typeof body === 'string' ? Buffer.from(body) : Buffer.from(body.buffer, body.byteOffset, body.byteLength);
    const go = () => fetch(new URL(path, this.base), { method, headers, body: bytes as BodyInit | undefined, redirect: 'manual' });
    // A kept-alive connection the server closed just then resets; once is the socket's doing, twice the server's.
    const res = await go().catch((e: Error & { cause?: { code?: string } }) => {
      if (['ECONNRESET', 'EPIPE', 'UND_ERR_SOCKET'].includes(e.cause?.code ?? '')) return go();
      throw e;
    });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      if (pair.slice(i + 1) === '' || /max-age=0/i.test(c)) this.cookies.delete(pair.slice(0, i));
      else this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
    const text = await res.text();
    let parsed: unknown;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      parsed = undefined;
    }
    return { status: res.status, text, body: parsed };
  }

  async json(method: Method, path: string, body?: unknown): Promise<any> {
    const r = await this.send(method, path, JSON.stringify(body ?? {}), 'application/json');
    if (r.status >= 300) throw new Error(`${method} ${path}: ${r.status} ${r.text.slice(0, 500)}`);
    return r.body;
  }

  async signIn(email: string) {
    await this.json('POST', '/api/auth/sign-in/email', { email, password: DEMO_PASSWORD });
  }
}

// What the database holds -------------------------------------------------------------------
//
// Counting every table with count(*) twice per request costs about 100 ms on PGlite here, more
// than the request. Instead each table gets a row trigger that logs every insert, update and
// delete into fuzz_log, in the same transaction as the change (a rolled-back write logs
// nothing). A refused request must add no log row: no row of any table was added, removed or
// changed. Before and after each route's runs the real row counts of every table are taken
// and must differ by exactly what the log says, which checks the log itself.

type Mark = { lastWrite: number; photoFiles: number };
type Counts = Record<string, number>;

type Ledger = {
  mark(): Promise<Mark>;
  /** What was written after a mark, by table and operation, for a failure message. */
  writesSince(lastWrite: number): Promise<string>;
  /** Real row counts of every table. */
  counts(): Promise<Counts>;
  /** Net rows added per table since a mark, from the log. */
  netSince(lastWrite: number): Promise<Counts>;
};

async function installLedger(app: TestApp, photoFolder: string): Promise<Ledger> {
  const db = app.ctx.db;
  const rowsOf = async <T>(q: ReturnType<typeof sql>) => ((await db.execute(q)) as unknown as { rows: T[] }).rows;
  const tables = (await rowsOf<{ tablename: string }>(sql`select tablename from pg_tables where schemaname = 'public' order by tablename`)).map((r) => r.tablename);
  await db.execute(sql`create table fuzz_log (id bigserial primary key, tbl text not null, op text not null)`);
  await db.execute(
    sql.raw(`create function fuzz_log_row() returns trigger language plpgsql as $$
      begin insert into fuzz_log (tbl, op) values (TG_TABLE_NAME, TG_OP); return null; end $$`),
  );
  for (const t of tables) await db.execute(sql.raw(`create trigger fuzz_log_row after insert or update or delete on "${t}" for each row execute function fuzz_log_row()`));
  const countQuery = sql.raw(`select ${tables.map((t) => `(select count(*)::int from "${t}") as "${t}"`).join(', ')}`);
  const files = () => {
    try {
      return readdirSync(photoFolder, { recursive: true }).length;
    } catch {
      return 0;
    }
  };
  return {
    async mark() {
      const [r] = await rowsOf<{ last: number }>(sql`select coalesce(max(id), 0)::int as last from fuzz_log`);
      return { lastWrite: r.last, photoFiles: files() };
    },
    async writesSince(lastWrite) {
      const rows = await rowsOf<{ tbl: string; op: string; n: number }>(sql`select tbl, op, count(*)::int as n from fuzz_log where id > ${lastWrite} group by 1, 2 order by 1, 2`);
      return rows.map((r) => `${r.op} ${r.tbl} ×${r.n}`).join(', ') || 'no rows';
    },
    async counts() {
      const [r] = await rowsOf<Counts>(countQuery);
      return r;
    },
    async netSince(lastWrite) {
      const rows = await rowsOf<{ tbl: string; n: number }>(
        sql`select tbl, sum(case op when 'INSERT' then 1 when 'DELETE' then -1 else 0 end)::int as n from fuzz_log where id > ${lastWrite} group by 1`,
      );
      return Object.fromEntries(rows.map((r) => [r.tbl, r.n]));
    },
  };
}

// Generators ------------------------------------------------------------------------------

const WEIRD_STRINGS = [
  '',
  ' ',
  '  padded  ',
  '\u0000',
  'nul\u0000inside',
  'NaN',
  'Infinity',
  '-Infinity',
  '1e999',
  '-1',
  '0',
  '1.5',
  '00012',
  '0x1F',
  'true',
  'null',
  'undefined',
  '[]',
  '{}',
  '١٢٣',
  '\u202Ereversed',
  '\uFEFFbom',
  'ｆｕｌｌ　ｗｉｄｔｈ',
  'e\u0301\u0301\u0301',
  '😀🌳🍇',
  'Ꙭ̸̢͎̈́',
  "'; drop table seasons; --",
  '<script>alert(1)</script>',
  '%00',
  '../../etc/passwd',
  'line\r\nbreak',
  '2027-02-30',
  '2027-13-01',
  '2027-00-10',
  '0000-01-01',
  '9999-12-31',
  '+002027-01-01',
  '2027-1-5',
  '2027-01-01T00:00:00',
  '2027-01-01T25:00:00Z',
  '2027-02-30T12:00:00Z',
  '24:00',
  '23:60',
  '9:30',
  '00000000-0000-0000-0000-000000000000',
  'FFFFFFFF-FFFF-4FFF-BFFF-FFFFFFFFFFFF',
  'ffffffff-ffff-ffff-ffff-ffffffffffff',
  'stock_bed ',
  'CLEAN',
  'coordinator',
  'a@b',
  'name@example.org',
];

const junkString = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...WEIRD_STRINGS) },
  { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
  { weight: 2, arbitrary: fc.string({ unit: 'grapheme', maxLength: 40 }) },
  // Text the database cannot hold: a NUL, or half a surrogate pair (JSON carries it as \ud800).
  { weight: 1, arbitrary: fc.tuple(fc.string({ maxLength: 8 }), fc.constantFrom('\u0000', '\ud800', '\udfff'), fc.string({ maxLength: 8 })).map((p) => p.join('')) },
  { weight: 1, arbitrary: fc.uuid().map(String) },
  // Long text: over every field's maximum, and once in a while over the parser's limit.
  { weight: 1, arbitrary: fc.constantFrom(2_001, 4_001, 10_000, 100_000).map((n) => 'x'.repeat(n)) },
  { weight: 1, arbitrary: fc.constantFrom('ä'.repeat(40_000), 'y'.repeat(1_100_000)) },
);

const junkNumber = fc.oneof(
  fc.constantFrom(0, -0, -1, 1, 0.5, -0.5, 1.5, 1e-7, 1e21, 1e308, -1e308, 2 ** 31 - 1, 2 ** 31, -(2 ** 31) - 1, 2 ** 53 - 1, 2 ** 53 + 2, 5e-324, 0.0001, 0.04, 0.9999, 1899, 1900, 2200, 20001, 100_000, 100_001, 1_000.05, 90.0001, 180.5),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

/** Nested a thousand deep: parsers and jsonb columns must cope or refuse. */
const deep = (n: number): unknown => {
  let v: unknown = 'bottom';
  for (let i = 0; i < n; i++) v = i % 2 ? [v] : { k: v };
  return v;
};

const junkValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: junkString },
  { weight: 4, arbitrary: junkNumber },
  { weight: 1, arbitrary: fc.boolean() },
  { weight: 2, arbitrary: fc.constant(null) },
  { weight: 1, arbitrary: fc.constantFrom([], {}, [null], { '': '' }, { __proto__: { admin: true } }, deep(1000)) },
  { weight: 1, arbitrary: fc.array(junkString, { maxLength: 3 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
);

const junkKey = fc.oneof(fc.constantFrom('__proto__', 'constructor', 'prototype', 'id', 'createdBy', 'role', 'status', 'healthStatus', 'reserved', 'x\u0000y', ''), fc.string({ maxLength: 12 }));

type Path = (string | number)[];

/** Every path into a value (not the root), containers included. */
function paths(v: unknown, at: Path = []): Path[] {
  const out: Path[] = [];
  if (Array.isArray(v)) v.forEach((x, i) => out.push([...at, i], ...paths(x, [...at, i])));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) out.push([...at, k], ...paths(x, [...at, k]));
  return out;
}

type Mutation = { path: Path; op: 'set'; value: unknown } | { path: Path; op: 'delete' } | { path: Path; op: 'extra'; key: string; value: unknown };

function mutate(valid: unknown, muts: Mutation[]): unknown {
  const copy = structuredClone(valid) as Record<string | number, unknown>;
  for (const m of muts) {
    const parentPath = m.path.slice(0, -1);
    let parent: any = copy;
    for (const k of parentPath) parent = parent?.[k];
    if (!parent || typeof parent !== 'object') continue;
    const last = m.path[m.path.length - 1];
    // Generated values can be shared constants: copy them, or a later mutation would change (or loop) them.
    if (m.op === 'set') parent[last] = structuredClone(m.value);
    else if (m.op === 'delete') {
      if (Array.isArray(parent)) parent.splice(Number(last), 1);
      else delete parent[last];
    } else {
      const target = parent[last];
      const value = structuredClone(m.value);
      if (target && typeof target === 'object' && !Array.isArray(target)) Object.defineProperty(target, m.key, { value, enumerable: true, writable: true, configurable: true });
      else parent[last] = Object.defineProperty({}, m.key, { value, enumerable: true, writable: true, configurable: true });
    }
  }
  return copy;
}

/** A valid body with one to three things wrong: wrong type, out of range, huge, odd text, null, gone, extra. */
function nearValid(valid: Record<string, unknown>): fc.Arbitrary<unknown> {
  const ps = paths(valid);
  if (!ps.length) return fc.record({ key: junkKey, value: junkValue }).map(({ key, value }) => mutate(valid, [{ path: [], op: 'extra', key, value }]));
  const mutation: fc.Arbitrary<Mutation> = fc.oneof(
    { weight: 6, arbitrary: fc.record({ path: fc.constantFrom(...ps), op: fc.constant('set' as const), value: junkValue }) },
    { weight: 2, arbitrary: fc.record({ path: fc.constantFrom(...ps), op: fc.constant('delete' as const) }) },
    { weight: 1, arbitrary: fc.record({ path: fc.constantFrom(...ps), op: fc.constant('extra' as const), key: junkKey, value: junkValue }) },
  );
  return fc.array(mutation, { minLength: 1, maxLength: 3 }).map((muts) => mutate(valid, muts));
}

/** Objects with the schema's own keys (and the valid body's nested ones) holding junk. */
function keyedJunk(keys: string[]): fc.Arbitrary<unknown> {
  return fc.record(Object.fromEntries(keys.map((k) => [k, junkValue])), { requiredKeys: [] });
}

function shapeKeys(schema: ZodType | undefined): string[] {
  const s = schema as any;
  const shape = s?.shape ?? s?._zod?.def?.in?.shape ?? s?._zod?.def?.schema?.shape ?? {};
  return Object.keys(shape);
}

const MALFORMED = [
  '{',
  '[',
  '}',
  '{"a":}',
  '{"a":1,}',
  "{'a':1}",
  '{"a":NaN}',
  '{"a":Infinity}',
  '{"a":undefined}',
  '{a:1}',
  '{"a":1}{"b":2}',
  '{"a":"\\x41"}',
  '{"a":"unterminated}',
  '{"a":01}',
  'nul',
  ' ',
  '\uFEFF{}',
  '/* comment */ {}',
  '{"a":1} trailing',
];

/** JSON that parses but is odd: a bare value, a huge exponent, a lone surrogate, prototype keys. */
const ODD_JSON = ['null', 'true', '1', '"text"', '{"a":1e999}', '{"a":"\\ud800"}', '{"a":"\\u0000"}', '{"__proto__":{"admin":true}}', '{"constructor":{"prototype":{"x":1}}}', '[]', '[{}]', `{"a":${'['.repeat(5000)}${']'.repeat(5000)}}`];

const CONTENT_TYPES = [
  'text/plain',
  'text/plain; charset=utf-8',
  'application/x-www-form-urlencoded',
  'application/xml',
  'multipart/form-data; boundary=x',
  'application/octet-stream',
  'application/json; charset=latin1',
  'application/json; charset=utf-16',
  'application/json; charset=utf-8',
  'application/json;charset="UTF-8"',
  'APPLICATION/JSON',
  'application/merge-patch+json',
  'text/json',
  'image/png',
  '*/*',
  'application/json; boundary=--',
  '',
];

/** One request: the bytes, their content type, and (for JSON) the value they encode. */
export type Sent = { label: string; body: string | Uint8Array | undefined; contentType: string | undefined; query?: string };

function jsonSent(label: string, value: unknown): Sent {
  return { label, body: JSON.stringify(value), contentType: 'application/json' };
}

function jsonRequests(valid: Record<string, unknown>, schema: ZodType | undefined, unique?: JsonBody['unique']): fc.Arbitrary<Sent> {
  const text = JSON.stringify(valid);
  // The valid body, with its own value in the unique field when the route has one.
  const base = unique ? fc.nat().map((n) => ({ ...valid, [unique.field]: unique.make(n) })) : fc.constant(valid);
  const keys = [...new Set([...Object.keys(valid), ...shapeKeys(schema), ...paths(valid).map((p) => String(p[p.length - 1]))])];
  const form = new URLSearchParams(Object.entries(valid).map(([k, v]) => [k, typeof v === 'string' ? v : JSON.stringify(v)])).toString();
  return fc.oneof(
    { weight: 8, arbitrary: base.chain((v) => nearValid(v)).map((v) => jsonSent('near-valid', v)) },
    { weight: 3, arbitrary: keyedJunk(keys).map((v) => jsonSent('own keys, junk values', v)) },
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }).map((v) => jsonSent('any JSON', v)) },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3, stringUnit: 'binary' }).map((v) => jsonSent('any JSON, any text', v)) },
    { weight: 1, arbitrary: base.map((v) => jsonSent('valid', v)) },
    {
      weight: 2,
      arbitrary: fc
        .oneof(
          fc.constantFrom(...MALFORMED, ...ODD_JSON),
          fc.nat({ max: Math.max(0, text.length - 1) }).map((n) => text.slice(0, n)),
          fc.tuple(fc.nat({ max: text.length }), fc.constantFrom(',', '"', '}', ']', ':', '\\', '\u0000', 'x')).map(([i, c]) => text.slice(0, i) + c + text.slice(i)),
          fc.string({ unit: 'binary', maxLength: 60 }),
        )
        .map((body): Sent => ({ label: 'malformed or odd JSON text', body, contentType: 'application/json' })),
    },
    {
      weight: 1,
      // A field holding a value nested 1,000 or 100,000 deep (written as text: JSON.stringify would overflow).
      arbitrary: fc.record({ path: fc.constantFrom(...paths(valid)), depth: fc.constantFrom(1_000, 100_000), kind: fc.constantFrom('[', '{"k":') }).map(({ path, depth, kind }): Sent => {
        const marked = mutate(valid, [{ path, op: 'set', value: '__DEEP__' }]);
        const nest = kind === '[' ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{"k":'.repeat(depth)}1${'}'.repeat(depth)}`;
        return { label: `${path.join('.')} nested ${depth} deep`, body: JSON.stringify(marked).replace('"__DEEP__"', nest), contentType: 'application/json' };
      }),
    },
    {
      weight: 2,
      arbitrary: fc
        .record({ contentType: fc.constantFrom(...CONTENT_TYPES), body: fc.constantFrom(text, form, '<plant/>', '', 'a=1&b=2') })
        .map(({ contentType, body }): Sent => ({ label: 'another content type', body, contentType: contentType === '' ? undefined : contentType })),
    },
  );
}

// Multipart -----------------------------------------------------------------------------------

type Part = { name: string; filename?: string; type?: string; data: Uint8Array };

function multipart(parts: Part[], boundary: string): Uint8Array {
  const chunks: Buffer[] = [];
  for (const p of parts) {
    let head = `--${boundary}\r\nContent-Disposition: form-data; name="${p.name}"`;
    if (p.filename !== undefined) head += `; filename="${p.filename}"`;
    head += '\r\n';
    if (p.type !== undefined) head += `Content-Type: ${p.type}\r\n`;
    chunks.push(Buffer.from(`${head}\r\n`), Buffer.from(p.data), Buffer.from('\r\n'));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return new Uint8Array(Buffer.concat(chunks));
}

type Images = { good: Buffer[]; huge: Buffer };

async function makeImages(): Promise<Images> {
  const good = [
    await makeImage('jpeg'),
    await makeImage('png', { width: 20, height: 30 }),
    await makeImage('webp'),
    await makeImage('jpeg', { gps: { lat: 52.06, lon: -2.7 }, takenAt: '2026:03:01 10:00:00', orientation: 6 }),
  ];
  // Just over the 10 MB limit (photos.service.ts MAX_UPLOAD_BYTES).
  const huge = Buffer.alloc(10 * 1024 * 1024 + 1, 0x41);
  return { good, huge };
}

function multipartRequests(images: Images, findingId: string): fc.Arbitrary<Sent> {
  const fileBytes = fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...images.good) },
    { weight: 2, arbitrary: fc.tuple(fc.constantFrom(...images.good), fc.nat()).map(([b, n]) => b.subarray(0, n % b.length)) },
    { weight: 2, arbitrary: fc.uint8Array({ maxLength: 3000 }) },
    {
      weight: 2,
      arbitrary: fc.tuple(fc.constantFrom(...images.good), fc.nat(), fc.integer({ min: 0, max: 255 })).map(([b, n, x]) => {
        const c = Buffer.from(b);
        c[n % c.length] = x;
        c[(n * 7) % c.length] ^= 0xff;
        return c;
      }),
    },
    { weight: 1, arbitrary: fc.constantFrom(Buffer.from('These are notes, not a photo.\n'), Buffer.alloc(0), Buffer.from('GIF89a'), Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>')) },
    { weight: 1, arbitrary: fc.constant(images.huge) },
  );
  const text = fc.oneof({ weight: 3, arbitrary: junkString }, { weight: 1, arbitrary: fc.constantFrom(findingId, '', 'Leaf spot on the lower shoots') });
  const part: fc.Arbitrary<Part> = fc.oneof(
    {
      weight: 3,
      arbitrary: fc
        .record({
          name: fc.oneof({ weight: 5, arbitrary: fc.constant('photo') }, { weight: 1, arbitrary: fc.constantFrom('file', 'caption', 'photo[]', '') }),
          filename: fc.oneof(fc.constantFrom('bush.jpg', 'a.png', 'x.exe', '', '../../etc/passwd', 'ü\u0000.jpg'), fc.string({ maxLength: 20 })),
          type: fc.constantFrom('image/jpeg', 'image/png', 'text/plain', 'application/x-msdownload', 'image/svg+xml', undefined),
          data: fileBytes,
        })
        .map((p) => ({ ...p, type: p.type })),
    },
    {
      weight: 3,
      arbitrary: fc
        .record({ name: fc.oneof({ weight: 4, arbitrary: fc.constantFrom('caption', 'findingId') }, { weight: 1, arbitrary: fc.string({ maxLength: 10 }) }), value: text })
        .map(({ name, value }) => ({ name, data: new Uint8Array(Buffer.from(String(value))) })),
    },
  );
  return fc
    .record({
      parts: fc.array(part, { minLength: 0, maxLength: 6 }),
      shape: fc.oneof(
        { weight: 8, arbitrary: fc.constant('well formed' as const) },
        { weight: 1, arbitrary: fc.constantFrom('cut short' as const, 'other boundary' as const, 'no boundary' as const, 'as JSON' as const, 'no content type' as const) },
      ),
      cut: fc.nat(),
    })
    .map(({ parts, shape, cut }): Sent => {
      const boundary = 'heelwoodFuzzBoundary7MA4YWxk';
      const bytes = multipart(parts, boundary);
      const label = `multipart (${shape}): ${parts.map((p) => `${p.name}${p.filename !== undefined ? `[file ${p.data.length} B]` : `=${JSON.stringify(Buffer.from(p.data).toString().slice(0, 40))}`}`).join(', ')}`;
      switch (shape) {
        case 'well formed':
          return { label, body: bytes, contentType: `multipart/form-data; boundary=${boundary}` };
        case 'cut short':
          return { label, body: bytes.subarray(0, cut % Math.max(1, bytes.length)), contentType: `multipart/form-data; boundary=${boundary}` };
        case 'other boundary':
          return { label, body: bytes, contentType: 'multipart/form-data; boundary=somethingElse' };
        case 'no boundary':
          return { label, body: bytes, contentType: 'multipart/form-data' };
        case 'as JSON':
          return { label, body: JSON.stringify({ photo: 'aGVsbG8=', caption: 'x' }), contentType: 'application/json' };
        case 'no content type':
          return { label, body: bytes, contentType: undefined };
      }
    });
}

// CSV -------------------------------------------------------------------------------------------

/** One importable row (spreadsheet text); the fuzz changes none, one or a few cells of it. */
const CSV_ROW: Record<string, string> = {
  code: '',
  farm: 'WTH',
  species: 'Ribes nigrum',
  variety: '',
  planting_year: '2019',
  role: 'stock_bed',
  provenance: 'bought',
  parent_code: '',
  supplier: 'Tanhouse',
  lat: '52.06',
  lon: '-2.7',
  bed_row: 'Bed 2',
  health_status: '',
  last_inspected_on: '',
  notes: 'From the CSV fuzz',
};
const CSV_ODD = ['WTH-0001', 'WTH-F001', 'ARB', 'XXX', 'Blackcurrant', 'Quince', 'Ledbury Sable', 'exchange', 'fruiting_bush', 'hold', 'retired', '2026-01-10', '2031-01-01', '=1+1', '@SUM(A1)', '-2.7', '95'];

function csvRequests(): fc.Arbitrary<Sent> {
  const cellJunk = fc.oneof(
    { weight: 2, arbitrary: fc.constantFrom(...CSV_ODD) },
    { weight: 2, arbitrary: junkString.map((s) => s.slice(0, 5000)) },
    { weight: 1, arbitrary: junkNumber.map(String) },
  );
  const row = fc
    .array(fc.record({ column: fc.constantFrom(...PLANT_CSV_COLUMNS), value: cellJunk }), { maxLength: 3 })
    .map((changes) => {
      const r = { ...CSV_ROW };
      for (const c of changes) r[c.column] = c.value;
      return r;
    });
  const header = fc.oneof(
    { weight: 6, arbitrary: fc.constant([...PLANT_CSV_COLUMNS] as string[]) },
    { weight: 2, arbitrary: fc.shuffledSubarray([...PLANT_CSV_COLUMNS] as string[], { minLength: 1 }) },
    { weight: 1, arbitrary: fc.array(fc.oneof(fc.constantFrom(...PLANT_CSV_COLUMNS), junkString.map((s) => s.slice(0, 50))), { minLength: 1, maxLength: 16 }) },
  );
  const table = fc
    .record({ fields: header, rows: fc.array(row, { maxLength: 5 }) })
    .map(({ fields, rows }) => Papa.unparse({ fields, data: rows.map((r) => fields.map((f) => r[f] ?? '')) }, { newline: '\r\n' }));
  const text = fc.oneof({ weight: 6, arbitrary: table }, { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 200 }) }, { weight: 1, arbitrary: fc.constantFrom('', '\uFEFF', 'farm\n', '"unclosed,quote\nWTH', 'a'.repeat(5 * 1024 * 1024 + 10)) });
  const query = fc.constantFrom('', '?dryRun=true', '?dryRun=false', '?dryRun=maybe', '?dryRun=true&dryRun=false', '?dryRun=');
  return fc
    .record({ text, query, how: fc.constantFrom('text/csv', 'text/plain', 'json', 'json junk', 'text/csv; charset=latin1', 'none') })
    .chain(({ text, query, how }) => {
      switch (how) {
        case 'json':
          return fc.constant<Sent>({ label: `JSON { csv } ${query}`, body: JSON.stringify({ csv: text }), contentType: 'application/json', query });
        case 'json junk':
          return junkValue.map((v): Sent => ({ label: `JSON junk ${query}`, body: JSON.stringify({ csv: v }), contentType: 'application/json', query }));
        case 'none':
          return fc.constant<Sent>({ label: `no content type ${query}`, body: new TextEncoder().encode(text), contentType: undefined, query });
        default:
          return fc.constant<Sent>({ label: `${how} ${query}`, body: text, contentType: how, query });
      }
    });
}

// What the answer must be -------------------------------------------------------------------

function fieldKey(path: PropertyKey[]): string {
  return path.length ? path.map(String).join('.') : '_';
}

/** Paths of text that PostgreSQL cannot store: a NUL character, or half of a surrogate pair. */
export function unstorableText(value: unknown): string[] {
  const bad = (s: string) => s.includes('\u0000') || /\p{Cs}/u.test(s);
  type At = { up: At; key: PropertyKey } | null;
  const pathOf = (at: At) => {
    const keys: PropertyKey[] = [];
    for (let x = at; x; x = x.up) keys.push(x.key);
    return fieldKey(keys.reverse());
  };
  const out: string[] = [];
  // A loop with parent links, not recursion: generated bodies nest deeper than the call stack.
  const todo: { v: unknown; at: At }[] = [{ v: value, at: null }];
  for (let item = todo.pop(); item; item = todo.pop()) {
    const { v, at } = item;
    if (typeof v === 'string') {
      if (bad(v)) out.push(pathOf(at));
    } else if (Array.isArray(v)) v.forEach((x, i) => todo.push({ v: x, at: { up: at, key: i } }));
    else if (v && typeof v === 'object') {
      for (const [k, x] of Object.entries(v)) {
        if (bad(k)) out.push(pathOf({ up: at, key: k }));
        todo.push({ v: x, at: { up: at, key: k } });
      }
    }
  }
  return out;
}

type Expected =
  | { kind: 'refused'; status: number[]; code?: string; fieldsWithin?: string[] }
  | { kind: 'either' };

/** What the server must answer to a JSON request, judged independently from the schema. */
function expectJson(sent: Sent, schema: ZodType | undefined, limit: number): Expected {
  const ct = sent.contentType ?? '';
  const media = ct.split(';')[0].trim().toLowerCase();
  const bytes = typeof sent.body === 'string' ? Buffer.byteLength(sent.body) : (sent.body?.length ?? 0);
  let value: unknown = {};
  const charset = /charset="?([^";]+)"?/i.exec(ct)?.[1]?.toLowerCase();
  // With no bytes, body-parser may skip the request before it looks at the charset.
  if (bytes === 0 && media === 'application/json' && charset && !charset.startsWith('utf-')) return { kind: 'either' };
  if (media === 'application/json') {
    // body-parser refuses a charset that is not utf-*; utf-16 and the like are decoded (to junk, or nothing).
    if (charset && !charset.startsWith('utf-')) return { kind: 'refused', status: [415], code: 'unsupported_encoding' };
    if (charset && charset !== 'utf-8') return { kind: 'either' };
    if (bytes > limit) return { kind: 'refused', status: [413], code: 'body_too_large' };
    // body-parser decodes with iconv-lite, which drops a leading byte-order mark.
    const text = (typeof sent.body === 'string' ? sent.body : Buffer.from(sent.body ?? []).toString()).replace(/^\uFEFF/, '');
    if (text !== '') {
      // body-parser's strict mode: an object or an array, nothing else.
      const first = /^[\x20\x09\x0a\x0d]*(.)/s.exec(text)?.[1];
      try {
        value = JSON.parse(text);
      } catch {
        return { kind: 'refused', status: [400], code: 'malformed_json' };
      }
      if (first !== '{' && first !== '[') return { kind: 'refused', status: [400], code: 'malformed_json' };
    }
  }
  if (!schema) return { kind: 'either' };
  return expectFromValue(schema, value);
}

function expectFromValue(schema: ZodType, value: unknown): Expected {
  const r = schema.safeParse(value);
  if (!r.success) return { kind: 'refused', status: [400], fieldsWithin: [...new Set(r.error.issues.map((i) => fieldKey(i.path)))] };
  const unstorable = unstorableText(r.data);
  if (unstorable.length) return { kind: 'refused', status: [400], fieldsWithin: unstorable };
  return { kind: 'either' };
}

function expectErrorShape(body: any) {
  expect(body, 'error body').toBeTypeOf('object');
  expect(body.error?.code, 'error.code').toBeTypeOf('string');
  expect(body.error?.message, 'error.message').toBeTypeOf('string');
  expect(body.error.message.length, 'error.message').toBeGreaterThan(0);
  if (body.error.fields !== undefined) {
    expect(body.error.fields, 'error.fields').toBeTypeOf('object');
    for (const [k, v] of Object.entries(body.error.fields)) {
      expect(k.length, 'a field name').toBeGreaterThan(0);
      expect(v, `error.fields.${k}`).toBeTypeOf('string');
      // error-handler.ts names a constraint it has no field for "_: constraint <name>": add it to CONSTRAINT_FIELDS.
      expect(v, 'a database constraint with no field name').not.toMatch(/^constraint /);
    }
  }
}

// The run ---------------------------------------------------------------------------------------

export type Fixture = { app: TestApp; ids: Ids; callers: Record<'coordinator' | 'anonymous', Caller>; ledger: Ledger; images: Images };

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** After an accepted write, let background work (the SMTP catcher's inbox) settle before the next baseline. */
async function settle(fx: Fixture) {
  let last = await fx.ledger.mark();
  for (let i = 0; i < 40; i++) {
    await wait(20);
    const next = await fx.ledger.mark();
    if (next.lastWrite === last.lastWrite && next.photoFiles === last.photoFiles) return;
    last = next;
  }
}

function url(route: WriteRoute, ids: Ids, query = '') {
  let p = route.path;
  for (const [k, v] of Object.entries(route.params?.(ids) ?? {})) {
    if (!v) throw new Error(`${routeKey(route)}: no id for :${k}`);
    p = p.replace(`:${k}`, encodeURIComponent(v));
  }
  if (/:\w/.test(p)) throw new Error(`${routeKey(route)}: unfilled parameter in ${p}`);
  return p + (route.query ?? '') + query;
}

function describeSent(sent: Sent) {
  const body = typeof sent.body === 'string' ? sent.body : sent.body ? `<${sent.body.length} bytes>` : '<none>';
  return `${sent.label}; content-type ${sent.contentType ?? '<none>'}; ${sent.query ?? ''} body ${body.length > 600 ? `${body.slice(0, 600)}… (${body.length} chars)` : body}`;
}

type Stats = { runs: number; accepted: number; refused: Record<number, number> };

async function check(fx: Fixture, route: WriteRoute, sent: Sent, stats: Stats) {
  const before = await fx.ledger.mark();
  const res = await fx.callers[route.caller].send(route.method, url(route, fx.ids, sent.query), sent.body, sent.contentType);
  const what = `${routeKey(route)} answered ${res.status} ${res.text.slice(0, 400)}\n  to ${describeSent(sent)}`;
  stats.runs += 1;
  expect(res.status, what).toBeLessThan(500);
  if (res.status < 400) {
    stats.accepted += 1;
    await settle(fx);
    return;
  }
  stats.refused[res.status] = (stats.refused[res.status] ?? 0) + 1;
  expect(() => expectErrorShape(res.body), what).not.toThrow();
  const after = await fx.ledger.mark();
  if (after.lastWrite !== before.lastWrite) expect.fail(`a refusal wrote ${await fx.ledger.writesSince(before.lastWrite)}: ${what}`);
  expect(after.photoFiles, `photo files changed: ${what}`).toBe(before.photoFiles);

  const body = route.body;
  if (body.kind === 'json' || body.kind === 'none') {
    const expected = expectJson(sent, body.kind === 'json' ? body.schema : undefined, body.kind === 'json' ? body.limit : 1024 * 1024);
    if (expected.kind === 'refused') {
      expect(expected.status, what).toContain(res.status);
      if (expected.code) expect(res.body.error.code, what).toBe(expected.code);
      if (expected.fieldsWithin) {
        const fields = Object.keys(res.body.error.fields ?? {});
        expect(fields.length, `no field named: ${what}`).toBeGreaterThan(0);
        for (const f of fields) expect(expected.fieldsWithin, `field "${f}" is not one that is wrong: ${what}`).toContain(f);
      }
    }
  } else if (body.kind === 'csv') {
    if (res.body.error.code === 'csv_invalid') {
      const errors = res.body.report?.errors as { row: number; column: string | null; message: string }[] | undefined;
      expect(errors?.length, `a CSV refusal lists its problems: ${what}`).toBeGreaterThan(0);
      for (const e of errors!) {
        expect(e.row, what).toBeTypeOf('number');
        expect(e.message, what).toBeTypeOf('string');
      }
    } else if (res.status === 400) {
      expect(Object.keys(res.body.error.fields ?? {}).length, `no field named: ${what}`).toBeGreaterThan(0);
    }
  } else if (res.status === 400 && res.body.error.code !== 'malformed_upload') {
    // A readable upload that is refused says which part.
    expect(Object.keys(res.body.error.fields ?? {}).length, `no field named: ${what}`).toBeGreaterThan(0);
  }
}

function requestsFor(route: WriteRoute, fx: Fixture): fc.Arbitrary<Sent> {
  const b = route.body as JsonBody | NoBody | MultipartBody | CsvBody;
  switch (b.kind) {
    case 'json':
      return jsonRequests(b.valid(fx.ids), b.schema, b.unique);
    case 'none':
      return jsonRequests({ reason: 'none needed' }, undefined);
    case 'multipart':
      return multipartRequests(fx.images, fx.ids.findingId ?? '');
    case 'csv':
      return csvRequests();
  }
}

/** A stable per-route seed, so one route's failure replays without the others. */
function seedFor(route: WriteRoute) {
  let h = FUZZ_SEED | 0;
  for (const c of routeKey(route)) h = (Math.imul(h, 31) + c.charCodeAt(0)) | 0;
  return h;
}

/** Defines the suite of one test file: its app, its routes, one test per route. */
export function fuzzGroup(group: Group): () => Fixture {
  const routes = ROUTES.filter((r) => r.group === group);
  let fx: Fixture;
  const timings: string[] = [];

  beforeAll(async () => {
    const app = await startTestApp({ seeded: true });
    const ids = await loadIds(app);
    const callers = { coordinator: new Caller(app.url), anonymous: new Caller(app.url) };
    await callers.coordinator.signIn('coordinator@heelwood.test');
    fx = { app, ids, callers, ledger: await installLedger(app, photosDir(app.ctx.config)), images: await makeImages() };
    // The ledger sees a write: an update that changes nothing still fires its trigger.
    const probe = await fx.ledger.mark();
    await app.ctx.db.execute(sql`update settings set value = value where key = (select min(key) from settings)`);
    const seen = await fx.ledger.writesSince(probe.lastWrite);
    if (seen !== 'UPDATE settings ×1') throw new Error(`the write ledger did not see a test write: ${seen}`);
    const setupCtx = {
      app,
      ids,
      coordinator: (method: Method, path: string, body?: unknown) => callers.coordinator.json(method, path, body),
      upload: async (path: string, file: Buffer) => {
        const boundary = 'setupBoundary';
        const r = await callers.coordinator.send('POST', path, multipart([{ name: 'photo', filename: 'setup.jpg', type: 'image/jpeg', data: new Uint8Array(file) }], boundary), `multipart/form-data; boundary=${boundary}`);
        if (r.status !== 201) throw new Error(`setup upload: ${r.status} ${r.text}`);
        return r.body;
      },
    };
    for (const r of routes) await r.setup?.(setupCtx);
    if (routes.some((r) => r.body.kind === 'multipart')) {
      const { rows } = (await app.ctx.db.execute(
        sql`select f.id from findings f join inspections i on i.id = f.inspection_id where i.plant_id = ${ids.plantPhoto} limit 1`,
      )) as unknown as { rows: { id: string }[] };
      if (rows[0]) ids.findingId = rows[0].id;
    }
  }, 600_000);

  afterAll(async () => {
    if (timings.length) console.log(`[bad-input ${group}] ${FUZZ_RUNS} runs per route, seed ${FUZZ_SEED}\n  ${timings.join('\n  ')}`);
    await fx?.app.close();
  });

  describe(`bad input (${group})`, () => {
    for (const route of routes) {
      const runs = Math.max(1, Math.round(FUZZ_RUNS * (route.runShare ?? 1)));
      it(`${routeKey(route)}: ${runs} generated bodies, never a 5xx, refusals in the error shape and writing nothing`, async () => {
        const stats: Stats = { runs: 0, accepted: 0, refused: {} };
        const seed = seedFor(route);
        const t = performance.now();
        const countsBefore = await fx.ledger.counts();
        const start = await fx.ledger.mark();
        try {
          await fc.assert(
            fc.asyncProperty(requestsFor(route, fx), (sent) => check(fx, route, sent, stats)),
            { numRuns: runs, seed },
          );
        } catch (e) {
          (e as Error).message = `Replay: HEELWOOD_FUZZ_SEED=${FUZZ_SEED} HEELWOOD_FUZZ_RUNS=${FUZZ_RUNS} (seed ${seed} for this route)\n${(e as Error).message}`;
          throw e;
        }
        // The log agrees with the real row count of every table.
        const net = await fx.ledger.netSince(start.lastWrite);
        const expected = Object.fromEntries(Object.entries(countsBefore).map(([k, n]) => [k, n + (net[k] ?? 0)]));
        expect(await fx.ledger.counts(), 'row counts after the runs = before + what the log recorded').toEqual(expected);
        const s = (performance.now() - t) / 1000;
        const refused = Object.entries(stats.refused).map(([k, v]) => `${k}×${v}`).join(' ');
        timings.push(`${routeKey(route)}: ${stats.runs} requests in ${s.toFixed(1)} s; ${stats.accepted} accepted, refused ${refused}`);
        // Both paths ran: mostly refusals, and the generator is not so wild that nothing passes.
        expect(Object.values(stats.refused).reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
      }, 3_600_000);
    }
  });
  return () => fx;
}
