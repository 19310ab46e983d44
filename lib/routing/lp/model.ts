import { UNREACHABLE } from "../constants";
import type { CostMatrix } from "../cost-matrix";
import { arcCost } from "../cost-matrix";
import type { LpArc } from "./separation";

/**
 * The assignment LP of start → every stop once → end as a closed tour: local node 0 stands for
 * the start when left and for the end when entered, nodes 1..m for the stops. Rows 0..m: each node
 * is left once; rows m+1..2m+1: each node is entered once. Cut rows follow.
 */
export interface TourLp {
  k: number;
  arcs: LpArc[];
  cost: Float64Array;
  rowLower: number[];
  rowUpper: number[];
  /** Nonzeros of each row: columns and coefficients (all 1), kept for the dual bound. */
  rowCols: number[][];
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
  const rowCols: number[][] = Array.from({ length: 2 * k }, () => []);
  arcs.forEach((a, c) => {
    (rowCols[a.from] as number[]).push(c);
    (rowCols[k + a.to] as number[]).push(c);
  });
  return {
    k,
    arcs,
    cost: Float64Array.from(cost),
    rowLower: Array.from({ length: 2 * k }, () => 1),
    rowUpper: Array.from({ length: 2 * k }, () => 1),
    rowCols,
  };
}

/** Columns entering `set` (the left-hand side of its subtour cut). */
export function cutColumns(lp: TourLp, set: readonly number[]): number[] {
  const inside = new Uint8Array(lp.k);
  for (const v of set) inside[v] = 1;
  const cols: number[] = [];
  lp.arcs.forEach((a, c) => {
    if (!inside[a.from] && inside[a.to]) cols.push(c);
  });
  return cols;
}
