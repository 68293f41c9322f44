// Mother plants to and from CSV. Export is the caller's plant list as a file; import checks
// every row against the same rules as adding one plant, reports each problem by spreadsheet
// row and column, and writes either every row or nothing.
//
// Row numbers are as a spreadsheet shows them: the header is row 1, the first data row is
// row 2. Blank lines are skipped but still counted, so the numbers match what the grower sees.
import { randomUUID } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import Papa from 'papaparse';
import type { PlantListFilters } from '../../../shared/schemas/register.js';
import {
  PLANT_CSV_COLUMNS,
  PLANT_CSV_MAX_ROWS,
  PLANT_CSV_REQUIRED,
  plantCsvRowSchema,
  type PlantCsvColumn,
  type PlantCsvProblem,
  type PlantCsvReport,
  type PlantCsvRow,
} from '../../../shared/schemas/plants-csv.js';
import type { Actor } from '../../auth/guards.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { farms, motherPlants, species, varieties } from '../../db/schema/index.js';
import { HttpError, isStorableText, unstorableTextFields } from '../../lib/http-error.js';
import { insertAuditRows } from '../audit/audit.repo.js';
import { insertPlants, nextPlantNumber } from './mother-plants.repo.js';
import { exportRows } from './mother-plants.service.js';
import { isCoordinator, mayEdit } from './plant-access.js';

/** What a spreadsheet would run as a formula; papaparse puts an apostrophe before it. */
const FORMULA_START = /^[=+\-@\t\r]/;

/** Codes and ids go to PostgreSQL as one bound parameter each, and it takes at most 65,535. */
const LOOKUP_CHUNK = 5000;

function chunks<T>(list: T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < list.length; i += size) out.push(list.slice(i, i + size));
  return out;
}

const today = () => new Date().toISOString().slice(0, 10);

export const exportFileName = () => `heelwood-plants-${today()}.csv`;

// Export --------------------------------------------------------------------------------

/** Supplier, notes and the parent's code: the list rows do not carry them. */
async function plantExtras(db: DbOrTx, ids: string[]) {
  const parent = alias(motherPlants, 'parent');
  const map = new Map<string, { supplier: string | null; notes: string; parentCode: string | null }>();
  for (const part of chunks(ids, LOOKUP_CHUNK)) {
    const rows = await db
      .select({ id: motherPlants.id, supplier: motherPlants.supplier, notes: motherPlants.notes, parentCode: parent.code })
      .from(motherPlants)
      .leftJoin(parent, eq(parent.id, motherPlants.parentPlantId))
      .where(inArray(motherPlants.id, part));
    for (const { id, ...rest } of rows) map.set(id, rest);
  }
  return map;
}

/** The caller's plant list as CSV text; other farms' plants as much as the caller may see of them. */
export async function exportPlantsCsv(db: Db, a: Actor, f: PlantListFilters): Promise<string> {
  const rows = await exportRows(db, a, f);
  const extras = await plantExtras(db, rows.map((r) => r.id));
  const data = rows.map((r) => {
    const x = extras.get(r.id);
    const cells: Record<PlantCsvColumn, string | number | null> = {
      code: r.code,
      farm: r.farmCode,
      species: r.scientificName,
      variety: r.varietyName ?? '',
      planting_year: r.plantingYear,
      role: r.role,
      provenance: r.provenance,
      parent_code: x?.parentCode ?? '',
      supplier: r.full ? (x?.supplier ?? '') : '',
      // Numbers, not text: papaparse leaves numbers unguarded, so a negative longitude stays a number.
      lat: r.lat,
      lon: r.lon,
      bed_row: r.full ? (r.bedRow ?? '') : '',
      health_status: r.healthStatus,
      last_inspected_on: r.lastInspectedOn ?? '',
      notes: r.full ? (x?.notes ?? '') : '',
    };
    return PLANT_CSV_COLUMNS.map((c) => cells[c]);
  });
  const csv = Papa.unparse(
    { fields: [...PLANT_CSV_COLUMNS], data },
    // papaparse's own pattern ends in `.*$`, which misses a formula followed by a line break.
    { escapeFormulae: FORMULA_START, newline: '\r\n' },
  );
  // The byte-order mark makes spreadsheet programs read the file as UTF-8 (accented variety names).
  return `\ufeff${csv}\r\n`;
}

