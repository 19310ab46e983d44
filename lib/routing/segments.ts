import type { AccessPoint, CompactGraph } from "./graph";

/** Stops standing inside one corridor edge, in offset order from the edge's `from` end. */
export interface StopSegment {
  edge: number;
  /** A one-way edge is walked from `from` to `to`, so `stops` is also the walking order. */
  oneWay: boolean;
  /** Matrix indices of the stops, by increasing offset along the edge. */
  stops: number[];
}

/**
 * Groups stops that lie part-way along the same edge. `points[i]` is the access point of matrix
 * index i. Stops on a node belong to no segment. An edge holding one of `avoid` (the start or
 * end) is left out, and so is one holding two stops at the same offset: the pruning rules that
 * read segments assume every walk enters and leaves the edge through its ends and meets its stops
 * one after another.
 */
export function buildSegments(
  graph: CompactGraph,
  points: readonly AccessPoint[],
  stops: readonly number[],
  avoid: readonly number[] = [],
): StopSegment[] {
  const byEdge = new Map<number, number[]>();
  for (const s of stops) {
    const p = points[s];
    if (!p || p.edge < 0) continue;
    const list = byEdge.get(p.edge) ?? [];
    list.push(s);
    byEdge.set(p.edge, list);
  }
  const blocked = new Set(avoid.map((a) => points[a]?.edge ?? -1).filter((e) => e >= 0));
  const out: StopSegment[] = [];
  for (const [edge, list] of byEdge) {
    const e = graph.edges[edge];
    if (!e || blocked.has(edge)) continue;
    const offset = (s: number) => (points[s] as AccessPoint).offsetMm;
    list.sort((a, b) => offset(a) - offset(b));
    if (list.some((s, i) => i > 0 && offset(s) === offset(list[i - 1] as number))) continue;
    out.push({ edge, oneWay: e.oneWay, stops: list });
  }
  return out.sort((a, b) => a.edge - b.edge);
}
