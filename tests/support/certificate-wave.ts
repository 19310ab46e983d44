import { expect } from "vitest";
import { api, ORIGIN } from "./app";
import { createWave } from "@/db/waves";
import { waitForJob } from "./jobs";
import type { TestOrders } from "./wave-orders";

/**
 * A planned wave of two batches: two small orders Held–Karp proves (one cart, first by cut-off), and
 * one of 30 lines spread over the floor on a cart of its own (32 lines a cart), more stops than the
 * exact limit, so its certificate is the long kind.
 */
export async function plannedCertificateWave(fixtures: TestOrders, planner: string, tag: string): Promise<number> {
  const plannerId = (await api().get("/api/session").set("Cookie", planner)).body.user.id;
  const items = await fixtures.itemsOnLayout(120);
  const ids = [
    await fixtures.addOrder(`${tag}-1`, "2026-02-10T09:00:00Z", [items[3]!, items[40]!]),
    await fixtures.addOrder(`${tag}-2`, "2026-02-10T09:00:00Z", [items[90]!, items[102]!, items[110]!]),
    await fixtures.addOrder(
      `${tag}-BIG`,
      "2026-02-10T10:00:00Z",
      items.filter((_, i) => i % 4 === 1),
    ),
  ];
  const settings = {
    totesPerCart: 3,
    maxLines: 32,
    maxWeightG: 500_000,
    method: "first-come" as const,
    depotId: "D1",
    dropoffId: "P1",
  };
  const waveId = await createWave(
    await fixtures.siteId(),
    { name: `Certificate test ${tag}`, layoutVersionId: 1, settings, orderIds: ids },
    plannerId,
  );
  fixtures.waveIds.push(waveId);
  const start = await api()
    .post(`/api/waves/${waveId}/plan`)
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({ version: 1 });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(planner, start.body.jobId);
  expect(job.status, job.message).toBe("done");
  return waveId;
}