// Import: reading the file ----------------------------------------------------------------

type FileRow = { row: number; cells: Record<string, string> };
type ReadFile = { rows: FileRow[]; problems: PlantCsvProblem[] };

const headerWord = (h: string) => h.trim().toLowerCase().replace(/[\s-]+/g, '_');
const known = new Set<string>(PLANT_CSV_COLUMNS);

function readFile(text: string): ReadFile {
  const problems: PlantCsvProblem[] = [];
  if (!text.replace(/^\ufeff/, '').trim()) {
    return { rows: [], problems: [{ row: 1, column: null, message: 'The file is empty: it needs a header row and one row per plant.' }] };
  }
  // Empty lines are kept here and skipped below, so row numbers stay true to the spreadsheet.
  const parsed = Papa.parse<Record<string, unknown>>(text, {
    header: true,
    skipEmptyLines: false,
    transformHeader: headerWord,
    delimitersToGuess: [',', ';', '\t'],
  });
  const fields = parsed.meta.fields ?? [];
  const renamed = parsed.meta.renamedHeaders ?? {};

  const rows: FileRow[] = [];
  const extraRows = new Set<number>();
  parsed.data.forEach((raw, i) => {
    const row = i + 2;
    const cells: Record<string, string> = {};
    let blank = true;
    for (const [k, v] of Object.entries(raw)) {
      if (k === '__parsed_extra') {
        if ((v as unknown[]).some((x) => String(x ?? '').trim() !== '')) extraRows.add(row);
        continue;
      }
      const s = typeof v === 'string' ? v : String(v ?? '');
      cells[k] = s;
      if (s.trim() !== '') blank = false;
    }
    if (blank && !extraRows.has(row)) return;
    rows.push({ row, cells });
  });

  // Header: missing, unknown, repeated and nameless columns, one problem each.
  const repeated = new Set<string>();
  for (const f of fields) {
    const name = renamed[f] ?? f;
    if (name === '') {
      const used = rows.find((r) => (r.cells[f] ?? '').trim() !== '');
      if (used) problems.push({ row: 1, column: null, message: `A column without a header holds values (first in row ${used.row}); name it or delete it.` });
    } else if (renamed[f]) {
      if (!repeated.has(name)) problems.push({ row: 1, column: name, message: `The column "${name}" appears more than once.` });
      repeated.add(name);
    } else if (!known.has(name)) {
      problems.push({ row: 1, column: name, message: `Unknown column "${name}". The columns are: ${PLANT_CSV_COLUMNS.join(', ')}.` });
    }
  }
  for (const c of PLANT_CSV_REQUIRED) {
    if (!fields.includes(c)) problems.push({ row: 1, column: c, message: `The file has no "${c}" column; it is required.` });
  }

  const badRows = new Set<number>();
  for (const row of extraRows) problems.push({ row, column: null, message: 'This row has more cells than the header has columns.' });
  for (const e of parsed.errors) {
    // papaparse counts quote errors from the header row, field-count errors from the first data row.
    if (e.type !== 'Quotes' || e.row == null || badRows.has(e.row + 1)) continue;
    badRows.add(e.row + 1);
    problems.push({ row: e.row + 1, column: null, message: 'A quoted cell is not closed properly; check the quotation marks in this row.' });
  }
  return { rows, problems };
}

// Import: checking rows against the register ---------------------------------------------------

type Checked = {
  row: number;
  id: string;
  code: string;
  v: PlantCsvRow;
  farmId: string;
  speciesId: string;
  varietyId: string | null;
  parentId: string | null;
  /** Parent is another row of this file: it must be written first. */
  parentRow: Checked | null;
};

