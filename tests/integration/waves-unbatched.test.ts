import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { planWave, postWave } from "../support/wave-plan";
import { TestOrders } from "../support/wave-orders";

// Orders of this file's own, with cut-offs in early January 2026 (long before the demo week and the
// import tests' July orders), so a wave "up to this cut-off" takes exactly these and nothing else.
const TAG = `U${Date.now().toString(36).toUpperCase()}`;
const LIMITS = { totesPerCart: 1, maxLines: 12, maxWeightG: 60_000 };
const OFF_LAYOUT = Array.from({ length: 23 }, (_, i) => `ZZ-${TAG}-${i + 1}`);

let planner: string;
const fixtures = new TestOrders();
const { orderIds } = fixtures;
const addItem = fixtures.addItem.bind(fixtures);
const addOrder = fixtures.addOrder.bind(fixtures);
const itemsOnLayout = fixtures.itemsOnLayout.bind(fixtures);

const newWave = (cutoffBefore: string) =>
  postWave(planner, fixtures, {
    name: `Unbatched test ${TAG} ${cutoffBefore}`,
    cutoffBefore,
    settings: { ...LIMITS, depotId: "D1", dropoffId: "P1", method: "first-come" },
  });

const plan = (id: number) => planWave(planner, id);

beforeAll(async () => {
  planner = await signInAs("planner");
});

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

describe("orders no batch holds", () => {
  let waveId: number;
  let good: number;
  const offLayout: number[] = [];
  let noBin: number;
  let preview: Awaited<ReturnType<typeof newWave>>;
  let created: Awaited<ReturnType<typeof newWave>>;
  let narrow: Awaited<ReturnType<typeof newWave>>;

  beforeAll(async () => {
    const [onLayout] = await itemsOnLayout(1);
    good = await addOrder(`${TAG}-GOOD`, "2026-01-05T08:00:00Z", [onLayout!]);
    for (const [i, bin] of OFF_LAYOUT.entries()) {
      const item = await addItem(`${TAG}-OFF-${i + 1}`, [bin, `${bin}B`]);
      offLayout.push(await addOrder(`${TAG}-OFF-${i + 1}`, "2026-01-05T09:00:00Z", [onLayout!, item]));
    }
    noBin = await addOrder(`${TAG}-NOBIN`, "2026-01-05T10:00:00Z", [await addItem(`${TAG}-NOBIN`, [])]);
    preview = await api()
      .get("/api/waves/preview?layoutVersionId=1&cutoffBefore=2026-01-06T00:00:00Z&priorities=1,2,3")
      .set("Cookie", planner);
    narrow = await api()
      .get("/api/waves/preview?layoutVersionId=1&cutoffBefore=2026-01-05T08:30:00Z&priorities=1,2,3")
      .set("Cookie", planner);
    created = await newWave("2026-01-06T00:00:00Z");
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    waveId = created.body.id;
  });

  it("the new-wave preview says how many orders the filter takes and warns of lines whose bins are not on the layout version", async () => {
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    expect(preview.body).toMatchObject({ orders: 25, lines: 1 + 23 * 2 + 1, offLayout: { lines: 24, orders: 24 } });
    expect(preview.body.offLayout.examples[0]).toMatchObject({
      orderNumber: `${TAG}-OFF-1`,
      sku: `${TAG}-OFF-1`,
      binCodes: [OFF_LAYOUT[0], `${OFF_LAYOUT[0]}B`],
    });
    // What the preview counted is what starting the wave took.
    expect(created.body.orders).toBe(preview.body.orders);
    // A narrower filter follows: only the first order's cut-off.
    expect(narrow.body).toMatchObject({ orders: 1, offLayout: { lines: 0, orders: 0 } });
    const bad = await api().get("/api/waves/preview?layoutVersionId=1&cutoffBefore=yesterday").set("Cookie", planner);
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/cut-off/i);
  });

  it("the reason names the bins that are not on the layout version and the item without any bin", async () => {
    const { wave, batches } = await plan(waveId);
    expect(batches.length).toBe(1);
    const reasonOf = (id: number) =>
      wave.unbatchable.find((u: { orderId: number }) => u.orderId === id)?.reason as string;
    expect(wave.unbatchable).toHaveLength(24);
    const off = reasonOf(offLayout[0]!);
    expect(off).toContain(OFF_LAYOUT[0]);
    expect(off).toContain(`${TAG}-OFF-1`);
    expect(off).not.toMatch(/from ,|from \.|picks from\s*,/);
    expect(reasonOf(noBin)).toMatch(new RegExp(`${TAG}-NOBIN has no pick bin`));
  });

  it("the wave page lists every order no batch holds, with their count, not only the first 20", async () => {
    const page = await api().get(`/waves/${waveId}`).set("Cookie", planner);
    expect(page.status).toBe(200);
    const text = page.text.replace(/<!-- -->/g, "");
    expect(text).toContain("24 orders could not be batched");
    for (let i = 1; i <= 23; i++) expect(text).toContain(`${TAG}-OFF-${i}<`);
    expect(text).toContain(OFF_LAYOUT[22]);
    expect(text).toMatch(/go back to open orders/);
  });

  it("release sends them back to open with the reason kept, releases only the batched one, and a new wave can take them", async () => {
    const before = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.wave;
    const res = await api()
      .post(`/api/waves/${waveId}/release`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: before.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const statuses = Object.fromEntries(
      (await db()("orders").whereIn("id", orderIds).select("id", "status")).map((o: { id: number; status: string }) => [
        o.id,
        o.status,
      ]),
    );
    expect(statuses[good]).toBe("released");
    for (const id of [...offLayout, noBin]) expect(statuses[id]).toBe("open");

    const open = (await api().get("/api/orders?status=open").set("Cookie", planner)).body.orders as {
      id: number;
      note: string | null;
    }[];
    const back = open.find((o) => o.id === offLayout[0]);
    expect(back?.note).toContain(OFF_LAYOUT[0]);
    expect(back?.note).toContain(before.name);

    // The released wave still shows them, and says where they went.
    const after = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.wave;
    expect(after.unbatchable).toHaveLength(24);
    const page = (await api().get(`/waves/${waveId}`).set("Cookie", planner)).text.replace(/<!-- -->/g, "");
    expect(page).toMatch(/went back to open orders/);

    const again = await newWave("2026-01-06T00:00:00Z");
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(again.body.orders).toBe(24);
  });
});

