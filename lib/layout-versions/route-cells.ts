import { accessRoute, type Route } from "@/lib/routing/access";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { nodeAccessPoint, type AccessPoint, type CompactGraph } from "@/lib/routing/graph";

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

/** One leg of a walk drawn on the plan: its cells and its length. */
export type WalkLeg = { cells: number[]; mm: number };

/**
 * The points a batch's walk passes, in order: the depot or drop-off named `from`, each stop's access
 * point, the one named `to`. A name or stop the graph does not hold stays in its place as undefined.
 */
export function batchWalkPoints(
  graph: CompactGraph,
  from: string,
  to: string,
  stopAccessPoints: number[],
): (AccessPoint | undefined)[] {
  const named = (id: string) => [...graph.depots, ...graph.dropoffs].find((p) => p.id === id);
  const start = named(from);
  const end = named(to);
  const stops = stopAccessPoints.map((id) => graph.accessPoints[id]);
  return [
    start ? nodeAccessPoint(graph, start.node) : undefined,
    ...stops,
    end ? nodeAccessPoint(graph, end.node) : undefined,
  ];
}

/** The shortest walk between each point and the next; a leg with a missing end, or no way through, is empty. */
export function walkLegs(graph: CompactGraph, matrix: DistanceMatrix, points: (AccessPoint | undefined)[]): WalkLeg[] {
  const legs: WalkLeg[] = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i];
    const b = points[i + 1];
    const leg = a && b ? accessRoute(graph, matrix, a, b) : null;
    legs.push({ cells: leg ? routeCells(graph, leg) : [], mm: leg?.lengthMm ?? 0 });
  }
  return legs;
}

/** The legs' cells as one walk, a cell where one leg ends and the next begins drawn once. */
export function joinedCells(legs: WalkLeg[]): number[] {
  const cells: number[] = [];
  for (const leg of legs) for (const c of leg.cells) if (cells[cells.length - 1] !== c) cells.push(c);
  return cells;
}
