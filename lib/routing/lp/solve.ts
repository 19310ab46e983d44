import { walkLength } from "../cost-matrix";
import type { CostMatrix } from "../cost-matrix";
import { UnreachableStopError } from "../errors";
import type { StopSegment } from "../segments";
import { allowedArcs } from "./arcs";
import { dualBound } from "./dual-bound";
import type { Highs } from "./highs";
import { highsSolver, recycleHighsIfLarge } from "./highs";
import type { TourLp } from "./model";
import { cutColumns, tourLp } from "./model";
import { integerCycles, violatedCuts } from "./separation";

export interface LpRouteRequest {
  start: number;
  end: number;
  stops: readonly number[];
  /** Stops sharing corridor edges (lib/routing/segments.ts); lets the LP drop arcs no optimum needs. */
  segments?: readonly StopSegment[];
}

export interface LpRouteOptions {
  /** A known order (e.g. from local search); its length is the upper bound when upperLength is absent. */
  upperOrder?: readonly number[];
  upperLength?: number;
  /** Cap on LP and integer solves together. */
  maxRounds?: number;
  /** Go on to integer rounds when the LP bound alone does not prove the upper bound (default true). */
  integer?: boolean;
}

export interface LpRouteResult {
  /** Never above the shortest possible length. */
  lowerBound: number;
  /** A tour found by the LP or the integer rounds, or the given upper order when the bound proves it. */
  order?: number[];
  length?: number;
  proved: boolean;
  /** Solves run. */
  rounds: number;
}

const OPTIMAL = 7;
const INFEASIBLE = 8;

function solver(): Highs {
  const h = highsSolver();
  if (!h) throw new Error("HiGHS is not loaded: await loadHighs() before lpRoute");
  return h;
}

function orderOf(lp: TourLp, stops: readonly number[], x: ArrayLike<number>): number[] | undefined {
  const cycles = integerCycles(lp.k, lp.arcs, x);
  if (cycles.length !== 1) return undefined;
  return (cycles[0] as number[]).slice(1).map((v) => stops[v - 1] as number);
}

function isIntegral(x: ArrayLike<number>): boolean {
  for (let c = 0; c < x.length; c++) {
    const v = x[c] as number;
    if (Math.abs(v - Math.round(v)) > 1e-6) return false;
  }
  return true;
}

/**
 * Shortest start → stops → end by linear programming: the assignment LP tightened with subtour
 * cuts (components of the support graph, then min-cut separation) until none is violated. Its
 * bound, from the duals (see dual-bound.ts) and rounded up because costs are whole millimetres,
 * proves the upper order when it reaches it. If not, arcs whose reduced cost shows they cannot
 * sit in any tour no longer than the upper bound are fixed to 0, and integer rounds add cuts
 * against each subtour the integer solution shows, until it is one tour: then that tour is shortest.
 */
export function lpRoute(cm: CostMatrix, req: LpRouteRequest, opts: LpRouteOptions = {}): LpRouteResult {
  const stops = [...new Set(req.stops)];
  const { start, end } = req;
  const upper = opts.upperLength ?? (opts.upperOrder ? walkLength(cm, start, opts.upperOrder, end) : Infinity);
  if (stops.length <= 1) {
    const length = walkLength(cm, start, stops, end);
    return { lowerBound: length, order: stops, length, proved: true, rounds: 0 };
  }
  const h = solver();
  const lp = tourLp(cm, start, end, stops, allowedArcs(stops, req.segments));
  const model = h.createModel();
  try {
    return run(h, model, lp, cm, req, stops, upper, opts);
  } finally {
    model.dispose();
    recycleHighsIfLarge();
  }
}