describe("a wave none of whose orders could be batched", () => {
  it("is not stuck: releasing it hands every order back to open, and no 'wave released' mail goes out for it", async () => {
    const ids = [
      await addOrder(`${TAG}-ALLOFF-1`, "2026-01-03T08:00:00Z", [await addItem(`${TAG}-ALLOFF-1`, [`ZZ-${TAG}-A1`])]),
      await addOrder(`${TAG}-ALLOFF-2`, "2026-01-03T09:00:00Z", [await addItem(`${TAG}-ALLOFF-2`, [])]),
    ];
    const created = await newWave("2026-01-03T12:00:00Z");
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const { wave, batches } = await plan(created.body.id);
    expect(batches).toEqual([]);
    expect(wave.unbatchable).toHaveLength(2);
    const res = await api()
      .post(`/api/waves/${wave.id}/release`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: wave.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await db()("orders").whereIn("id", ids).pluck("status")).toEqual(["open", "open"]);
    expect(await db()("wave_orders").whereIn("order_id", ids).count({ n: "*" }).first()).toEqual({ n: 0 });
    expect(
      await db()("outbox")
        .where({ dedupe_key: `wave-released:${wave.id}` })
        .count({ n: "*" })
        .first(),
    ).toEqual({ n: 0 });
  });
});

describe("a wave that cannot or should not be released", () => {
  it("can be discarded before release: its orders are open again and a new wave can take them; a released wave cannot be", async () => {
    const [item] = await itemsOnLayout(1);
    const ids = [
      await addOrder(`${TAG}-DROP-1`, "2026-01-01T08:00:00Z", [item!]),
      await addOrder(`${TAG}-DROP-2`, "2026-01-01T09:00:00Z", [item!]),
    ];
    const draft = await newWave("2026-01-01T12:00:00Z");
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    const discard = (id: number, version: number) =>
      api().post(`/api/waves/${id}/discard`).set("Cookie", planner).set("Origin", ORIGIN).send({ version });
    expect((await discard(draft.body.id, 2)).status).toBe(409);
    const res = await discard(draft.body.id, 1);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ discarded: true, orders: 2 });
    expect(await db()("orders").whereIn("id", ids).pluck("status")).toEqual(["open", "open"]);
    expect((await api().get(`/api/waves/${draft.body.id}`).set("Cookie", planner)).status).toBe(404);
    const again = await discard(draft.body.id, 1);
    expect(again.status).toBe(404);
    expect(again.body.error).toMatch(/discarded already/);

    const next = await newWave("2026-01-01T12:00:00Z");
    expect(next.body.orders).toBe(2);
    const { wave } = await plan(next.body.id);
    expect(
      (
        await api()
          .post(`/api/waves/${wave.id}/release`)
          .set("Cookie", planner)
          .set("Origin", ORIGIN)
          .send({ version: wave.version })
      ).status,
    ).toBe(200);
    const late = await discard(wave.id, wave.version + 1);
    expect(late.status).toBe(409);
    expect(late.body.error).toMatch(/released/);
    expect(await db()("orders").whereIn("id", ids).pluck("status")).toEqual(["released", "released"]);
  });
});

describe("print history across re-planning", () => {
  let waveId: number;

  beforeAll(async () => {
    const items = await itemsOnLayout(3);
    for (const [i, item] of items.entries()) await addOrder(`${TAG}-PRINT-${i + 1}`, "2026-01-02T08:00:00Z", [item]);
    const created = await newWave("2026-01-02T12:00:00Z");
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    waveId = created.body.id;
    const { batches } = await plan(waveId);
    expect(batches.length).toBe(3);
  });

  const printed = (numbers: unknown[]) =>
    api().post(`/api/waves/${waveId}/printed`).set("Cookie", planner).set("Origin", ORIGIN).send({ numbers });

  it("counts distinct batches of the wave and refuses numbers the wave has no batch for", async () => {
    const unknown = await printed([1, 1, 2, 9999]);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatch(/9999/);
    expect(unknown.body.error).toMatch(/batches 1–3/);
    const first = await printed([1, 1, 2]);
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body).toEqual({ printed: 2, reprints: [] });
    // The refused request counted nothing; the doubled 1 counted once.
    const second = await printed([1, 2, 3]);
    expect(second.body).toEqual({ printed: 3, reprints: [1, 2] });
  });

  it("re-planning keeps each batch's print history, so the next print is a reprint", async () => {
    await plan(waveId);
    const again = await printed([1, 2, 3]);
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body).toEqual({ printed: 3, reprints: [1, 2, 3] });
  });
});