/** The number part of a code, as the register counts it (BRK-0042 → 42). */
function codeNumber(code: string, farmCode: string): number {
  const digits = code.slice(farmCode.length + 1).replace(/[^0-9]/g, '');
  return digits ? Number.parseInt(digits, 10) : 0;
}

async function existingCodes(db: DbOrTx, codes: string[]) {
  const map = new Map<string, string>();
  for (const part of chunks(codes, LOOKUP_CHUNK)) {
    const rows = await db.select({ id: motherPlants.id, code: motherPlants.code }).from(motherPlants).where(inArray(motherPlants.code, part));
    for (const r of rows) map.set(r.code, r.id);
  }
  return map;
}

/** Reads every row; returns the plants to write, or the problems. Reads only. */
async function checkRows(db: DbOrTx, a: Actor, file: FileRow[]) {
  const errors: PlantCsvProblem[] = [];
  const warnings: PlantCsvProblem[] = [];
  const coordinator = isCoordinator(a);

  const valid: { row: number; v: PlantCsvRow }[] = [];
  for (const { row, cells } of file) {
    const input = Object.fromEntries(PLANT_CSV_COLUMNS.map((c) => [c, cells[c] ?? '']));
    const r = plantCsvRowSchema.safeParse(input);
    if (!r.success) {
      const seen = new Set<string>();
      for (const issue of r.error.issues) {
        const column = String(issue.path[0] ?? '');
        if (seen.has(column)) continue;
        seen.add(column);
        errors.push({ row, column: column || null, message: issue.message });
      }
    } else {
      // A NUL or half a surrogate pair would make the database refuse the whole import.
      const unstorable = Object.keys(unstorableTextFields(r.data));
      for (const column of unstorable) errors.push({ row, column, message: 'This cell holds a character that cannot be stored (a NUL or a broken Unicode character).' });
      if (!unstorable.length) valid.push({ row, v: r.data });
    }
  }

  // Reference lists are small (tens of farms and species, hundreds of varieties): load them once.
  const [farmList, speciesList, varietyList] = await Promise.all([
    db.select({ id: farms.id, code: farms.code }).from(farms),
    db.select({ id: species.id, scientificName: species.scientificName, commonName: species.commonName }).from(species),
    db.select({ id: varieties.id, speciesId: varieties.speciesId, name: varieties.name }).from(varieties),
  ]);
  const farmByCode = new Map(farmList.map((f) => [f.code, f]));
  const byScientific = new Map(speciesList.map((s) => [s.scientificName.toLowerCase(), s]));
  const byCommon = new Map<string, typeof speciesList>();
  for (const s of speciesList) byCommon.set(s.commonName.toLowerCase(), [...(byCommon.get(s.commonName.toLowerCase()) ?? []), s]);
  const varietiesOf = new Map<string, typeof varietyList>();
  for (const v of varietyList) varietiesOf.set(v.speciesId, [...(varietiesOf.get(v.speciesId) ?? []), v]);

  // Codes written in the file, from every row: a parent in a row with a typo is still "in the file".
  const fileCodeRows = new Map<string, number>();
  for (const { row, cells } of file) {
    const code = (cells.code ?? '').trim().toUpperCase();
    // A code the database cannot hold is no plant's code (its row is already refused), and may not be looked up.
    if (code && isStorableText(code) && !fileCodeRows.has(code)) fileCodeRows.set(code, row);
  }
  const inDb = await existingCodes(db, [
    ...new Set([...fileCodeRows.keys(), ...valid.map(({ v }) => v.parent_code).filter((c): c is string => !!c)]),
  ]);

  const next = new Map<string, number>();
  for (const code of new Set(valid.map(({ v }) => v.farm))) {
    if (farmByCode.has(code)) next.set(code, await nextPlantNumber(db, code));
  }

  const checked: Checked[] = [];
  const byCode = new Map<string, Checked>();
  const err = (row: number, column: PlantCsvColumn | null, message: string) => errors.push({ row, column, message });

  for (const { row, v } of valid) {
    const before = errors.length;
    const farm = farmByCode.get(v.farm);
    if (!farm) err(row, 'farm', `There is no farm with the code ${v.farm}.`);
    else if (!mayEdit(a, farm.id)) err(row, 'farm', `You may not add plants to farm ${v.farm}: only its own people or a coordinator may.`);

    let sp = byScientific.get(v.species.toLowerCase());
    if (!sp) {
      const common = byCommon.get(v.species.toLowerCase()) ?? [];
      if (common.length === 1) sp = common[0];
      else if (common.length > 1) err(row, 'species', `"${v.species}" is the common name of several species (${common.map((s) => s.scientificName).join(', ')}); write the scientific name.`);
      else err(row, 'species', `There is no species "${v.species}" in the species list.`);
    }
    let varietyId: string | null = null;
    if (sp && v.variety) {
      const list = varietiesOf.get(sp.id) ?? [];
      const found = list.find((x) => x.name === v.variety) ?? list.find((x) => x.name.toLowerCase() === v.variety!.toLowerCase());
      if (found) varietyId = found.id;
      else err(row, 'variety', `${sp.scientificName} has no variety "${v.variety}" in the variety list.`);
    }

    if (v.code) {
      if (inDb.has(v.code)) err(row, 'code', `The code ${v.code} is already in the register.`);
      else if (fileCodeRows.get(v.code) !== row) err(row, 'code', `The code ${v.code} is already used in row ${fileCodeRows.get(v.code)}.`);
    }

    if (!coordinator) {
      if (v.health_status && v.health_status !== 'clean') {
        err(row, 'health_status', `Only a coordinator sets a health status; new plants start clean. Leave it empty or write clean (not ${v.health_status}).`);
      }
      if (v.last_inspected_on) {
        warnings.push({ row, column: 'last_inspected_on', message: 'Not used: only a coordinator records inspection dates; the plant starts with none.' });
      }
    }
    if (errors.length > before || !farm || !sp) continue;

    // Auto numbers go on after the register's and the rows above, and skip codes written below.
    let code = v.code;
    if (code) {
      if (code.startsWith(`${farm.code}-`)) next.set(farm.code, Math.max(next.get(farm.code)!, codeNumber(code, farm.code) + 1));
    } else {
      let n = next.get(farm.code)!;
      while (fileCodeRows.has(`${farm.code}-${String(n).padStart(4, '0')}`)) n += 1;
      code = `${farm.code}-${String(n).padStart(4, '0')}`;
      next.set(farm.code, n + 1);
    }
    const c: Checked = { row, id: randomUUID(), code, v, farmId: farm.id, speciesId: sp.id, varietyId, parentId: null, parentRow: null };
    checked.push(c);
    byCode.set(code, c);
  }

  // Parents: in the register, or anywhere in this file (an export lists by code, not by lineage).
  for (const c of checked) {
    const p = c.v.parent_code;
    if (!p) continue;
    const inFile = byCode.get(p);
    if (inFile && fileCodeRows.get(p) === inFile.row) {
      c.parentRow = inFile;
      c.parentId = inFile.id;
    } else if (inDb.has(p)) c.parentId = inDb.get(p)!;
    else if (fileCodeRows.has(p)) err(c.row, 'parent_code', `The parent ${p} (row ${fileCodeRows.get(p)}) has problems of its own; fix that row first.`);
    else err(c.row, 'parent_code', `There is no plant with the code ${p} in the register or in this file.`);
  }
  for (const c of checked) {
    const seen = new Set<Checked>([c]);
    for (let p = c.parentRow; p; p = p.parentRow) {
      if (seen.has(p)) {
        err(c.row, 'parent_code', `The parent links of this row go round in a circle (through ${p.code}).`);
        break;
      }
      seen.add(p);
    }
  }

  errors.sort((x, y) => x.row - y.row || columnOrder(x.column) - columnOrder(y.column));
  return { errors, warnings, checked };
}

