import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { TestOrders } from "../support/wave-orders";
import { pickBatch, releasedWave } from "../support/short-pick-flow";
import type { ShortPickRowDTO } from "@/lib/contracts/short-picks";

// Orders of this file's own with cut-offs on 12 January 2026 (after the unbatched test's 5 January,
// long before the demo week), so a wave "up to 12 January" takes exactly these.
const TAG = `S${Date.now().toString(36).toUpperCase()}`;
const CUTOFF = "2026-01-12T08:00:00Z";
const WINDOW = "2026-01-12T23:00:00Z";

const fixtures = new TestOrders();
let planner: string;
let supervisor: string;
let picker: string;
let waveId: number;
const orderOf: Record<string, number> = {};
let shorts: ShortPickRowDTO[];

const followUp = (cookie: string, lineId: number, action: string, version: number) =>
  api()
    .post(`/api/short-picks/${lineId}/follow-up`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ action, version });
const orderDetail = async (id: number) => (await api().get(`/api/orders/${id}`).set("Cookie", planner)).body.order;
const list = async (query = "") => {
  const res = await api().get(`/api/short-picks${query}`).set("Cookie", supervisor);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
};
const shortOf = (orderNumber: string) => shorts.find((s) => s.orderNumber === orderNumber)!;

beforeAll(async () => {
  [planner, supervisor, picker] = await Promise.all([signInAs("planner"), signInAs("supervisor"), signInAs("picker")]);
  const items = await fixtures.itemsOnLayout(2);
  // REPICK: 2 lines, the second short; REPLENISH, CANCEL, RACE: one short line each; FULL: picked in full.
  for (const name of ["REPICK", "REPLENISH", "CANCEL", "RACE", "FULL"])
    orderOf[name] = await fixtures.addOrder(`${TAG}-${name}`, CUTOFF, name === "REPICK" ? items : [items[0]!]);
  await db()("order_lines").whereIn("order_id", Object.values(orderOf)).update({ quantity: 5 });
  const wave = await releasedWave(planner, `Short picks ${TAG}`, WINDOW);
  waveId = wave.waveId;
  fixtures.waveIds.push(waveId);
  expect(wave.orders).toBe(5);
  // The second line of REPICK and the only line of the others come up 2 short (3 of 5 found).
  const shortLines = new Set(
    (
      await db()("order_lines")
        .whereIn("order_id", [orderOf.REPLENISH!, orderOf.CANCEL!, orderOf.RACE!])
        .orWhere((w) => w.where({ order_id: orderOf.REPICK!, line_no: 2 }))
        .pluck("id")
    ).map(Number),
  );
  for (const b of wave.batches) await pickBatch(b.id, (l) => (shortLines.has(l.orderLineId) ? 3 : l.quantity));
  shorts = (await list(`?waveId=${waveId}`)).shortPicks;
}, 120_000);

afterAll(async () => {
  // Re-pick orders go with their originals (the foreign key cascades); their waves first.
  const repickWaves = await db()("wave_orders as wo")
    .join("orders as o", "o.id", "wo.order_id")
    .whereIn("o.parent_order_id", fixtures.orderIds)
    .pluck("wo.wave_id");
  fixtures.waveIds.push(...repickWaves.map(Number));
  if (shorts?.length)
    await db()("bin_replenishments")
      .whereIn(
        "order_line_id",
        shorts.map((s) => s.lineId),
      )
      .delete();
  await fixtures.cleanUp();
  await closeDb();
});

