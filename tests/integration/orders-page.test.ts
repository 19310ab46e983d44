import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { TestOrders } from "../support/wave-orders";
import { CART, releasedWave } from "../support/short-pick-flow";
import type { OrderDTO } from "@/lib/contracts/orders";

// Orders of this file's own with cut-offs on 19 January 2026 (after the other wave tests' January
// days, long before the demo week), one far in the future, and one without any cut-off.
const TAG = `O${Date.now().toString(36).toUpperCase()}`;
const CUTOFF = "2026-01-19T08:00:00Z";
const WINDOW = "2026-01-19T23:00:00Z";

const fixtures = new TestOrders();
let planner: string;
let supervisor: string;
let picker: string;
let inWave: number;
let late: number;
let future: number;
let noCutoff: number;
let waveId: number;

const preview = (query: string) =>
  api().get(`/api/waves/preview?layoutVersionId=1&priorities=1,2,3&${query}`).set("Cookie", planner);

beforeAll(async () => {
  [planner, supervisor, picker] = await Promise.all([signInAs("planner"), signInAs("supervisor"), signInAs("picker")]);
  const items = await fixtures.itemsOnLayout(2);
  inWave = await fixtures.addOrder(`${TAG}-WAVE`, CUTOFF, items);
  const wave = await releasedWave(planner, `Orders page ${TAG}`, WINDOW);
  waveId = wave.waveId;
  fixtures.waveIds.push(waveId);
  late = await fixtures.addOrder(`${TAG}-LATE`, CUTOFF, [items[0]!]);
  future = await fixtures.addOrder(`${TAG}-FUTURE`, "2030-06-01T08:00:00Z", [items[0]!]);
  noCutoff = await fixtures.addOrder(`${TAG}-NOCUT`, CUTOFF, [items[1]!]);
  await db()("orders").where({ id: noCutoff }).update({ cutoff_at: null });
}, 120_000);

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

describe("the order page", () => {
  it("shows an order's lines with their bin, batch and wave, pick status and cut-off", async () => {
    const res = await api().get(`/api/orders/${inWave}`).set("Cookie", supervisor);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const o = res.body.order;
    expect(o).toMatchObject({
      orderNumber: `${TAG}-WAVE`,
      status: "released",
      pickState: "to-pick",
      cutoffAt: new Date(CUTOFF).toISOString(),
      overdue: true,
      wave: { id: waveId, name: `Orders page ${TAG}` },
    });
    expect(o.lines).toHaveLength(2);
    for (const l of o.lines) {
      expect(l.binCode).toMatch(/\S/);
      expect(l.batch).toMatchObject({ waveId, number: 1 });
      expect(l.pickStatus).toBe("open");
    }
    const batchLines = await db()("batch_lines")
      .whereIn(
        "order_line_id",
        o.lines.map((l: { id: number }) => l.id),
      )
      .orderBy("order_line_id")
      .pluck("bin_code");
    expect(o.lines.map((l: { binCode: string }) => l.binCode)).toEqual(batchLines);

    const page = await api().get(`/orders/${inWave}`).set("Cookie", planner);
    expect(page.status).toBe(200);
    const text = page.text.replace(/<!-- -->/g, "");
    expect(text).toContain(`Order ${TAG}-WAVE`);
    expect(text).toContain("Overdue");
    expect(text).toContain(`href="/waves/${waveId}/batches/1"`);
    expect(text).toContain(`href="/waves/${waveId}"`);
  });

  it("says when an order is in no wave and has no cut-off, and refuses orders that do not exist", async () => {
    const o = (await api().get(`/api/orders/${noCutoff}`).set("Cookie", planner)).body.order;
    expect(o).toMatchObject({ status: "open", wave: null, cutoffAt: null, overdue: false, pickState: null });
    expect(o.lines[0].batch).toBeNull();
    const page = await api().get(`/orders/${noCutoff}`).set("Cookie", planner);
    expect(page.text.replace(/<!-- -->/g, "")).toContain("No cut-off");
    expect((await api().get("/api/orders/999999999").set("Cookie", planner)).status).toBe(404);
    expect((await api().get("/orders/999999999").set("Cookie", planner)).status).toBe(404);
    expect((await api().get(`/api/orders/${inWave}`).set("Cookie", picker)).status).toBe(403);
    expect((await api().get(`/api/orders/${inWave}`)).status).toBe(401);
  });

  it("the orders list flags overdue cut-offs only on orders not yet picked", async () => {
    const res = await api().get("/api/orders?status=all").set("Cookie", planner);
    expect(res.status).toBe(200);
    const byId = new Map((res.body.orders as OrderDTO[]).map((o) => [o.id, o]));
    expect(byId.get(late)!.overdue).toBe(true);
    expect(byId.get(inWave)!.overdue).toBe(true);
    expect(byId.get(future)!.overdue).toBe(false);
    expect(byId.get(noCutoff)!.overdue).toBe(false);
    expect(byId.get(inWave)!.pickState).toBe("to-pick");
    expect(byId.get(late)!.pickState).toBeNull();
  });
});

