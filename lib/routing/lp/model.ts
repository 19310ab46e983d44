import { UNREACHABLE } from "../constants";
import type { CostMatrix } from "../cost-matrix";
import { arcCost } from "../cost-matrix";
import type { LpArc } from "./separation";

/**
 * The assignment LP of start → every stop once → end as a closed tour: local node 0 stands for
 * the start when left and for the end when entered, nodes 1..m for the stops. Rows 0..k-1: each
 * node is left once; rows k..2k-1: each node is entered once; row 2k + c: cut c, at least one arc
 * enters cuts[c]. `arcs` are all the arcs a tour may use; only some are LP columns at a time
 * (pricing adds the rest when their reduced cost turns negative).
 */
export interface TourLp {
  k: number;
  arcs: LpArc[];
  cost: Float64Array;
  cuts: number[][];
  /** LP column of each arc, -1 while it is left out. */
  column: Int32Array;
  /** Arc of each LP column. */
  colArc: number[];
}

export function tourLp(
  cm: CostMatrix,
  start: number,
  end: number,
  stops: readonly number[],
  allowed: Uint8Array,
): TourLp {
  const m = stops.length;
  const k = m + 1;
  const pt = (i: number, leaving: boolean) => (i === 0 ? (leaving ? start : end) : (stops[i - 1] as number));
  const arcs: LpArc[] = [];
  const cost: number[] = [];
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      if (!allowed[i * k + j]) continue;
      const c = arcCost(cm, pt(i, true), pt(j, false));
      if (c >= UNREACHABLE) continue;
      arcs.push({ from: i, to: j });
      cost.push(c);
    }
  }
  return { k, arcs, cost: Float64Array.from(cost), cuts: [], column: new Int32Array(arcs.length).fill(-1), colArc: [] };
}

/** Membership mask of a node set. */
export function inside(k: number, set: readonly number[]): Uint8Array {
  const mask = new Uint8Array(k);
  for (const v of set) mask[v] = 1;
  return mask;
}

/** Rows holding arc a: its out row, its in row and every cut it enters. */
export function arcRows(lp: TourLp, a: number, masks: readonly Uint8Array[]): number[] {
  const { from, to } = lp.arcs[a] as LpArc;
  const rows = [from, lp.k + to];
  masks.forEach((mask, c) => {
    if (!mask[from] && mask[to]) rows.push(2 * lp.k + c);
  });
  return rows;
}

/** LP columns entering `set` (the left-hand side of its subtour cut). */
export function cutColumns(lp: TourLp, mask: Uint8Array): number[] {
  const cols: number[] = [];
  lp.colArc.forEach((a, c) => {
    const arc = lp.arcs[a] as LpArc;
    if (!mask[arc.from] && mask[arc.to]) cols.push(c);
  });
  return cols;
}

/**
 * Arcs the first LP holds: each node's cheapest few out and in, plus `tour` (a feasible tour, so
 * the LP is never infeasible for want of columns). Every arc when there are few.
 */
export function startingArcs(lp: TourLp, tour: readonly number[] | undefined, few = 10): number[] {
  const { k, arcs, cost } = lp;
  if (!tour || k <= 2 * few) return arcs.map((_, a) => a);
  const keep = new Uint8Array(arcs.length);
  const outOf: number[][] = Array.from({ length: k }, () => []);
  const into: number[][] = Array.from({ length: k }, () => []);
  const index = new Map<number, number>();
  arcs.forEach((arc, a) => {
    (outOf[arc.from] as number[]).push(a);
    (into[arc.to] as number[]).push(a);
    index.set(arc.from * k + arc.to, a);
  });
  for (const list of [...outOf, ...into]) {
    list.sort((x, y) => (cost[x] as number) - (cost[y] as number));
    for (const a of list.slice(0, few)) keep[a] = 1;
  }
  for (let t = 0; t < tour.length; t++) {
    const a = index.get((tour[t] as number) * k + (tour[(t + 1) % tour.length] as number));
    if (a === undefined) return arcs.map((_, b) => b);
    keep[a] = 1;
  }
  return arcs.map((_, a) => a).filter((a) => keep[a]);
}