function run(
  h: Highs,
  model: ReturnType<Highs["createModel"]>,
  lp: TourLp,
  cm: CostMatrix,
  req: LpRouteRequest,
  stops: number[],
  upper: number,
  opts: LpRouteOptions,
): LpRouteResult {
  const { k, arcs } = lp;
  const n = arcs.length;
  const maxRounds = opts.maxRounds ?? 500;
  const starts = new Int32Array(n + 1);
  const indices = new Int32Array(2 * n);
  arcs.forEach((a, c) => {
    starts[c + 1] = 2 * (c + 1);
    indices[2 * c] = a.from;
    indices[2 * c + 1] = k + a.to;
  });
  model.options.set({ output_flag: false, presolve: "off" });
  model.passModel({
    numCols: n,
    numRows: 2 * k,
    colCost: lp.cost,
    colLower: new Float64Array(n),
    colUpper: new Float64Array(n).fill(1),
    rowLower: lp.rowLower,
    rowUpper: lp.rowUpper,
    matrix: { format: "csc", numRows: 2 * k, numCols: n, starts, indices, values: new Float64Array(2 * n).fill(1) },
  });
  const addCut = (set: readonly number[]) => {
    const cols = cutColumns(lp, set);
    model.addRow(1, h.infinity, { indices: cols, values: new Float64Array(cols.length).fill(1) });
    lp.rowLower.push(1);
    lp.rowUpper.push(Infinity);
    lp.rowCols.push(cols);
  };
  const unreachable = () =>
    new UnreachableStopError(stops, [], "no single walk from the start to the end visits all of them");

  let rounds = 0;
  let lowerBound = 0;
  // The prices of the best bound so far and their reduced costs, kept together for arc fixing.
  let reduced: ArrayLike<number> = new Float64Array(n);
  let fixDual = -Infinity;
  let x: ArrayLike<number> = new Float64Array(n);
  while (rounds < maxRounds) {
    const status = model.run().modelStatus;
    rounds++;
    if (status === INFEASIBLE) throw unreachable();
    if (status !== OPTIMAL) break;
    const sol = model.getSolution();
    x = sol.colValue;
    const b = dualBound(lp, sol.rowDual);
    const dual = b.value - b.slack;
    if (dual > fixDual) {
      fixDual = dual;
      lowerBound = Math.max(lowerBound, Math.ceil(dual));
      reduced = b.reduced;
    }
    if (lowerBound >= upper) break;
    const cuts = violatedCuts(k, arcs, x);
    if (cuts.length === 0) break;
    for (const set of cuts) addCut(set);
  }
  if (lowerBound >= upper) {
    const order = opts.upperOrder ? [...opts.upperOrder] : undefined;
    return { lowerBound: upper, order, length: order ? upper : undefined, proved: true, rounds };
  }
  const found = isIntegral(x) ? orderOf(lp, stops, x) : undefined;
  if (found) {
    const length = walkLength(cm, req.start, found, req.end);
    if (lowerBound >= length) return { lowerBound: length, order: found, length, proved: true, rounds };
  }
  const best = { lowerBound, rounds, proved: false as const };
  if (opts.integer === false || rounds >= maxRounds) return best;

  if (Number.isFinite(upper)) {
    // A tour using arc c costs at least dual + reduced[c] (dual-bound.ts); above the upper bound, it is no better.
    const fixed: number[] = [];
    for (let c = 0; c < n; c++) if (fixDual + (reduced[c] as number) > upper + 1e-6) fixed.push(c);
    if (fixed.length > 0)
      model.changeColsBounds(
        { kind: "set", indices: fixed },
        new Float64Array(fixed.length),
        new Float64Array(fixed.length),
      );
  }
  model.options.set({ presolve: "choose", mip_rel_gap: 0 });
  model.changeColsIntegrality({ kind: "range", from: 0, to: n - 1 }, new Int32Array(n).fill(1) as Int32Array);
  while (rounds < maxRounds) {
    const status = model.run().modelStatus;
    rounds++;
    // Infeasible here means no tour is within the upper bound, which only a wrong upperLength allows.
    if (status !== OPTIMAL) return { ...best, rounds };
    const xi = model.getSolution().colValue;
    const cycles = integerCycles(k, arcs, xi);
    if (cycles.length === 1) {
      const order = orderOf(lp, stops, xi) as number[];
      const length = walkLength(cm, req.start, order, req.end);
      return { lowerBound: length, order, length, proved: true, rounds };
    }
    for (const cyc of cycles.slice(1)) addCut(cyc);
  }
  return { ...best, rounds };
}
