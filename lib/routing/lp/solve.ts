import { walkLength } from "../cost-matrix";
import type { CostMatrix } from "../cost-matrix";
import { UnreachableStopError } from "../errors";
import type { StopSegment } from "../segments";
import { allowedArcs } from "./arcs";
import { dualBound } from "./dual-bound";
import type { Highs } from "./highs";
import { highsSolver, recycleHighsIfLarge } from "./highs";
import type { TourLp } from "./model";
import { arcRows, cutColumns, inside, startingArcs, tourLp } from "./model";
import type { LpArc } from "./separation";
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
  /**
   * Optional wall-clock cap on the integer rounds (HiGHS time_limit, counted over all of them);
   * when it runs out the LP bound is returned unproved. Off by default: results then depend on the machine.
   */
  integerTimeLimitMs?: number;
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
  const cycles = integerCycles(lp.k, columnArcs(lp), x);
  if (cycles.length !== 1) return undefined;
  return (cycles[0] as number[]).slice(1).map((v) => stops[v - 1] as number);
}

function columnArcs(lp: TourLp): LpArc[] {
  return lp.colArc.map((a) => lp.arcs[a] as LpArc);
}

function gcd(a: number, b: number): number {
  while (b > 0) [a, b] = [b, a % b];
  return a;
}

function costDivisor(cost: ArrayLike<number>): number {
  let g = 0;
  for (let a = 0; a < cost.length && g !== 1; a++) g = gcd(g, cost[a] as number);
  return g > 0 ? g : 1;
}

/** Exact cost of an integral point (whole-millimetre arc costs summed in doubles). */
function pointCost(lp: TourLp, x: ArrayLike<number>): number {
  let total = 0;
  lp.colArc.forEach((a, c) => {
    if ((x[c] as number) > 0.5) total += lp.cost[a] as number;
  });
  return total;
}

function isIntegral(x: ArrayLike<number>): boolean {
  for (let c = 0; c < x.length; c++) {
    const v = x[c] as number;
    if (Math.abs(v - Math.round(v)) > 1e-6) return false;
  }
  return true;
}

