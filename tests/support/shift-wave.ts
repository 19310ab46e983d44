import { expect } from "vitest";
import { randomUUID } from "node:crypto";
import { api, ORIGIN } from "./app";
import { createdWave, planWave } from "./wave-plan";
import { TestOrders } from "./wave-orders";
import type { FloorBatchDTO, FloorDTO } from "@/lib/contracts/shift";

/**
 * A released wave of the test's own: `orders` orders of two lines each, one order per batch (one tote
 * per cart), with cut-offs in March 2024, long before any other test's or the demo's orders, so the
 * wave takes exactly these.
 */
export async function releasedShiftWave(planner: string, tag: string, orders: number, fixtures: TestOrders) {
  const items = await fixtures.itemsOnLayout(2 * orders);
  expect(items.length).toBe(2 * orders);
  for (let i = 0; i < orders; i++)
    await fixtures.addOrder(`${tag}-${i + 1}`, `2024-03-04T0${i % 10}:00:00Z`, [items[2 * i]!, items[2 * i + 1]!]);
  const created = await createdWave(planner, fixtures, {
    name: `Shift ${tag}`,
    cutoffBefore: "2024-03-05T00:00:00Z",
  });
  const waveId = created.body.id as number;
  expect(created.body.orders).toBe(orders);
  const { wave } = await planWave(planner, waveId);
  const release = await api()
    .post(`/api/waves/${waveId}/release`)
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({ version: wave.version });
  expect(release.status, JSON.stringify(release.body)).toBe(200);
  const answer = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body;
  expect(answer.batches).toHaveLength(orders);
  return { waveId, batches: answer.batches as { id: number; number: number; distanceMm: number; lineCount: number }[] };
}

export async function floorOf(cookie: string): Promise<FloorDTO> {
  const res = await api().get("/api/floor").set("Cookie", cookie);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

export async function floorRow(cookie: string, batchId: number): Promise<FloorBatchDTO> {
  const row = (await floorOf(cookie)).batches.find((b) => b.id === batchId);
  expect(row, `batch ${batchId} on the floor`).toBeTruthy();
  return row!;
}

export const assign = (cookie: string, batchId: number, body: Record<string, unknown>) =>
  api().post(`/api/floor/batches/${batchId}/assign`).set("Cookie", cookie).set("Origin", ORIGIN).send(body);

type Line = { orderLineId: number; binCode: string; quantity: number; pickStatus: string };

/** The batch as the picker's handheld loads it: its lines in walking order and the version it saw. */
export async function pickViewOf(cookie: string, batchId: number) {
  const res = await api().get(`/api/batches/${batchId}/pick`).set("Cookie", cookie);
  return {
    status: res.status,
    body: res.body,
    version: res.body?.batch?.version as number,
    lines: (res.body?.stops ?? []).flatMap((s: { lines: Line[] }) => s.lines) as Line[],
  };
}

/** Confirms one line as the handheld does, with the bin and batch version its screen showed. */
export const confirmLine = (cookie: string, batchId: number, line: Line, batchVersion: number) =>
  api().post(`/api/batches/${batchId}/confirm`).set("Cookie", cookie).set("Origin", ORIGIN).send({
    idempotencyKey: randomUUID(),
    orderLineId: line.orderLineId,
    quantity: line.quantity,
    binCode: line.binCode,
    batchVersion,
  });
