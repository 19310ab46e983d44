import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { CompactGraph } from "@/lib/routing/graph";
import { batchWalkPoints, joinedCells, walkLegs } from "@/lib/layout-versions/route-cells";

/** The walked cells of a batch, depot → stops in order → drop-off, and each leg's length. */
export function batchRouteCells(
  graph: CompactGraph,
  matrix: DistanceMatrix,
  from: string,
  to: string,
  stopAccessPoints: number[],
): { cells: number[]; legsMm: number[] } {
  const points = batchWalkPoints(graph, from, to, stopAccessPoints);
  // Without both ends there is no walk to draw; a stop the graph does not hold is passed by.
  if (!points[0] || !points[points.length - 1]) return { cells: [], legsMm: [] };
  const legs = walkLegs(
    graph,
    matrix,
    points.filter((p) => p !== undefined),
  );
  return { cells: joinedCells(legs), legsMm: legs.map((l) => l.mm) };
}