/**
 * Shortest start → stops → end by linear programming: the assignment LP, started on each node's
 * cheapest arcs and priced out over all of them, tightened with subtour cuts (components of the
 * support graph, then min-cut separation) until none is violated. Its bound, from the duals (see
 * dual-bound.ts) and rounded up to the costs' common divisor, proves the upper order when it
 * reaches it. If not, arcs whose reduced cost shows they cannot sit in a tour shorter than the
 * upper order (or no longer than upperLength, without an order) are left out, and integer rounds
 * add cuts against each subtour the integer solution shows, until it is one tour, then shortest;
 * or until no integer point is left within the limit, which proves the upper order.
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
  const { k } = lp;
  // Every tour length is a sum of arc costs, so a multiple of their common divisor (often a whole
  // cell, 1000 mm): the bound rounds up to the next multiple, and a better tour is shorter by at least g.
  const g = costDivisor(lp.cost);
  const maxRounds = opts.maxRounds ?? 500;
  const masks: Uint8Array[] = [];
  const local = new Map(stops.map((s, i) => [s, i + 1]));
  const tour = opts.upperOrder ? [0, ...opts.upperOrder.map((s) => local.get(s) ?? -1)] : undefined;
  model.options.set({ output_flag: false, presolve: "off" });
  model.passModel({
    numCols: 0,
    numRows: 2 * k,
    colCost: [],
    colLower: [],
    colUpper: [],
    rowLower: new Float64Array(2 * k).fill(1),
    rowUpper: new Float64Array(2 * k).fill(1),
    matrix: { format: "csc", numRows: 2 * k, numCols: 0, starts: [0], indices: [], values: [] },
  });
  const addColumns = (list: readonly number[]) => {
    for (const a of list) {
      if ((lp.column[a] as number) >= 0) continue;
      const rows = arcRows(lp, a, masks);
      model.addCol(lp.cost[a] as number, 0, 1, { indices: rows, values: new Float64Array(rows.length).fill(1) });
      lp.column[a] = lp.colArc.length;
      lp.colArc.push(a);
    }
  };
  const addCut = (set: readonly number[]) => {
    const mask = inside(k, set);
    const cols = cutColumns(lp, mask);
    model.addRow(1, h.infinity, { indices: cols, values: new Float64Array(cols.length).fill(1) });
    lp.cuts.push([...set]);
    masks.push(mask);
  };
  const unreachable = () =>
    new UnreachableStopError(stops, [], "no single walk from the start to the end visits all of them");
  addColumns(startingArcs(lp, tour && !tour.includes(-1) ? tour : undefined));

  let rounds = 0;
  let lowerBound = 0;
  // The prices of the best bound so far and their reduced costs, kept together for arc fixing.
  let reduced: ArrayLike<number> = new Float64Array(lp.arcs.length);
  let fixDual = -Infinity;
  let x: ArrayLike<number> = new Float64Array(0);
  while (rounds < maxRounds) {
    const status = model.run().modelStatus;
    rounds++;
    if (status === INFEASIBLE) {
      // Only an LP over every arc proves there is no tour; a pruned column set may just lack one.
      if (lp.colArc.length === lp.arcs.length) throw unreachable();
      addColumns(lp.arcs.map((_, a) => a));
      continue;
    }
    if (status !== OPTIMAL) break;
    const sol = model.getSolution();
    x = sol.colValue;
    const b = dualBound(lp, masks, sol.rowDual);
    const dual = b.value - b.slack;
    if (dual > fixDual) {
      fixDual = dual;
      lowerBound = Math.max(lowerBound, Math.ceil(dual / g) * g);
      reduced = b.reduced;
    }
    if (lowerBound >= upper) break;
    // Pricing: arcs left out whose reduced cost is negative would lower the LP.
    const priced: number[] = [];
    b.reduced.forEach((rc, a) => {
      if (rc < -1e-7 && (lp.column[a] as number) < 0) priced.push(a);
    });
    if (priced.length > 0) {
      addColumns(priced);
      continue;
    }
    const cuts = violatedCuts(k, columnArcs(lp), x);
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

  // Every arc a wanted tour may use must be a column now; any tour through another arc costs at
  // least fixDual + reduced (dual-bound.ts), above the limit. With an upper order in hand only a
  // strictly shorter tour is wanted (at least g shorter); without one, a tour of the upper length will do.
  const limit = opts.upperOrder ? upper - g : upper;
  const keep: number[] = [];
  const drop: number[] = [];
  for (let a = 0; a < lp.arcs.length; a++) {
    const worthy = !Number.isFinite(limit) || fixDual + (reduced[a] as number) <= limit + 1e-6;
    if (worthy) keep.push(a);
    else if ((lp.column[a] as number) >= 0) drop.push(lp.column[a] as number);
  }
  addColumns(keep);
  drop.sort((p, q) => p - q);
  if (drop.length > 0)
    model.changeColsBounds(
      { kind: "set", indices: drop },
      new Float64Array(drop.length),
      new Float64Array(drop.length),
    );
  const n = lp.colArc.length;
  model.options.set({ presolve: "choose", mip_rel_gap: 0 });
  if (opts.integerTimeLimitMs !== undefined) {
    model.zeroAllClocks();
    model.options.set({ time_limit: opts.integerTimeLimitMs / 1000 });
  }
  // The same limit as a cutoff lets branch and bound discard nodes no better than the upper bound.
  if (Number.isFinite(limit)) model.options.set({ objective_bound: limit + 0.5 });
  model.changeColsIntegrality({ kind: "range", from: 0, to: n - 1 }, new Int32Array(n).fill(1) as Int32Array);
  while (rounds < maxRounds) {
    const status = model.run().modelStatus;
    rounds++;
    const xi = status === OPTIMAL ? model.getSolution().colValue : undefined;
    // No integer point within the limit (infeasible, or the best one above it; the cutoff makes
    // HiGHS report either): no tour beats the upper order, which is then shortest. Without an
    // order it means no tour is within upperLength, which only a wrong upperLength allows.
    if (status === INFEASIBLE || (xi && pointCost(lp, xi) > limit)) {
      if (!opts.upperOrder) return { ...best, rounds };
      return { lowerBound: upper, order: [...opts.upperOrder], length: upper, proved: true, rounds };
    }
    if (!xi) return { ...best, rounds };
    const cycles = integerCycles(k, columnArcs(lp), xi);
    if (cycles.length === 1) {
      const order = orderOf(lp, stops, xi) as number[];
      const length = walkLength(cm, req.start, order, req.end);
      return { lowerBound: length, order, length, proved: true, rounds };
    }
    for (const cyc of cycles.slice(1)) addCut(cyc);
  }
  return { ...best, rounds };
}
