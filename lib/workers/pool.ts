import "server-only";
import { RoutingPool } from "@/lib/routing/pool";

// One pool per server process. A single worker: the machine has two cores, and the other one
// keeps serving pickers while a publish or a wave plan runs.
const globalForPool = globalThis as unknown as { trailbinPool?: RoutingPool };

export function routingPool(): RoutingPool {
  globalForPool.trailbinPool ??= new RoutingPool({ size: 1, defaultTimeoutMs: 120_000 });
  return globalForPool.trailbinPool;
}
