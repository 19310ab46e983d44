import { afterAll, describe, expect, it } from "vitest";
import {
  buildGraph,
  floydWarshall,
  generateWarehouse,
  sequenceStops,
  UNREACHABLE,
  UnreachableStopError,
} from "../../lib/routing";
import { TaskError as RoutingJobError, RoutingPool } from "../../lib/workers/worker-pool";
import { randomInstance } from "./helpers/instances";

const pool = new RoutingPool({ size: 1, defaultTimeoutMs: 30_000 });
afterAll(() => pool.close());

const stops = (m: number) => Array.from({ length: m }, (_, i) => i + 2);

describe("RoutingPool", () => {
  it("runs a sequencing job in a worker with the same result as in-thread", async () => {
    const matrix = randomInstance(14, 42, false);
    const request = { start: 0, end: 1, stops: stops(12) };
    expect(await pool.run({ kind: "sequence", matrix, request })).toEqual(sequenceStops(matrix, request));
  });

  it("runs Floyd–Warshall jobs and reports progress", async () => {
    const graph = buildGraph(generateWarehouse({ aisles: 6, positions: 8, levels: 2, crossAisles: 3 }));
    const progress: number[] = [];
    const dm = await pool.run({ kind: "floyd-warshall", graph }, { onProgress: (f) => progress.push(f) });
    expect(Array.from(dm.dist)).toEqual(Array.from(floydWarshall(graph).dist));
    expect(progress.length).toBeGreaterThan(1);
    expect(progress.at(-1)).toBe(1);
  });

  it("returns the engine's typed error for an unreachable stop", async () => {
    const matrix = randomInstance(5, 1, false);
    for (let i = 0; i < 5; i++) if (i !== 3) matrix.cost[i * 5 + 3] = UNREACHABLE;
    const err = await pool
      .run({ kind: "sequence", matrix, request: { start: 0, end: 1, stops: [2, 3, 4] } })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(UnreachableStopError);
    expect((err as UnreachableStopError).stops).toEqual([3]);
  });

  it("times out a long job, replaces the worker and keeps serving", async () => {
    const matrix = randomInstance(24, 5, false);
    const err = await pool
      .run(
        { kind: "sequence", matrix, request: { start: 0, end: 1, stops: stops(22), exactLimit: 22 } },
        { timeoutMs: 300 },
      )
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RoutingJobError);
    expect((err as RoutingJobError).reason).toBe("timeout");
    const small = randomInstance(6, 5, true);
    expect(
      (await pool.run({ kind: "sequence", matrix: small, request: { start: 0, end: 0, stops: stops(4) } })).optimal,
    ).toBe(true);
  });

  it("cancels a running job and a queued one", async () => {
    const matrix = randomInstance(24, 6, false);
    const ac = new AbortController();
    const running = pool.run(
      { kind: "sequence", matrix, request: { start: 0, end: 1, stops: stops(22), exactLimit: 22 } },
      { signal: ac.signal, onProgress: () => ac.abort() },
    );
    const queued = pool.run(
      { kind: "sequence", matrix, request: { start: 0, end: 1, stops: stops(8) } },
      { signal: ac.signal },
    );
    const [a, b] = await Promise.all([running.catch((e: unknown) => e), queued.catch((e: unknown) => e)]);
    expect((a as RoutingJobError).reason).toBe("cancelled");
    expect((b as RoutingJobError).reason).toBe("cancelled");
  });

  it("reports a crashed worker as a typed error", async () => {
    const crashing = new RoutingPool({ workerPath: "tests/routing/fixtures/crash-worker.ts" });
    try {
      const err = await crashing
        .run({ kind: "sequence", matrix: randomInstance(4, 1, true), request: { start: 0, end: 0, stops: [1, 2] } })
        .catch((e: unknown) => e);
      expect(err).toBeInstanceOf(RoutingJobError);
      expect((err as RoutingJobError).reason).toBe("crashed");
    } finally {
      await crashing.close();
    }
  });
});
