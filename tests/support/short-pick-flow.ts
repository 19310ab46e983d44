import { expect } from "vitest";
import { randomUUID } from "node:crypto";
import { api, makeUser, ORIGIN, signIn } from "./app";
import { waitForJob } from "./jobs";
import { db } from "@/db/knex";

// A wave of a test's own orders taken all the way to the floor: created with a cut-off filter that
// only the test's orders match, planned, released, and its batches taken by a fresh picker who
// confirms every line, some of them short.

export const CART = { totesPerCart: 6, maxLines: 40, maxWeightG: 120_000 };

export async function releasedWave(
  planner: string,
  name: string,
  cutoffBefore: string,
  extra: Record<string, unknown> = {},
): Promise<{ waveId: number; orders: number; batches: { id: number; number: number }[] }> {
  const created = await api()
    .post("/api/waves")
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({
      name,
      layoutVersionId: 1,
      settings: { ...CART, depotId: "D1", dropoffId: "P1", method: "first-come" },
      cutoffBefore,
      priorities: [1, 2, 3],
      ...extra,
    });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const waveId = created.body.id as number;
  const wave = async () => (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body;
  const plan = await api()
    .post(`/api/waves/${waveId}/plan`)
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({ version: (await wave()).wave.version });
  expect(plan.status, JSON.stringify(plan.body)).toBe(202);
  const job = await waitForJob(planner, plan.body.jobId);
  expect(job.status, job.message).toBe("done");
  const release = await api()
    .post(`/api/waves/${waveId}/release`)
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({ version: (await wave()).wave.version });
  expect(release.status, JSON.stringify(release.body)).toBe(200);
  return { waveId, orders: created.body.orders, batches: (await wave()).batches };
}

export type PickLine = { orderLineId: number; binCode: string; sku: string; quantity: number; orderNumber: string };

/** A fresh picker takes the batch and confirms every line: `found(line)` is the quantity found (less is a short pick). */
export async function pickBatch(batchId: number, found: (l: PickLine) => number = (l) => l.quantity) {
  const u = await makeUser("picker");
  const cookie = await signIn(u.email, u.password);
  // A picker sees only their own batches: the version to take it at is read from the row.
  const { version } = await db()("batches").where({ id: batchId }).first("version");
  const take = await api()
    .post(`/api/batches/${batchId}/take`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ version });
  expect(take.status, JSON.stringify(take.body)).toBe(200);
  const view = await api().get(`/api/batches/${batchId}/pick`).set("Cookie", cookie);
  expect(view.status, JSON.stringify(view.body)).toBe(200);
  const lines: PickLine[] = view.body.stops.flatMap((s: { lines: PickLine[] }) => s.lines);
  for (const l of lines) {
    const q = found(l);
    const fresh = await api().get(`/api/batches/${batchId}/pick`).set("Cookie", cookie);
    const res = await api()
      .post(`/api/batches/${batchId}/confirm`)
      .set("Cookie", cookie)
      .set("Origin", ORIGIN)
      .send({
        idempotencyKey: randomUUID(),
        orderLineId: l.orderLineId,
        binCode: l.binCode,
        batchVersion: fresh.body.batch.version,
        scan: l.binCode,
        quantity: q,
        ...(q < l.quantity ? { short: { reason: "empty bin" } } : {}),
      });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  }
  return { picker: u, cookie, lines };
}
