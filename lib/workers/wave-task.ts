import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { BatchingMethod, CartLimits, WaveOrder } from "@/lib/batching/types";

/** Everything the wave worker needs, as plain data for postMessage. */
export type WaveTask = {
  graph: CompactGraph;
  matrix: DistanceMatrix;
  orders: WaveOrder[];
  limits: CartLimits;
  method: BatchingMethod;
  from: string;
  to: string;
};