describe("orders without a cut-off in the new-wave filter", () => {
  it("are counted when a cut-off filter leaves them out, and taken when the planner includes them", async () => {
    const left = await preview(`cutoffBefore=${WINDOW}`);
    expect(left.status, JSON.stringify(left.body)).toBe(200);
    // LATE is the one open order up to that cut-off; NOCUT is counted apart, with every other order lacking one.
    expect(left.body.orders).toBe(1);
    const without = left.body.ordersWithoutCutoff as number;
    expect(without).toBeGreaterThanOrEqual(1);
    const taken = await preview(`cutoffBefore=${WINDOW}&includeNoCutoff=1`);
    expect(taken.body.orders).toBe(1 + without);
    expect(taken.body.ordersWithoutCutoff).toBe(without);
    // Without a cut-off filter every open order is counted, those without one among them.
    const all = await preview("");
    expect(all.body.orders).toBeGreaterThanOrEqual(3);
    expect(all.body.ordersWithoutCutoff).toBe(without);
    expect((await preview(`cutoffBefore=${WINDOW}&includeNoCutoff=yes`)).status).toBe(400);
  });

  it("a wave with a cut-off takes them only when asked to", async () => {
    const create = (extra: Record<string, unknown>) =>
      api()
        .post("/api/waves")
        .set("Cookie", planner)
        .set("Origin", ORIGIN)
        .send({
          name: `No cut-off ${TAG}`,
          layoutVersionId: 1,
          settings: { ...CART, depotId: "D1", dropoffId: "P1", method: "first-come" },
          cutoffBefore: WINDOW,
          priorities: [1, 2, 3],
          ...extra,
        });
    const discard = async (id: number) => {
      const { wave } = (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body;
      const res = await api()
        .post(`/api/waves/${id}/discard`)
        .set("Cookie", planner)
        .set("Origin", ORIGIN)
        .send({ version: wave.version });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    };
    const wavesOf = (orderId: number) => db()("wave_orders").where({ order_id: orderId }).pluck("wave_id");

    const plain = await create({});
    expect(plain.status, JSON.stringify(plain.body)).toBe(201);
    fixtures.waveIds.push(plain.body.id);
    expect(plain.body.orders).toBe(1);
    expect(await wavesOf(late)).toEqual([plain.body.id]);
    expect(await wavesOf(noCutoff)).toEqual([]);
    await discard(plain.body.id);

    const expected = (await preview(`cutoffBefore=${WINDOW}&includeNoCutoff=1`)).body.orders;
    const withThem = await create({ includeNoCutoff: true });
    expect(withThem.status, JSON.stringify(withThem.body)).toBe(201);
    fixtures.waveIds.push(withThem.body.id);
    expect(withThem.body.orders).toBe(expected);
    expect(await wavesOf(noCutoff)).toEqual([withThem.body.id]);
    expect(await wavesOf(future)).toEqual([]);
    // Handing them all back leaves the other orders without a cut-off open, as they were.
    await discard(withThem.body.id);
    expect((await db()("orders").where({ id: noCutoff }).first("status")).status).toBe("open");
  });
});
