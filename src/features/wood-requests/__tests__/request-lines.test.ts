import { describe, expect, it } from 'vitest';
import type { BoardRow } from '../../../../shared/schemas/seasons';
import { boardStatus } from '../components/wood-board-table';
import { mergeIncoming, planText, readIncomingLine, type IncomingLine, type RequestLineValues } from '../lib/request-lines';

const sp = '2014f893-2b54-451f-a7e0-af96337880a9';

describe('request lines', () => {
  it('reads a planner line from the address and ignores a broken plan', () => {
    const params = new URLSearchParams({ speciesId: sp, treatment: 'hormone', cuttings: '52', plan: '{"kind":"positions","positions":26,"cuttingsPerPosition":2}' });
    expect(readIncomingLine(params)).toEqual({ speciesId: sp, varietyId: null, treatment: 'hormone', cuttings: 52, plan: { kind: 'positions', positions: 26, cuttingsPerPosition: 2 } });
    expect(readIncomingLine(new URLSearchParams({ speciesId: sp, treatment: 'magic', plan: '{oops' }))).toMatchObject({ treatment: 'none', plan: null, cuttings: undefined });
    expect(readIncomingLine(new URLSearchParams())).toBeNull();
  });

  it('adds a new line, or puts the number into the line for the same wood (the server refuses two)', () => {
    const incoming: IncomingLine = { speciesId: sp, varietyId: null, treatment: 'willow', cuttings: 52, plan: null };
    const other: RequestLineValues = { speciesId: sp, varietyId: null, cuttings: 10, substitutesAllowed: true, treatment: 'none', plan: null };
    expect(mergeIncoming([other], incoming)).toMatchObject({ index: 1, lines: [other, { cuttings: 52, treatment: 'willow' }] });
    const same = { ...other, treatment: 'willow' as const };
    const merged = mergeIncoming([same], incoming);
    expect(merged.lines).toEqual([{ ...same, cuttings: 52 }]);
    expect(merged.note).toMatch(/^Line 1 already asked for this wood/);
  });

  it('says a plan in words', () => {
    expect(planText({ kind: 'hedgerow', lengthM: 30, spacingM: 1.2, rows: 2, positions: 52, cuttingsPerPosition: 2 })).toBe('30 m hedgerow, 2 rows, every 1.2 m: 52 positions, 2 cuttings each');
    expect(planText({ kind: 'positions', positions: 12, cuttingsPerPosition: 1, purpose: 'New stock-bed row' })).toBe('New stock-bed row: 12 planting positions, 1 cutting each');
    expect(planText({ kind: 'rooted', rooted: 40, confidence: 0.95 })).toBe('40 rooted plants wanted, 95 % sure');
    expect(planText(null)).toBeNull();
  });

  it('flags scarce wood by pressure above 1, in words and a shape', () => {
    const base: BoardRow = { speciesId: sp, speciesName: 'Blackcurrant', varietyId: 'v', varietyName: 'Ledbury Sable', offered: 100, farms: 2, plants: 3, asked: 50, pressure: 0.5, nearestKm: 4.2, restrictionNote: null };
    expect(boardStatus(base)).toBe('enough');
    expect(boardStatus({ ...base, asked: 101, pressure: 1.01 })).toBe('scarce');
    expect(boardStatus({ ...base, offered: 0, asked: 5, pressure: null })).toBe('unoffered');
    expect(boardStatus({ ...base, varietyId: null })).toBeNull();
  });
});