describe("the shift's short picks", () => {
  it("lists each short pick of the day with order, SKU, bin, quantity short, reason, picker and time", async () => {
    expect(shorts.map((s) => s.orderNumber).sort()).toEqual(
      [`${TAG}-CANCEL`, `${TAG}-RACE`, `${TAG}-REPICK`, `${TAG}-REPLENISH`].sort(),
    );
    const s = shortOf(`${TAG}-REPICK`);
    expect(s).toMatchObject({ ordered: 5, picked: 3, short: 2, reason: "empty bin", followUp: null, version: 1 });
    expect(s.binCode).toMatch(/\S/);
    expect(s.sku).toMatch(/\S/);
    expect(s.pickerName).toMatch(/^Test /);
    expect(Date.now() - new Date(s.at!).getTime()).toBeLessThan(10 * 60_000);
    // Today is the default day; another day does not show them; the wave filter offers this wave.
    const today = await list();
    expect(today.shortPicks.map((x: ShortPickRowDTO) => x.lineId)).toEqual(
      expect.arrayContaining(shorts.map((x) => x.lineId)),
    );
    expect(today.waves).toContainEqual({ id: waveId, name: `Short picks ${TAG}` });
    const before = await list("?date=2025-06-01");
    expect(before.date).toBe("2025-06-01");
    expect(before.shortPicks.some((x: ShortPickRowDTO) => x.orderNumber.startsWith(TAG))).toBe(false);
    expect((await api().get("/api/short-picks?date=2026-02-30").set("Cookie", supervisor)).status).toBe(400);
  });

  it("an order with a short pick and no follow-up is picked short; one picked in full is picked", async () => {
    expect((await orderDetail(orderOf.CANCEL!)).pickState).toBe("short");
    const full = await orderDetail(orderOf.FULL!);
    expect(full.pickState).toBe("picked");
    expect(full.overdue).toBe(false);
  });

  it("re-pick later opens a re-pick order with the remaining quantity that a new wave plans; a resend does it once", async () => {
    const s = shortOf(`${TAG}-REPICK`);
    const res = await followUp(supervisor, s.lineId, "repick", s.version);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.shortPick).toMatchObject({ followUp: "repick", version: 2 });
    expect(res.body.shortPick.repickOrder.orderNumber).toBe(`${TAG}-REPICK-R1`);
    const again = await followUp(supervisor, s.lineId, "repick", s.version);
    expect(again.status).toBe(200);
    expect(again.headers["idempotent-replayed"]).toBe("true");
    expect(again.body.shortPick.repickOrder).toEqual(res.body.shortPick.repickOrder);
    const children = await db()("orders").where({ parent_order_id: orderOf.REPICK! }).count({ n: "*" }).first();
    expect(Number(children!.n)).toBe(1);

    const repick = await orderDetail(res.body.shortPick.repickOrder.id);
    expect(repick).toMatchObject({ status: "open", parent: { id: orderOf.REPICK!, orderNumber: `${TAG}-REPICK` } });
    expect(repick.cutoffAt).toBe(new Date(CUTOFF).toISOString());
    expect(repick.lines).toHaveLength(1);
    expect(repick.lines[0]).toMatchObject({
      sku: s.sku,
      quantity: 2,
      repickOf: { orderNumber: `${TAG}-REPICK`, lineNo: 2 },
    });
    const original = await orderDetail(orderOf.REPICK!);
    expect(original.pickState).toBe("awaiting-repick");
    expect(original.overdue).toBe(true);
    expect(original.lines[1]).toMatchObject({ followUp: "repick", repickOrder: res.body.shortPick.repickOrder });

    // A later wave takes it (and only it) into a batch of its own, and picking it finishes the original.
    const second = await releasedWave(planner, `Re-pick ${TAG}`, WINDOW);
    fixtures.waveIds.push(second.waveId);
    expect(second.orders).toBe(1);
    expect(second.batches).toHaveLength(1);
    const { lines } = await pickBatch(second.batches[0]!.id);
    expect(lines.map((l) => [l.orderNumber, l.quantity])).toEqual([[`${TAG}-REPICK-R1`, 2]]);
    expect((await orderDetail(res.body.shortPick.repickOrder.id)).pickState).toBe("picked");
    const done = await orderDetail(orderOf.REPICK!);
    expect(done.pickState).toBe("picked");
    expect(done.overdue).toBe(false);
  });

  it("flagging the bin lists it for replenishment until someone clears the flag", async () => {
    const s = shortOf(`${TAG}-REPLENISH`);
    const res = await followUp(planner, s.lineId, "replenish", s.version);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.shortPick.replenishAt).not.toBeNull();
    // The line still waits for its outcome: flagging the bin is not one.
    expect(res.body.shortPick.followUp).toBeNull();
    expect((await orderDetail(orderOf.REPLENISH!)).pickState).toBe("short");
    const flags = (await list()).replenishments.filter((r: { binCode: string }) => r.binCode === s.binCode);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ sku: s.sku });
    expect((await orderDetail(orderOf.REPLENISH!)).lines[0].replenishFlagged).toBe(true);
    // A screen loaded before the flag is refused for another follow-up, naming what changed.
    const stale = await followUp(supervisor, s.lineId, "cancel", s.version);
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/changed since you loaded.*flagged the bin/);

    const clear = (cookie: string) =>
      api()
        .post(`/api/replenishments/${flags[0].id}/clear`)
        .set("Cookie", cookie)
        .set("Origin", ORIGIN)
        .send({ version: flags[0].version });
    expect((await clear(supervisor)).status).toBe(200);
    const resent = await clear(supervisor);
    expect(resent.status).toBe(200);
    expect(resent.headers["idempotent-replayed"]).toBe("true");
    const other = await clear(planner);
    expect(other.status).toBe(409);
    expect(other.body.error).toMatch(/already cleared the flag on bin/);
    expect((await list()).replenishments.some((r: { id: number }) => r.id === flags[0].id)).toBe(false);
  });

  it("cancelling the line completes the order short, and it is no longer overdue", async () => {
    const s = shortOf(`${TAG}-CANCEL`);
    const res = await followUp(supervisor, s.lineId, "cancel", s.version);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.shortPick.followUp).toBe("cancel");
    const order = await orderDetail(orderOf.CANCEL!);
    expect(order).toMatchObject({ pickState: "completed-short", overdue: false, repickOrders: [] });
    // The outcome is final: re-pick afterwards is refused with who cancelled it.
    const later = await followUp(planner, s.lineId, "repick", res.body.shortPick.version);
    expect(later.status).toBe(409);
    expect(later.body.error).toMatch(/already cancelled the rest of the line/);
  });

  it("two people choosing at once: one wins, the other gets 409 and nothing of theirs is kept", async () => {
    const s = shortOf(`${TAG}-RACE`);
    const [a, b] = await Promise.all([
      followUp(supervisor, s.lineId, "repick", s.version),
      followUp(planner, s.lineId, "cancel", s.version),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? a : b;
    const loser = a.status === 200 ? b : a;
    expect(loser.body.error).toMatch(/already (chose to re-pick|cancelled)/);
    const row = await db()("batch_lines").where({ order_line_id: s.lineId }).first("follow_up", "follow_up_version");
    expect(row).toEqual({ follow_up: winner.body.shortPick.followUp, follow_up_version: 2 });
    const children = await db()("orders").where({ parent_order_id: orderOf.RACE! }).count({ n: "*" }).first();
    expect(Number(children!.n)).toBe(winner.body.shortPick.followUp === "repick" ? 1 : 0);
  });

  it("refuses lines that were not short, lines that do not exist, and bad actions", async () => {
    const picked = await db()("order_lines").where({ order_id: orderOf.FULL! }).first("id");
    const notShort = await followUp(supervisor, picked.id, "cancel", 1);
    expect(notShort.status).toBe(409);
    expect(notShort.body.error).toMatch(/not picked short/);
    expect((await followUp(supervisor, 999_999_999, "cancel", 1)).status).toBe(404);
    const bad = await followUp(supervisor, picked.id, "ignore", 1);
    expect(bad.status).toBe(400);
  });

  it("only people who follow up short picks may see or change them", async () => {
    const s = shortOf(`${TAG}-RACE`);
    expect((await api().get("/api/short-picks").set("Cookie", picker)).status).toBe(403);
    expect((await followUp(picker, s.lineId, "cancel", 1)).status).toBe(403);
    expect((await api().get("/api/short-picks")).status).toBe(401);
    const foreign = await api()
      .post(`/api/short-picks/${s.lineId}/follow-up`)
      .set("Cookie", supervisor)
      .set("Origin", "http://elsewhere.example")
      .send({ action: "cancel", version: 1 });
    expect(foreign.status).toBe(403);
    const page = await api().get("/short-picks").set("Cookie", supervisor);
    expect(page.status).toBe(200);
    expect((await api().get("/short-picks").set("Cookie", picker)).status).toBe(403);
  });
});
