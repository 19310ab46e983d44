import "server-only";
import { RoutingPool, WorkerPool } from "@/lib/workers/worker-pool";
import type { BatchingResult } from "@/lib/batching/types";
import type { WaveTask } from "./wave-task";
import { waveTimeLimitMs, waveWorkerMaxHeapMb } from "./settings";

// One worker per kind of work: the machine has two cores, and the other one keeps serving pickers
// while a publish or a wave plan runs.
const globalForPool = globalThis as unknown as {
  trailbinPool?: RoutingPool;
  trailbinWavePool?: WorkerPool<WaveTask, BatchingResult>;
};

export function routingPool(): RoutingPool {
  globalForPool.trailbinPool ??= new RoutingPool({ size: 1, defaultTimeoutMs: 120_000 });
  return globalForPool.trailbinPool;
}

/** Read once per server process: the limits are settings of the running server, not of one job. */
export const WAVE_TIME_LIMIT_MS = waveTimeLimitMs();

export function wavePool(): WorkerPool<WaveTask, BatchingResult> {
  const heap = waveWorkerMaxHeapMb();
  globalForPool.trailbinWavePool ??= new WorkerPool<WaveTask, BatchingResult>({
    kind: "wave planning",
    size: 1,
    defaultTimeoutMs: WAVE_TIME_LIMIT_MS,
    workerPath: "lib/workers/wave-worker.ts",
    ...(heap ? { resourceLimits: { maxOldGenerationSizeMb: heap } } : {}),
  });
  return globalForPool.trailbinWavePool;
}
