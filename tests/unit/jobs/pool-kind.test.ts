import { describe, expect, it } from "vitest";
import { RoutingPool, TaskError, WorkerPool } from "../../../lib/workers/worker-pool";

// A pool's errors name what its workers do: a wave plan must not fail with "routing worker crashed".
describe("a pool's crash names its kind", () => {
  const crash = "tests/routing/fixtures/crash-worker.ts";

  it("a wave planning pool says wave planning", async () => {
    const pool = new WorkerPool<{ n: number }, number>({ kind: "wave planning", workerPath: crash });
    try {
      const err = await pool.run({ n: 1 }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(TaskError);
      expect((err as TaskError).reason).toBe("crashed");
      expect((err as TaskError).message).toMatch(/^wave planning worker exited with code 3$/);
    } finally {
      await pool.close();
    }
    expect((await pool.run({ n: 2 }).catch((e: unknown) => e)) as TaskError).toMatchObject({
      reason: "closed",
      message: "the wave planning pool is closed",
    });
  });

  it("the routing pool still says routing", async () => {
    const pool = new RoutingPool({ workerPath: crash });
    try {
      const err = (await pool
        .run({ kind: "floyd-warshall", graph: { nodes: [], edges: [] } as never })
        .catch((e: unknown) => e)) as TaskError;
      expect(err.message).toMatch(/^routing worker exited with code 3$/);
    } finally {
      await pool.close();
    }
  });
});
