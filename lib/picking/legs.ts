import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { CompactGraph } from "@/lib/routing/graph";
import { batchWalkPoints, walkLegs, type WalkLeg } from "@/lib/layout-versions/route-cells";

/**
 * Each leg of a batch walked separately: leg i ends at stop i (leg 0 starts at the depot), the last
 * one ends at the drop-off. The handheld draws one leg at a time: the path from the previous stop.
 */
export function batchLegs(
  graph: CompactGraph,
  matrix: DistanceMatrix,
  from: string,
  to: string,
  stopAccessPoints: number[],
): WalkLeg[] {
  return walkLegs(graph, matrix, batchWalkPoints(graph, from, to, stopAccessPoints));
}
