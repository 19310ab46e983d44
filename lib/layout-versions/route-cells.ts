import type { CompactGraph } from "@/lib/routing/graph";
import type { Route } from "@/lib/routing/access";

/** The grid cells a route walks through, in order, for drawing it on the floor plan. */
export function routeCells(graph: CompactGraph, route: Route): number[] {
  const out: number[] = [];
  for (const s of route.segments) {
    const e = graph.edges[s.edge];
    if (!e) continue;
    const step = graph.cellMm;
    const a = Math.round(s.fromMm / step);
    const b = Math.round(s.toMm / step);
    const dir = b >= a ? 1 : -1;
    for (let i = a; dir > 0 ? i <= b : i >= b; i += dir) {
      const c = e.cells[i];
      if (c !== undefined && out[out.length - 1] !== c) out.push(c);
    }
  }
  return out;
}
