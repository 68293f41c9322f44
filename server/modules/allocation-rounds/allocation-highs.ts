// One stage of the allocation model handed to HiGHS (WebAssembly) as sparse arrays: building
// LP text and parsing it back costs several times the solve on models of this size.
import loadHighs, { type Highs } from 'highs';

/** A linear model with whole-number and continuous columns; rows in compressed sparse rows. */
export type StageModel = {
  sense: 'max' | 'min';
  offset: number;
  colCost: Float64Array;
  colLower: Float64Array;
  colUpper: Float64Array;
  /** 1 for a whole-number column, 0 for a continuous one. */
  integrality: Int32Array;
  rowLower: Float64Array;
  rowUpper: Float64Array;
  rowStarts: Int32Array;
  rowIndex: Int32Array;
  rowValue: Float64Array;
};

/** Compressed sparse rows from entries given as parallel arrays (row, column, value). */
export function compressRows(numRows: number, eRow: ArrayLike<number>, eCol: ArrayLike<number>, eVal: ArrayLike<number>) {
  const rowStarts = new Int32Array(numRows + 1);
  for (let e = 0; e < eRow.length; e++) rowStarts[eRow[e] + 1]++;
  for (let r = 0; r < numRows; r++) rowStarts[r + 1] += rowStarts[r];
  const fill = rowStarts.slice(0, numRows);
  const rowIndex = new Int32Array(eRow.length);
  const rowValue = new Float64Array(eRow.length);
  for (let e = 0; e < eRow.length; e++) {
    const at = fill[eRow[e]]++;
    rowIndex[at] = eCol[e];
    rowValue[at] = eVal[e];
  }
  return { rowStarts, rowIndex, rowValue };
}

export type StageRun = {
  status: string;
  /** A solution satisfying every constraint was found (not necessarily proven best). */
  feasible: boolean;
  objective: number;
  dualBound: number;
  gap: number;
  x: Float64Array;
  /** Row and column duals of an LP (min c'x - y'Ax convention: colDual = c - A'rowDual). */
  rowDual: Float64Array;
  colDual: Float64Array;
  /** Final simplex basis of an LP, to warm-start a grown model. */
  basis: { colStatus: Int32Array; rowStatus: Int32Array } | null;
  seconds: number;
};

let loading: Promise<Highs> | null = null;
/** The solver's WebAssembly is compiled once per process and then reused. */
export function highs(): Promise<Highs> {
  loading ??= loadHighs().catch((err: unknown) => {
    loading = null;
    throw err;
  });
  return loading;
}

const STATUS: Record<number, string> = {
  0: 'not_set',
  1: 'load_error',
  2: 'model_error',
  3: 'presolve_error',
  4: 'solve_error',
  5: 'postsolve_error',
  6: 'empty',
  7: 'optimal',
  8: 'infeasible',
  9: 'unbounded_or_infeasible',
  10: 'unbounded',
  11: 'objective_bound',
  12: 'objective_target',
  13: 'time_limit',
  14: 'iteration_limit',
  15: 'unknown',
  16: 'solution_limit',
  17: 'interrupted',
};

export function runStage(
  h: Highs,
  m: StageModel,
  settings: { timeLimit: number; relGap?: number; absGap?: number; target?: number },
  start?: Float64Array,
  basis?: { colStatus: Int32Array; rowStatus: Int32Array },
): StageRun {
  const t0 = performance.now();
  const numCols = m.colCost.length;
  const numRows = m.rowLower.length;
  return h.withModel(
    {
      numCols,
      numRows,
      sense: m.sense === 'max' ? h.constants.objectiveSense.maximize : h.constants.objectiveSense.minimize,
      offset: m.offset,
      colCost: m.colCost,
      colLower: m.colLower,
      colUpper: m.colUpper,
      rowLower: m.rowLower,
      rowUpper: m.rowUpper,
      matrix: { format: 'csr', numRows, numCols, starts: m.rowStarts, indices: m.rowIndex, values: m.rowValue },
      integrality: m.integrality,
    },
    (model) => {
      // Deterministic: one thread (the WebAssembly build has no others), a fixed seed.
      model.options.set({
        output_flag: process.env.HEELWOOD_HIGHS_LOG === '1', log_to_console: process.env.HEELWOOD_HIGHS_LOG === '1',
        random_seed: 0,
        presolve: 'on',
        time_limit: Math.max(0.05, settings.timeLimit),
        mip_rel_gap: settings.relGap ?? 0,
        mip_abs_gap: settings.absGap ?? 1e-6,
      });
      if (settings.target !== undefined) model.options.set({ objective_target: settings.target });
      if (start) model.setSolution({ colValue: start });
      if (basis) model.setBasis(basis);
      if (process.env.HEELWOOD_HIGHS_LOG === '1') {
        model.run({
          [h.constants.callbackType.logging]: (e) => {
            process.stderr.write(e.message);
          },
        });
      } else model.run();
      const code = model.getModelStatus();
      const status = STATUS[code] ?? `status_${code}`;
      const solutionStatus = Number(model.info.get('primal_solution_status'));
      // 2 = feasible: HiGHS has a point that satisfies all constraints.
      const feasible = solutionStatus === 2;
      const sol = feasible ? model.getSolution() : null;
      const x = sol ? sol.colValue : new Float64Array(numCols);
      const isMip = m.integrality.some((v) => v === 1);
      const objective = feasible ? model.getObjectiveValue() : Number.NaN;
      const dualBound = isMip ? Number(model.info.get('mip_dual_bound')) : objective;
      const gap = isMip ? Number(model.info.get('mip_gap')) : 0;
      const rowDual = sol && !isMip ? sol.rowDual : new Float64Array(numRows);
      const colDual = sol && !isMip ? sol.colDual : new Float64Array(numCols);
      let finalBasis: StageRun['basis'] = null;
      if (!isMip && code === 7) {
        const b = model.getBasis();
        finalBasis = { colStatus: Int32Array.from(b.colStatus), rowStatus: Int32Array.from(b.rowStatus) };
      }
      return { status, feasible, objective, dualBound, gap, x, rowDual, colDual, basis: finalBasis, seconds: (performance.now() - t0) / 1000 };
    },
  );
}
