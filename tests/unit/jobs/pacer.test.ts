import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { progressPacer, type Progress } from "../../../lib/jobs/pacer";

beforeEach(() => void vi.useFakeTimers());
afterEach(() => void vi.useRealTimers());

function recorder(running = true) {
  const writes: (Progress & { at: number })[] = [];
  let ended = 0;
  const pacer = progressPacer(
    async (p) => {
      writes.push({ ...p, at: Date.now() });
      return running;
    },
    () => void ended++,
    500,
  );
  return { pacer, writes, ended: () => ended };
}

describe("progress pacing", () => {
  it("writes the first report at once, then at most one per interval, and the latest one last", async () => {
    const { pacer, writes } = recorder();
    const t0 = Date.now();
    for (let i = 0; i <= 100; i++) {
      pacer.report(i / 100, i < 50 ? "first half" : undefined);
      await vi.advanceTimersByTimeAsync(20);
    }
    await vi.advanceTimersByTimeAsync(1000);
    // 2 s of reports every 20 ms: the first write, then one per 500 ms.
    expect(writes.length).toBeLessThanOrEqual(6);
    expect(writes[0]).toMatchObject({ fraction: 0, message: "first half", at: t0 });
    for (let i = 1; i < writes.length; i++) expect(writes[i]!.at - writes[i - 1]!.at).toBeGreaterThanOrEqual(500);
    expect(writes.at(-1)!.fraction).toBe(1);
  });

  it("keeps a stage's message when later reports give only a fraction", async () => {
    const { pacer, writes } = recorder();
    pacer.report(0.1, "Storing");
    pacer.report(0.2, "Routing");
    pacer.report(0.3);
    await vi.advanceTimersByTimeAsync(600);
    expect(writes.map((w) => [w.fraction, w.message])).toEqual([
      [0.1, "Storing"],
      [0.3, "Routing"],
    ]);
  });

  it("stops the work when a write finds the job no longer running", async () => {
    const { pacer, ended } = recorder(false);
    pacer.report(0.5);
    await vi.advanceTimersByTimeAsync(0);
    expect(ended()).toBe(1);
  });

  it("writes nothing after stop, not even a report waiting for its turn", async () => {
    const { pacer, writes, ended } = recorder(false);
    pacer.report(0.1);
    pacer.report(0.2);
    pacer.stop();
    await vi.advanceTimersByTimeAsync(1000);
    expect(writes.map((w) => w.fraction)).toEqual([0.1]);
    expect(ended(), "a job that is finishing is not stopped by its own late write").toBe(0);
  });
});
