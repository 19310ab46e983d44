import "server-only";
import { loadLayoutGraph } from "@/db/layout-versions";
import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";

type Loaded = { graph: CompactGraph; matrix: DistanceMatrix };

// Layout versions never change once published, so a loaded one stays valid; keep the few in use.
const MAX_CACHED = 8;
const cache = new Map<number, Promise<Loaded>>();

export function layoutGraph(layoutVersionId: number): Promise<Loaded> {
  const hit = cache.get(layoutVersionId);
  if (hit) {
    cache.delete(layoutVersionId);
    cache.set(layoutVersionId, hit);
    return hit;
  }
  const loading = loadLayoutGraph(layoutVersionId).then(({ graph, matrix, checksumOk }) => {
    if (!checksumOk) throw new Error(`layout version ${layoutVersionId}: stored distance matrix fails its checksum`);
    return { graph, matrix };
  });
  loading.catch(() => cache.delete(layoutVersionId));
  cache.set(layoutVersionId, loading);
  while (cache.size > MAX_CACHED) cache.delete(cache.keys().next().value as number);
  return loading;
}
