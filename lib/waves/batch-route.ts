import { accessRoute } from "@/lib/routing/access";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { nodeAccessPoint, type AccessPoint, type CompactGraph } from "@/lib/routing/graph";
import { routeCells } from "@/lib/layout-versions/route-cells";

/** The walked cells of a batch, depot → stops in order → drop-off, and each leg's length. */
export function batchRouteCells(graph: CompactGraph, matrix: DistanceMatrix, from: string, to: string, stopAccessPoints: number[]): { cells: number[]; legsMm: number[] } {
  const named = (id: string) => [...graph.depots, ...graph.dropoffs].find((p) => p.id === id);
  const start = named(from);
  const end = named(to);
  if (!start || !end) return { cells: [], legsMm: [] };
  const points: AccessPoint[] = [nodeAccessPoint(graph, start.node), ...stopAccessPoints.map((id) => graph.accessPoints[id]).filter((p): p is AccessPoint => !!p), nodeAccessPoint(graph, end.node)];
  const cells: number[] = [];
  const legsMm: number[] = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const leg = accessRoute(graph, matrix, points[i]!, points[i + 1]!);
    legsMm.push(leg?.lengthMm ?? 0);
    for (const c of leg ? routeCells(graph, leg) : []) if (cells[cells.length - 1] !== c) cells.push(c);
  }
  return { cells, legsMm };
}
