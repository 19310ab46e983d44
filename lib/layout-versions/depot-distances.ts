import { accessDistance } from "@/lib/routing/access";
import { UNREACHABLE } from "@/lib/routing/constants";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { nodeAccessPoint, type CompactGraph } from "@/lib/routing/graph";

export type DepotDistance = { depot: string; mm: number } | null;

/** Each bin's walk from its nearest depot (where carts start), or null when no depot reaches it. */
export function binDistancesFromDepots(graph: CompactGraph, matrix: DistanceMatrix): Map<string, DepotDistance> {
  const starts = graph.depots.map((d) => ({ id: d.id, ap: nodeAccessPoint(graph, d.node) }));
  const out = new Map<string, DepotDistance>();
  for (const bin of graph.bins) {
    const ap = graph.accessPoints[bin.accessPoint];
    let best: DepotDistance = null;
    for (const s of starts) {
      const mm = ap ? accessDistance(graph, matrix, s.ap, ap) : UNREACHABLE;
      if (mm < UNREACHABLE && (!best || mm < best.mm)) best = { depot: s.id, mm };
    }
    out.set(bin.code, best);
  }
  return out;
}