const columnOrder = (c: string | null) => (c == null ? -1 : PLANT_CSV_COLUMNS.indexOf(c as PlantCsvColumn));

/** Parents before their offspring, otherwise file order: the foreign key checks each insert. */
function writeOrder(rows: Checked[]): Checked[] {
  const depth = new Map<Checked, number>();
  const depthOf = (c: Checked): number => {
    let d = depth.get(c);
    if (d === undefined) {
      d = c.parentRow ? depthOf(c.parentRow) + 1 : 0;
      depth.set(c, d);
    }
    return d;
  };
  return rows
    .map((c, i) => ({ c, i, d: depthOf(c) }))
    .sort((x, y) => x.d - y.d || x.i - y.i)
    .map((x) => x.c);
}

class RollBack extends Error {}

/** Checks a CSV of mother plants and, unless this is a dry run and if every row is right, adds them all. */
export async function importPlantsCsv(db: Db, a: Actor, text: string, opts: { dryRun: boolean }): Promise<PlantCsvReport> {
  const file = readFile(text);
  if (file.rows.length > PLANT_CSV_MAX_ROWS) {
    throw new HttpError(
      400,
      'csv_too_many_rows',
      `The file has ${file.rows.length.toLocaleString('en')} plant rows; at most ${PLANT_CSV_MAX_ROWS.toLocaleString('en')} are imported at once. Split it into smaller files.`,
    );
  }
  const report = (errors: PlantCsvProblem[], warnings: PlantCsvProblem[] = [], codes: string[] = [], created = 0): PlantCsvReport => ({
    dryRun: opts.dryRun,
    rows: file.rows.length,
    created,
    errors,
    warnings,
    codes,
  });
  // Without the right columns every row would repeat the same complaint: stop at the header.
  if (file.problems.some((p) => p.row === 1)) return report(file.problems);
  if (!file.rows.length) return report([{ row: 1, column: null, message: 'The file has a header but no plant rows under it.' }]);

  if (opts.dryRun) {
    const { errors, warnings, checked } = await checkRows(db, a, file.rows);
    const all = [...file.problems, ...errors].sort((x, y) => x.row - y.row);
    return report(all, warnings, all.length ? [] : checked.map((c) => c.code));
  }

  let result: PlantCsvReport | undefined;
  try {
    // Checks run inside the transaction, so what they saw is what the inserts meet.
    await db.transaction(async (tx) => {
      const { errors, warnings, checked } = await checkRows(tx, a, file.rows);
      const all = [...file.problems, ...errors].sort((x, y) => x.row - y.row);
      if (all.length) {
        result = report(all, warnings);
        throw new RollBack();
      }
      const coordinator = isCoordinator(a);
      const now = new Date();
      const ordered = writeOrder(checked);
      await insertPlants(
        tx,
        ordered.map(({ id, code, v, farmId, speciesId, varietyId, parentId }) => {
          const healthStatus = coordinator ? (v.health_status ?? 'clean') : 'clean';
          return {
            id,
            code,
            farmId,
            speciesId,
            varietyId,
            plantingYear: v.planting_year,
            role: v.role,
            provenance: v.provenance,
            parentPlantId: parentId,
            supplier: v.supplier ?? null,
            lat: v.lat ?? null,
            lon: v.lon ?? null,
            bedRow: v.bed_row,
            notes: v.notes,
            healthStatus,
            lastInspectedOn: coordinator ? (v.last_inspected_on ?? null) : null,
            retiredAt: healthStatus === 'retired' ? now : null,
            createdBy: a.id,
          };
        }),
      );
      await insertAuditRows(
        tx,
        ordered.map((c) => ({
          actorId: a.id,
          entity: 'mother_plant',
          entityId: c.id,
          action: 'import',
          after: { code: c.code, farmId: c.farmId, role: c.v.role, row: c.row },
        })),
      );
      result = report([], warnings, checked.map((c) => c.code), checked.length);
    });
  } catch (e) {
    if (!(e instanceof RollBack)) throw e;
  }
  return result!;
}
