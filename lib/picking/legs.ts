import { accessRoute } from "@/lib/routing/access";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { nodeAccessPoint, type AccessPoint, type CompactGraph } from "@/lib/routing/graph";
import { routeCells } from "@/lib/layout-versions/route-cells";

/**
 * Each leg of a batch walked separately: leg i ends at stop i (leg 0 starts at the depot), the last
 * one ends at the drop-off. The handheld draws one leg at a time: the path from the previous stop.
 */
export function batchLegs(graph: CompactGraph, matrix: DistanceMatrix, from: string, to: string, stopAccessPoints: number[]): { cells: number[]; mm: number }[] {
  const named = (id: string) => [...graph.depots, ...graph.dropoffs].find((p) => p.id === id);
  const start = named(from);
  const end = named(to);
  const stops = stopAccessPoints.map((id) => graph.accessPoints[id]);
  const points: (AccessPoint | undefined)[] = [start ? nodeAccessPoint(graph, start.node) : undefined, ...stops, end ? nodeAccessPoint(graph, end.node) : undefined];
  const legs: { cells: number[]; mm: number }[] = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i];
    const b = points[i + 1];
    const leg = a && b ? accessRoute(graph, matrix, a, b) : null;
    legs.push({ cells: leg ? routeCells(graph, leg) : [], mm: leg?.lengthMm ?? 0 });
  }
  return legs;
}
