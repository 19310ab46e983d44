import "server-only";
import { loadLayoutGraph } from "@/db/layout-versions";
import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { immutableCache } from "../cache/immutable-cache";

type Loaded = { graph: CompactGraph; matrix: DistanceMatrix };

// Layout versions never change once published, so a loaded one stays valid; keep the few in use.
export const layoutGraph = immutableCache<number, Loaded>(8, (layoutVersionId) =>
  loadLayoutGraph(layoutVersionId).then(({ graph, matrix, checksumOk }) => {
    if (!checksumOk) throw new Error(`layout version ${layoutVersionId}: stored distance matrix fails its checksum`);
    return { graph, matrix };
  }),
);
