import { expect } from "vitest";
import { api, ORIGIN } from "./app";
import { waitForJob } from "./jobs";
import type { TestOrders } from "./wave-orders";
import type { WaveSettings } from "@/lib/contracts/waves";

/** One tote a cart, small limits, the demo layout's depot and drop-off: what a test's wave uses unless it says. */
export const TEST_CART: WaveSettings = {
  totesPerCart: 1,
  maxLines: 12,
  maxWeightG: 60_000,
  depotId: "D1",
  dropoffId: "P1",
  method: "first-come",
};

/**
 * Starts a wave on layout version 1 with every priority, up to `cutoffBefore`, as the planner does;
 * a wave made goes on `fixtures.waveIds` for cleanUp. The answer is the caller's to check.
 */
export async function postWave(
  planner: string,
  fixtures: TestOrders,
  wave: { name: string; cutoffBefore: string; settings?: Partial<WaveSettings> },
) {
  const res = await api()
    .post("/api/waves")
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({
      name: wave.name,
      layoutVersionId: 1,
      settings: { ...TEST_CART, ...wave.settings },
      cutoffBefore: wave.cutoffBefore,
      priorities: [1, 2, 3],
    });
  if (res.status === 201) fixtures.waveIds.push(res.body.id);
  return res;
}

/** As postWave, and the wave must be made: its id. */
export async function createdWave(planner: string, fixtures: TestOrders, wave: Parameters<typeof postWave>[2]) {
  const res = await postWave(planner, fixtures, wave);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res;
}

/** Plans the wave at the version it is at and waits for the job to finish; the wave's answer afterwards. */
export async function planWave(planner: string, waveId: number) {
  const wave = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.wave;
  const start = await api()
    .post(`/api/waves/${waveId}/plan`)
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({ version: wave.version });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(planner, start.body.jobId);
  expect(job.status, job.message).toBe("done");
  return (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body;
}
