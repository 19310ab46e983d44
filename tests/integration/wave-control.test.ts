import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { waitForJob } from "../support/jobs";
import { TestOrders } from "../support/wave-orders";

// Orders of this file's own, due in June 2019: long before any other test's or the demo's orders, so a
// filter "cut-off up to June 2019" takes exactly these.
const TAG = `C${Date.now().toString(36).toUpperCase()}`;
const day = (d: number) => `2019-06-${String(d).padStart(2, "0")}T08:00:00Z`;
const upTo = (d: number) => `2019-06-${String(d).padStart(2, "0")}T23:59:00Z`;
const SETTINGS = { totesPerCart: 4, maxLines: 30, maxWeightG: 60_000, depotId: "D1", dropoffId: "P1" };

const fixtures = new TestOrders();
let planner: string;
let planner2: string;
let picker: string;
let supervisor: string;
const orders: number[] = [];

const send = (method: "post" | "patch" | "get", url: string, cookie: string, body?: object) => {
  const r = api()[method](url).set("Cookie", cookie).set("Origin", ORIGIN);
  return body ? r.send(body) : r;
};
const waveOf = async (id: number) => (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body;
const statusOf = async (ids: number[]) =>
  (await db()("orders").whereIn("id", ids).orderBy("id").pluck("status")) as string[];
const inWave = async (id: number) =>
  ((await db()("wave_orders").where({ wave_id: id }).pluck("order_id")) as number[]).sort((a, b) => a - b);

async function newWave(cutoffBefore: string, totesPerCart = SETTINGS.totesPerCart) {
  const res = await send("post", "/api/waves", planner, {
    name: `Control ${TAG} ${cutoffBefore}`,
    layoutVersionId: 1,
    settings: { ...SETTINGS, totesPerCart, method: "first-come" },
    cutoffBefore,
    priorities: [1, 2, 3],
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  fixtures.waveIds.push(res.body.id);
  return res.body.id as number;
}

async function plan(id: number) {
  const { wave } = await waveOf(id);
  const start = await send("post", `/api/waves/${id}/plan`, planner, { version: wave.version });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(planner, start.body.jobId);
  expect(job.status, job.message).toBe("done");
  return waveOf(id);
}

beforeAll(async () => {
  [planner, picker, supervisor] = await Promise.all([signInAs("planner"), signInAs("picker"), signInAs("supervisor")]);
  const p2 = await makeUser("planner");
  planner2 = await signIn(p2.email, p2.password);
  const items = await fixtures.itemsOnLayout(8);
  for (let i = 1; i <= 8; i++) orders.push(await fixtures.addOrder(`${TAG}-${i}`, day(i), [items[i - 1]!]));
});

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

describe("editing a wave that is not released", () => {
  let id: number;
  beforeAll(async () => {
    id = await newWave(upTo(3));
  });

  it("changes each field, one request at a time, each moving the version on", async () => {
    let { wave } = await waveOf(id);
    expect(wave.orderCount).toBe(3);
    const steps: [object, (w: { name: string; settings: Record<string, unknown> }) => unknown, unknown][] = [
      [{ name: `  Renamed ${TAG}  ` }, (w) => w.name, `Renamed ${TAG}`],
      [{ settings: { totesPerCart: 2 } }, (w) => w.settings.totesPerCart, 2],
      [{ settings: { maxLines: 12 } }, (w) => w.settings.maxLines, 12],
      [{ settings: { maxWeightG: 25_000 } }, (w) => w.settings.maxWeightG, 25_000],
      [{ settings: { dropoffId: "D1" } }, (w) => w.settings.dropoffId, "D1"],
      [{ settings: { depotId: "D1", dropoffId: "P1" } }, (w) => w.settings.dropoffId, "P1"],
      [{ settings: { method: "savings" } }, (w) => w.settings.method, "savings"],
    ];
    for (const [change, read, expected] of steps) {
      const res = await send("patch", `/api/waves/${id}`, planner, { version: wave.version, ...change });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect(read(res.body.wave)).toBe(expected);
      expect(res.body.wave.version).toBe(wave.version + 1);
      wave = res.body.wave;
    }
    // The other settings are kept as they were.
    expect(wave.settings).toEqual({
      ...SETTINGS,
      totesPerCart: 2,
      maxLines: 12,
      maxWeightG: 25_000,
      method: "savings",
    });
  });

  it("refuses a depot the layout version does not have, an empty change and a stale version", async () => {
    const { wave } = await waveOf(id);
    const bad = await send("patch", `/api/waves/${id}`, planner, {
      version: wave.version,
      settings: { depotId: "D9" },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/no depot D9/);
    const empty = await send("patch", `/api/waves/${id}`, planner, { version: wave.version });
    expect(empty.status).toBe(400);
    const stale = await send("patch", `/api/waves/${id}`, planner, { version: wave.version - 1, name: "Old" });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/Reload the page/);
    expect((await waveOf(id)).wave.name).toBe(`Renamed ${TAG}`);
  });

  it("adds and removes orders by hand and by filter; removed ones are open again", async () => {
    let { wave } = await waveOf(id);
    const add = await send("post", `/api/waves/${id}/orders`, planner, { version: wave.version, add: [orders[3]] });
    expect(add.status, JSON.stringify(add.body)).toBe(200);
    expect(add.body).toMatchObject({ added: 1, removed: 0 });
    expect(await inWave(id)).toEqual(orders.slice(0, 4));
    expect(await statusOf([orders[3]!])).toEqual(["planned"]);

    wave = add.body.wave;
    const remove = await send("post", `/api/waves/${id}/orders`, planner, {
      version: wave.version,
      remove: [orders[0]],
    });
    expect(remove.status).toBe(200);
    expect(await inWave(id)).toEqual(orders.slice(1, 4));
    expect(await statusOf([orders[0]!])).toEqual(["open"]);

    wave = remove.body.wave;
    const byFilter = await send("post", `/api/waves/${id}/orders`, planner, {
      version: wave.version,
      addMatching: { cutoffBefore: upTo(6), priorities: [1, 2, 3] },
    });
    expect(byFilter.status, JSON.stringify(byFilter.body)).toBe(200);
    expect(byFilter.body.added).toBe(3);
    expect(await inWave(id)).toEqual(orders.slice(0, 6));

    wave = byFilter.body.wave;
    const outByFilter = await send("post", `/api/waves/${id}/orders`, planner, {
      version: wave.version,
      removeMatching: { cutoffBefore: upTo(2) },
    });
    expect(outByFilter.status).toBe(200);
    expect(outByFilter.body.removed).toBe(2);
    expect(await inWave(id)).toEqual(orders.slice(2, 6));
    expect(await statusOf(orders.slice(0, 2))).toEqual(["open", "open"]);

    // The editor's list: the wave's own orders and the open ones that could join.
    const list = await send("get", `/api/waves/${id}/orders`, planner);
    expect(list.status).toBe(200);
    expect(list.body.inWave.map((o: { id: number }) => o.id)).toEqual(orders.slice(2, 6));
    const candidates = list.body.candidates.map((o: { id: number }) => o.id);
    expect(candidates).toEqual(expect.arrayContaining(orders.slice(0, 2)));
    expect(candidates).not.toContain(orders[2]);
  });

  it("refuses, naming it, an order another wave took meanwhile, and changes nothing", async () => {
    const other = await newWave(upTo(1));
    expect(await inWave(other)).toEqual([orders[0]]);
    const { wave } = await waveOf(id);
    const res = await send("post", `/api/waves/${id}/orders`, planner, {
      version: wave.version,
      add: [orders[0], orders[1]],
    });
    expect(res.status).toBe(409);
    expect(res.body.error).toContain(`${TAG}-1`);
    expect(res.body.error).not.toContain(`${TAG}-2`);
    expect(await inWave(id)).toEqual(orders.slice(2, 6));
    expect(await statusOf([orders[1]!])).toEqual(["open"]);
  });

  it("cancelling a wave sends its orders back to open; a second planner cancelling at once gets 409", async () => {
    const other = fixtures.waveIds.at(-1)!;
    const { wave } = await waveOf(other);
    const [a, b] = await Promise.all([
      send("post", `/api/waves/${other}/discard`, planner, { version: wave.version }),
      send("post", `/api/waves/${other}/discard`, planner2, { version: wave.version }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error).toMatch(/already cancelled/);
    expect(await statusOf([orders[0]!])).toEqual(["open"]);
    expect(await db()("waves").where({ id: other }).first("id")).toBeUndefined();
    // The winner's repeat finds the wave gone, as before: 404, not someone else's 409.
    const winner = a.status === 200 ? planner : planner2;
    const again = await send("post", `/api/waves/${other}/discard`, winner, { version: wave.version });
    expect(again.status, JSON.stringify(again.body)).toBe(404);
  });

  it("two planners editing at once: one wins, the other gets 409 and changes nothing", async () => {
    const { wave } = await waveOf(id);
    const [a, b] = await Promise.all([
      send("patch", `/api/waves/${id}`, planner, { version: wave.version, name: `A ${TAG}` }),
      send("patch", `/api/waves/${id}`, planner2, { version: wave.version, settings: { totesPerCart: 7 } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const after = (await waveOf(id)).wave;
    expect(after.version).toBe(wave.version + 1);
    if (a.status === 200) expect(after.settings.totesPerCart).toBe(wave.settings.totesPerCart);
    else expect(after.name).toBe(wave.name);

    const [c, d] = await Promise.all([
      send("post", `/api/waves/${id}/orders`, planner, { version: after.version, add: [orders[6]] }),
      send("post", `/api/waves/${id}/orders`, planner2, { version: after.version, remove: [orders[2]] }),
    ]);
    expect([c.status, d.status].sort()).toEqual([200, 409]);
  });

  it("refuses everyone without waves.plan, and visitors without a session", async () => {
    const { wave } = await waveOf(id);
    for (const cookie of [picker, supervisor]) {
      expect((await send("patch", `/api/waves/${id}`, cookie, { version: wave.version, name: "x y z" })).status).toBe(
        403,
      );
      expect(
        (await send("post", `/api/waves/${id}/orders`, cookie, { version: wave.version, add: [orders[7]] })).status,
      ).toBe(403);
      expect((await send("get", `/api/waves/${id}/orders`, cookie)).status).toBe(403);
      expect((await send("post", `/api/waves/${id}/batches/1/recall`, cookie, { version: 1 })).status).toBe(403);
    }
    const anon = await api().patch(`/api/waves/${id}`).set("Origin", ORIGIN).send({ version: wave.version, name: "x" });
    expect(anon.status).toBe(401);
    expect((await waveOf(id)).wave.version).toBe(wave.version);
  });
});

describe("re-planning with changed settings", () => {
  let id: number;
  beforeAll(async () => {
    // Orders 1, 2 and 8 are open again by now (8 never joined a wave); a wave up to the 8th takes the open ones.
    id = await newWave(upTo(8), 4);
  });

  it("a smaller cart gives more batches; the new settings throw the old plan away first", async () => {
    const first = await plan(id);
    const n = first.wave.orderCount;
    expect(n).toBeGreaterThanOrEqual(2);
    expect(first.batches.length).toBeLessThan(n);

    // A new name alone keeps the plan.
    const renamed = await send("patch", `/api/waves/${id}`, planner, {
      version: first.wave.version,
      name: `Kept ${TAG}`,
    });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({
      planDropped: false,
      wave: { status: "planned", batchCount: first.batches.length },
    });

    const edit = await send("patch", `/api/waves/${id}`, planner, {
      version: renamed.body.wave.version,
      settings: { totesPerCart: 1 },
    });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ planDropped: true, wave: { status: "draft", batchCount: 0, distanceMm: null } });

    const again = await plan(id);
    expect(again.wave.settings.totesPerCart).toBe(1);
    expect(again.batches.length).toBe(n);
    for (const b of again.batches) expect(b.toteCount).toBe(1);
  });

  it("two planners re-planning at once with different settings: one wins, the other gets 409", async () => {
    const { wave } = await waveOf(id);
    const [a, b] = await Promise.all([
      send("patch", `/api/waves/${id}`, planner, { version: wave.version, settings: { totesPerCart: 2 } }),
      send("patch", `/api/waves/${id}`, planner2, { version: wave.version, settings: { totesPerCart: 3 } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? a : b;
    const after = await plan(id);
    expect(after.wave.settings.totesPerCart).toBe(winner.body.wave.settings.totesPerCart);
    // The loser's plan request at the version it saw is refused too.
    const late = await send("post", `/api/waves/${id}/plan`, planner2, { version: wave.version });
    expect(late.status).toBe(409);
  });

  it("a released wave can no longer be edited or cancelled", async () => {
    const { wave } = await waveOf(id);
    const rel = await send("post", `/api/waves/${id}/release`, planner, { version: wave.version });
    expect(rel.status, JSON.stringify(rel.body)).toBe(200);
    const v = rel.body.wave.version;
    const edit = await send("patch", `/api/waves/${id}`, planner, { version: v, name: "Too late" });
    expect(edit.status).toBe(409);
    expect(edit.body.error).toMatch(/released/);
    const more = await send("post", `/api/waves/${id}/orders`, planner, { version: v, add: [orders[7]] });
    expect(more.status).toBe(409);
    const cancel = await send("post", `/api/waves/${id}/discard`, planner, { version: v });
    expect(cancel.status).toBe(409);
    expect(cancel.body.error).toMatch(/Recall each batch nobody has started/);
  });
});

describe("recalling a released batch nobody has started", () => {
  let id: number;
  type Row = { id: number; number: number; version: number; status: string; line_count: number };
  const batchRows = async (): Promise<Row[]> =>
    db()("batches").where({ wave_id: id }).orderBy("number").select("id", "number", "version", "status", "line_count");
  const ordersOfBatch = async (batchId: number) =>
    (await db()("batch_lines as bl")
      .join("order_lines as l", "l.id", "bl.order_line_id")
      .where("bl.batch_id", batchId)
      .distinct("l.order_id")
      .pluck("l.order_id")) as number[];
  const take = async (cookie: string, b: Row) => {
    const res = await send("post", `/api/batches/${b.id}/take`, cookie, { version: b.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  };

  beforeAll(async () => {
    // Every open order of this file, one per batch: several batches to recall, start and race over.
    const waveIds = [...fixtures.waveIds];
    for (const w of waveIds) {
      const r = await db()("waves").where({ id: w }).first("status", "version");
      if (r && r.status !== "released") await send("post", `/api/waves/${w}/discard`, planner, { version: r.version });
    }
    // Four more orders, due later in June, so the wave has enough batches whoever won the races above.
    const items = await fixtures.itemsOnLayout(4);
    // The last has two lines, so confirming one leaves its batch started, not finished.
    for (let i = 0; i < 4; i++)
      orders.push(
        await fixtures.addOrder(`${TAG}-${20 + i}`, day(20 + i), i === 3 ? [items[i]!, items[0]!] : [items[i]!]),
      );
    id = await newWave(upTo(28), 1);
    const planned = await plan(id);
    expect(planned.batches.length).toBeGreaterThanOrEqual(4);
    const rel = await send("post", `/api/waves/${id}/release`, planner, { version: planned.wave.version });
    expect(rel.status, JSON.stringify(rel.body)).toBe(200);
  });

  it("its orders are open again and leave the wave, the batch stays as recalled, and the picker holding it loses it", async () => {
    const holder = await makeUser("picker");
    const holderCookie = await signIn(holder.email, holder.password);
    const [b1] = await batchRows();
    await take(holderCookie, b1!);
    const held = (await batchRows())[0]!;
    const its = await ordersOfBatch(held.id);
    expect(its.length).toBe(1);

    const res = await send("post", `/api/waves/${id}/batches/${held.number}/recall`, planner, {
      version: held.version,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.orders).toHaveLength(1);
    expect(await statusOf(its)).toEqual(["open"]);
    expect(await db()("wave_orders").whereIn("order_id", its).first()).toBeUndefined();
    const row = await db()("batches").where({ id: held.id }).first("status", "assigned_to", "recalled_by");
    expect(row).toMatchObject({ status: "recalled", assigned_to: null });
    expect(row.recalled_by).not.toBeNull();
    expect(await db()("batch_lines").where({ batch_id: held.id }).first()).toBeUndefined();
    const kept = await db()("recalled_batch_lines").where({ batch_id: held.id }).count({ n: "*" }).first();
    expect(Number(kept?.n)).toBe(1);

    // The same planner's repeat is answered as done.
    const repeat = await send("post", `/api/waves/${id}/batches/${held.number}/recall`, planner, {
      version: held.version,
    });
    expect(repeat.status, JSON.stringify(repeat.body)).toBe(200);

    // The holder's handheld: the batch is gone from their list, and opening it says why.
    const mine = await send("get", "/api/my-batches", holderCookie);
    expect(mine.body.batches.map((b: { id: number }) => b.id)).not.toContain(held.id);
    const pickApi = await send("get", `/api/batches/${held.id}/pick`, holderCookie);
    expect(pickApi.status).toBe(409);
    expect(pickApi.body.error).toMatch(/recalled by the planner/);
    const page = await api().get(`/pick/${held.id}`).set("Cookie", holderCookie);
    expect(page.status).toBe(200);
    expect(page.text).toContain("This batch was recalled by the planner");

    // Nobody can take it any more.
    const other = await makeUser("picker");
    const otherCookie = await signIn(other.email, other.password);
    const now = (await batchRows())[0]!;
    const takeIt = await send("post", `/api/batches/${now.id}/take`, otherCookie, { version: now.version });
    expect(takeIt.status).toBe(409);

    // Its order can go in a new wave and be planned again: its lines are free.
    const again = await newWave(upTo(8), 1);
    expect(await inWave(again)).toEqual(its);
    const replanned = await plan(again);
    expect(replanned.batches.length).toBe(1);
  });

  it("refuses a started batch: reassign it instead", async () => {
    const starter = await makeUser("picker");
    const cookie = await signIn(starter.email, starter.password);
    const b = (await batchRows()).find((r) => r.line_count >= 2)!;
    expect(b.number).toBeGreaterThan(4);
    await take(cookie, b);
    const view = await send("get", `/api/batches/${b.id}/pick`, cookie);
    expect(view.status).toBe(200);
    const line = view.body.stops[0].lines[0];
    const confirmed = await send("post", `/api/batches/${b.id}/confirm`, cookie, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      binCode: line.binCode,
      batchVersion: view.body.batch.version,
      scan: line.binCode,
      quantity: line.quantity,
    });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    const now = (await batchRows()).find((r) => r.id === b.id)!;
    const res = await send("post", `/api/waves/${id}/batches/${b.number}/recall`, planner, { version: now.version });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/already started.*reassign it instead/i);
    expect((await db()("batches").where({ id: b.id }).first("status")).status).toBe("picking");
  });

  it("refuses a version the batch has moved on from (a picker took it meanwhile)", async () => {
    const b = (await batchRows())[2]!;
    const late = await makeUser("picker");
    await take(await signIn(late.email, late.password), b);
    const res = await send("post", `/api/waves/${id}/batches/${b.number}/recall`, planner, { version: b.version });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/changed since you loaded/);
    expect((await db()("batches").where({ id: b.id }).first("status")).status).toBe("released");
  });

  it("two planners recalling at once: one wins, the other gets 409", async () => {
    const b = (await batchRows())[3]!;
    const [x, y] = await Promise.all([
      send("post", `/api/waves/${id}/batches/${b.number}/recall`, planner, { version: b.version }),
      send("post", `/api/waves/${id}/batches/${b.number}/recall`, planner2, { version: b.version }),
    ]);
    expect([x.status, y.status].sort()).toEqual([200, 409]);
    expect((x.status === 409 ? x : y).body.error).toMatch(/already recalled/);
  });

  it("refuses a batch number the wave does not have, and a batch of a wave not released", async () => {
    const none = await send("post", `/api/waves/${id}/batches/999/recall`, planner, { version: 1 });
    expect(none.status).toBe(404);
    const draft = fixtures.waveIds.at(-1)!;
    const { wave } = await waveOf(draft);
    expect(wave.status).toBe("planned");
    const notYet = await send("post", `/api/waves/${draft}/batches/1/recall`, planner, { version: 1 });
    expect(notYet.status).toBe(409);
    expect(notYet.body.error).toMatch(/not released/);
  });
});
