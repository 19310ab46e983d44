import { afterAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { DEMO_ACCOUNTS } from "@/db/seeds/demo/accounts";
import { enqueue, flushQueue, readQueue, type KeyValueStore, type QueuedConfirmation } from "@/lib/picking/queue";
import { pickerWithBatch } from "../support/jobs";

afterAll(closeDb);

// Batch 1 stays untouched for the browser test and the access test (GET /pick/1 as the picker);
// these tests work batch 2 (also the demo picker's) and batches they take themselves.

type Line = {
  orderLineId: number;
  binCode: string;
  sku: string;
  quantity: number;
  pickStatus: string;
  batchVersion: number;
};

const picker2 = () => {
  const a = DEMO_ACCOUNTS.find((x) => x.email === "picker2@bramblegate.example")!;
  return signIn(a.email, a.password);
};

async function linesOf(cookie: string, batchId: number): Promise<Line[]> {
  const res = await api().get(`/api/batches/${batchId}/pick`).set("Cookie", cookie);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  // Each line carries the batch version the screen was loaded at: confirmations send it back.
  return res.body.stops.flatMap((s: { lines: Line[] }) =>
    s.lines.map((l) => ({ ...l, batchVersion: res.body.batch.version })),
  );
}

/** What the handheld showed for a line: its bin and the batch's version. */
const seen = (l: Line) => ({ binCode: l.binCode, batchVersion: l.batchVersion });

const confirm = (cookie: string, batchId: number, body: Record<string, unknown>) =>
  api().post(`/api/batches/${batchId}/confirm`).set("Cookie", cookie).set("Origin", ORIGIN).send(body);

const lineRow = (id: number) =>
  db()("batch_lines").where({ order_line_id: id }).first("pick_status", "picked_qty", "short_reason", "confirmed_by");
const stateOf = async (batchId: number) => ({
  lines: await db()("batch_lines")
    .where({ batch_id: batchId })
    .orderBy("order_line_id")
    .select("order_line_id", "pick_status", "picked_qty", "short_reason"),
  batch: await db()("batches").where({ id: batchId }).first("status"),
  confirmations: Number((await db()("pick_confirmations").where({ batch_id: batchId }).count({ n: "*" }).first())!.n),
});

describe("confirming picks", () => {
  it("refuses a wrong scan and records nothing; records the right scan (case and spaces ignored) once", async () => {
    const picker = await signInAs("picker");
    const [line] = await linesOf(picker, 2);
    expect(line!.pickStatus).toBe("open");

    const wrongKey = randomUUID();
    const wrong = {
      idempotencyKey: wrongKey,
      orderLineId: line!.orderLineId,
      ...seen(line!),
      scan: "ZZ-99-9",
      quantity: line!.quantity,
    };
    const refused = await confirm(picker, 2, wrong);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toContain(`this stop is bin ${line!.binCode}`);
    expect(refused.body.error).toContain("ZZ-99-9");
    expect((await lineRow(line!.orderLineId)).pick_status).toBe("open");
    // The refusal is what a repeat of that key gets, never a success.
    const again = await confirm(picker, 2, wrong);
    expect(again.status).toBe(422);
    expect(again.body).toEqual(refused.body);
    expect((await db()("batches").where({ id: 2 }).first("status")).status).toBe("released");

    const rightKey = randomUUID();
    const right = await confirm(picker, 2, {
      idempotencyKey: rightKey,
      orderLineId: line!.orderLineId,
      ...seen(line!),
      scan: `  ${line!.binCode.toLowerCase()} `,
      quantity: line!.quantity,
    });
    expect(right.status, JSON.stringify(right.body)).toBe(200);
    expect(right.body.line.pickStatus).toBe("picked");
    const row = await lineRow(line!.orderLineId);
    expect(row.pick_status).toBe("picked");
    expect(row.picked_qty).toBe(line!.quantity);
    const batch = await db()("batches").where({ id: 2 }).first("status", "started_at");
    expect(batch.status).toBe("picking");
    expect(batch.started_at).not.toBeNull();

    // A new action on a line already picked, and an old key reused for something else, are both refused.
    const twice = await confirm(picker, 2, {
      idempotencyKey: randomUUID(),
      orderLineId: line!.orderLineId,
      ...seen(line!),
      quantity: line!.quantity,
    });
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatch(/already confirmed/);
    const reused = await confirm(picker, 2, {
      idempotencyKey: rightKey,
      orderLineId: line!.orderLineId,
      ...seen(line!),
      quantity: line!.quantity,
    });
    expect(reused.status).toBe(409);
    expect(reused.body.error).toMatch(/different pick/);
  });

  it("20 identical confirmations at once (one key) count once and all get the same answer", async () => {
    const picker = await signInAs("picker");
    const line = (await linesOf(picker, 2)).find((l) => l.pickStatus === "open")!;
    const body = {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      ...seen(line),
      scan: line.sku,
      quantity: line.quantity,
    };
    const answers = await Promise.all(Array.from({ length: 20 }, () => confirm(picker, 2, body)));
    for (const a of answers) {
      expect(a.status, JSON.stringify(a.body)).toBe(200);
      expect(a.body).toEqual(answers[0]!.body);
    }
    expect(answers.filter((a) => a.headers["idempotent-replayed"] !== "true")).toHaveLength(1);
    expect(
      Number(
        (await db()("pick_confirmations").where({ idempotency_key: body.idempotencyKey }).count({ n: "*" }).first())!.n,
      ),
    ).toBe(1);
    const row = await lineRow(line.orderLineId);
    expect(row.pick_status).toBe("picked");
    expect(row.picked_qty).toBe(line.quantity);
  });

  it("records a short pick with the quantity found and the reason", async () => {
    const picker = await signInAs("picker");
    const line = (await linesOf(picker, 2)).find((l) => l.pickStatus === "open")!;
    const tooMany = await confirm(picker, 2, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      ...seen(line),
      quantity: line.quantity,
      short: { reason: "damaged" },
    });
    expect(tooMany.status).toBe(422);
    const found = line.quantity - 1;
    const res = await confirm(picker, 2, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      ...seen(line),
      quantity: found,
      short: { reason: "damaged" },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.line).toMatchObject({ pickStatus: "short", pickedQty: found, shortReason: "damaged" });
    expect(await lineRow(line.orderLineId)).toMatchObject({
      pick_status: "short",
      picked_qty: found,
      short_reason: "damaged",
    });
    const audited = await db()("audit_log").where({ event: "pick.short", subject: "batch:2" }).first("id");
    expect(audited).toBeTruthy();
  });

  it("a queue replayed in order, with repeats and a lost answer, ends as if each was sent once; the batch is done", async () => {
    const { cookie, batchId } = await pickerWithBatch();
    const lines = await linesOf(cookie, batchId);
    const queue: QueuedConfirmation[] = lines.map((l, i) =>
      i === 0
        ? {
            idempotencyKey: randomUUID(),
            orderLineId: l.orderLineId,
            ...seen(l),
            quantity: 0,
            short: { reason: "empty bin" },
          }
        : {
            idempotencyKey: randomUUID(),
            orderLineId: l.orderLineId,
            ...seen(l),
            scan: l.binCode,
            quantity: l.quantity,
          },
    );
    const send = async (c: QueuedConfirmation) => {
      const r = await confirm(cookie, batchId, c);
      return { status: r.status, body: r.body };
    };

    // The device's own queue: the second answer is lost on the way back, so that one is sent again.
    const mem = new Map<string, string>();
    const store: KeyValueStore = {
      getItem: (k) => mem.get(k) ?? null,
      setItem: (k, v) => void mem.set(k, v),
      removeItem: (k) => void mem.delete(k),
    };
    for (const c of queue) enqueue(store, batchId, c);
    let calls = 0;
    const first = await flushQueue(store, batchId, async (c) => {
      const r = await send(c);
      return ++calls === 2 ? { status: 0, body: null } : r;
    });
    expect(first).toEqual({ sent: 1, left: queue.length - 1 });
    const answers = new Map<string, unknown>();
    const second = await flushQueue(store, batchId, send, (c, r) => {
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      answers.set(c.idempotencyKey, r.body);
    });
    expect(second).toEqual({ sent: queue.length - 1, left: 0 });
    expect(readQueue(store, batchId)).toEqual([]);

    const once = await stateOf(batchId);
    expect(once.batch.status).toBe("done");
    expect(once.confirmations).toBe(queue.length);
    expect(once.lines.filter((l: { pick_status: string }) => l.pick_status === "short")).toHaveLength(1);
    expect(once.lines.filter((l: { pick_status: string }) => l.pick_status === "picked")).toHaveLength(
      queue.length - 1,
    );

    // The whole queue again, each one twice: the same answers, the same final state.
    for (const c of queue) {
      const a = await send(c);
      const b = await send(c);
      expect(b).toEqual(a);
      if (answers.has(c.idempotencyKey)) expect(a.body).toEqual(answers.get(c.idempotencyKey));
    }
    expect(await stateOf(batchId)).toEqual(once);
    const finished = await db()("batches").where({ id: batchId }).first("finished_at");
    expect(finished.finished_at).not.toBeNull();
  });
});

describe("who may work a batch", () => {
  it("another picker can neither open nor confirm batch 1 (403, audited) and nothing is recorded", async () => {
    const other = await picker2();
    const view = await api().get("/api/batches/1/pick").set("Cookie", other);
    expect(view.status).toBe(403);
    expect(view.body.error).toMatch(/assigned to/);
    const page = await api().get("/pick/1").set("Cookie", other).redirects(0);
    expect(page.status).toBe(403);
    const line = (await db()("batch_lines")
      .where({ batch_id: 1 })
      .orderBy("order_line_id")
      .first("order_line_id", "bin_code"))!;
    const key = randomUUID();
    const batch1 = await db()("batches").where({ id: 1 }).first("version");
    const res = await confirm(other, 1, {
      idempotencyKey: key,
      orderLineId: line.order_line_id,
      scan: line.bin_code,
      quantity: 1,
      binCode: line.bin_code,
      batchVersion: batch1.version,
    });
    expect(res.status).toBe(403);
    expect(await db()("pick_confirmations").where({ idempotency_key: key }).first()).toBeUndefined();
    expect((await lineRow(line.order_line_id)).pick_status).toBe("open");
    const denied = await db()("audit_log")
      .where({ event: "access.denied" })
      .where("subject", "like", "%/api/batches/1/%")
      .first("id");
    expect(denied).toBeTruthy();
  });

  it("a batch not released yet cannot be picked (409)", async () => {
    const admin = await signInAs("admin");
    const planned = await db()("batches").where({ status: "planned" }).first("id");
    expect(planned).toBeTruthy();
    const res = await api().get(`/api/batches/${planned.id}/pick`).set("Cookie", admin);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/not released/);
  });

  it("two pickers taking the same batch at once: exactly one gets it, the other hears someone else took it", async () => {
    const [a, b] = await Promise.all([makeUser("picker"), makeUser("picker")]);
    const [ca, cb] = await Promise.all([signIn(a.email, a.password), signIn(b.email, b.password)]);
    const next = (await api().get("/api/my-batches").set("Cookie", ca)).body.next;
    const take = (c: string) =>
      api().post(`/api/batches/${next.id}/take`).set("Cookie", c).set("Origin", ORIGIN).send({ version: next.version });
    const [ra, rb] = await Promise.all([take(ca), take(cb)]);
    expect([ra.status, rb.status].sort()).toEqual([200, 409]);
    const loser = ra.status === 409 ? ra : rb;
    expect(loser.body.error).toMatch(/someone else took/i);
    const winner = ra.status === 200 ? a : b;
    expect((await db()("batches").where({ id: next.id }).first("assigned_to")).assigned_to).toBe(winner.id);
    const mine = (
      await api()
        .get("/api/my-batches")
        .set("Cookie", ra.status === 200 ? ca : cb)
    ).body.batches;
    expect(mine.map((x: { id: number }) => x.id)).toEqual([next.id]);
  });
});

describe("a confirmation belongs to the line the picker saw", () => {
  it("a confirmation naming another bin than the line's, or a batch version that moved on, is refused and records nothing", async () => {
    const { cookie, batchId } = await pickerWithBatch();
    const lines = await linesOf(cookie, batchId);
    const line = lines[0]!;
    const elsewhere = lines.find((l) => l.binCode !== line.binCode) ?? { binCode: `${line.binCode}-X` };
    const otherBin = await confirm(cookie, batchId, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      quantity: line.quantity,
      binCode: elsewhere.binCode,
      batchVersion: line.batchVersion,
    });
    expect(otherBin.status, JSON.stringify(otherBin.body)).toBe(409);
    expect(otherBin.body.error).toContain(`it is in bin ${line.binCode}`);
    const stale = await confirm(cookie, batchId, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      quantity: line.quantity,
      binCode: line.binCode,
      batchVersion: line.batchVersion - 1,
    });
    expect(stale.status, JSON.stringify(stale.body)).toBe(409);
    expect(stale.body.error).toMatch(/given back or taken/);
    const unsaid = await confirm(cookie, batchId, {
      idempotencyKey: randomUUID(),
      orderLineId: line.orderLineId,
      quantity: line.quantity,
    });
    expect(unsaid.status).toBe(400);
    expect((await lineRow(line.orderLineId)).pick_status).toBe("open");
    expect((await db()("batches").where({ id: batchId }).first("status")).status).toBe("released");
    // Nothing was picked: back to the pool for the tests after this one.
    const { version } = await db()("batches").where({ id: batchId }).first("version");
    expect((await giveBack(cookie, { id: batchId, version })).status).toBe(200);
  });
});

const take = (cookie: string, b: { id: number; version: number }) =>
  api().post(`/api/batches/${b.id}/take`).set("Cookie", cookie).set("Origin", ORIGIN).send({ version: b.version });
const giveBack = (cookie: string, b: { id: number; version: number }) =>
  api().post(`/api/batches/${b.id}/give-back`).set("Cookie", cookie).set("Origin", ORIGIN).send({ version: b.version });
const pool = () =>
  db()("batches")
    .whereNull("assigned_to")
    .whereIn("status", ["released", "picking"])
    .orderBy("id")
    .select("id", "version", "status");

describe("batches can be taken back", () => {
  it("one picker taking many batches at once gets only the site's cap of open batches; giving them back frees them", async () => {
    const site = await db()("sites").where({ id: 1 }).first("max_open_batches_per_picker");
    expect(site.max_open_batches_per_picker).toBe(3);
    const free = await pool();
    expect(free.length, "released batches nobody holds").toBeGreaterThanOrEqual(3);
    await db()("sites").where({ id: 1 }).update({ max_open_batches_per_picker: 2 });
    try {
      const u = await makeUser("picker");
      const cookie = await signIn(u.email, u.password);
      const answers = await Promise.all(free.slice(0, 3).map((b: { id: number; version: number }) => take(cookie, b)));
      expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 409]);
      expect(answers.find((a) => a.status === 409)!.body.error).toMatch(/already hold 2 unfinished batches/);
      const held = await db()("batches").where({ assigned_to: u.id }).select("id", "version");
      expect(held).toHaveLength(2);
      for (const b of held) expect((await giveBack(cookie, b)).status).toBe(200);
      expect(await db()("batches").where({ assigned_to: u.id }).count({ n: "*" }).first()).toEqual({ n: 0 });
    } finally {
      await db()("sites").where({ id: 1 }).update({ max_open_batches_per_picker: 3 });
    }
  });

  it("a batch an admin started while nobody held it stays takeable; its picker gives it back half-picked, the next picker takes it first, and the first handheld's late confirmation is refused", async () => {
    // The released pool is shared by every test file, so one batch goes through all of this.
    const admin = await signInAs("admin");
    const target = (await pool()).find((b: { status: string }) => b.status === "released")!;
    const [a, b, c] = await linesOf(admin, target.id);
    const byAdmin = await confirm(admin, target.id, {
      idempotencyKey: randomUUID(),
      orderLineId: a!.orderLineId,
      quantity: a!.quantity,
      ...seen(a!),
    });
    expect(byAdmin.status, JSON.stringify(byAdmin.body)).toBe(200);

    const u1 = await makeUser("picker");
    const first = await signIn(u1.email, u1.password);
    const offered = (await api().get("/api/my-batches").set("Cookie", first)).body.next;
    expect(offered, "a started batch is offered before fresh ones").toMatchObject({ id: target.id, status: "picking" });
    const took = await take(first, offered);
    expect(took.status, JSON.stringify(took.body)).toBe(200);
    // Someone else, with the list they loaded before: told who has it, not that it "changed".
    const late = await makeUser("picker");
    const lost = await take(await signIn(late.email, late.password), offered);
    expect(lost.status).toBe(409);
    expect(lost.body.error).toMatch(/someone else took/i);

    const [, b1] = await linesOf(first, target.id);
    const picked = await confirm(first, target.id, {
      idempotencyKey: randomUUID(),
      orderLineId: b!.orderLineId,
      scan: b!.binCode,
      quantity: b!.quantity,
      ...seen(b1!),
    });
    expect(picked.status, JSON.stringify(picked.body)).toBe(200);
    const row = await db()("batches").where({ id: target.id }).first("version", "status");
    expect(row.status).toBe("picking");
    const back = await giveBack(first, { id: target.id, version: row.version });
    expect(back.status, JSON.stringify(back.body)).toBe(200);
    // A repeat of the same give-back is answered the same, not refused.
    expect((await giveBack(first, { id: target.id, version: row.version })).status).toBe(200);
    expect(await db()("batches").where({ id: target.id }).first("assigned_to", "status")).toEqual({
      assigned_to: null,
      status: "picking",
    });
    for (const l of [a!, b!]) expect((await lineRow(l.orderLineId)).pick_status).toBe("picked");

    const u2 = await makeUser("picker");
    const second = await signIn(u2.email, u2.password);
    const next = (await api().get("/api/my-batches").set("Cookie", second)).body.next;
    expect(next.id).toBe(target.id);
    expect((await take(second, next)).status).toBe(200);
    const tooLate = await confirm(first, target.id, {
      idempotencyKey: randomUUID(),
      orderLineId: c!.orderLineId,
      quantity: c!.quantity,
      ...seen(b1!),
      binCode: c!.binCode,
    });
    expect(tooLate.status).toBe(403);
    expect((await lineRow(c!.orderLineId)).pick_status).toBe("open");
    // The first picker cannot give back a batch that is no longer theirs.
    const now = await db()("batches").where({ id: target.id }).first("version");
    expect((await giveBack(first, { id: target.id, version: now.version })).status).toBe(403);
    expect((await db()("batches").where({ id: target.id }).first("assigned_to")).assigned_to).toBe(u2.id);
  });

  it("disabling a picker puts their unfinished batches back in the pool, lines already picked staying picked", async () => {
    const { user, cookie, batchId } = await pickerWithBatch();
    const [a] = await linesOf(cookie, batchId);
    expect(
      (
        await confirm(cookie, batchId, {
          idempotencyKey: randomUUID(),
          orderLineId: a!.orderLineId,
          quantity: a!.quantity,
          ...seen(a!),
        })
      ).status,
    ).toBe(200);
    const admin = await signInAs("admin");
    const res = await api()
      .patch(`/api/users/${user.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: user.version, disabled: true });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await db()("batches").where({ id: batchId }).first("assigned_to", "status")).toEqual({
      assigned_to: null,
      status: "picking",
    });
    expect((await lineRow(a!.orderLineId)).pick_status).toBe("picked");
    const u = await makeUser("picker");
    const other = await signIn(u.email, u.password);
    const next = (await api().get("/api/my-batches").set("Cookie", other)).body.next;
    expect(next.id).toBe(batchId);
    // Taken again, so no half-picked cart is left in the pool for the tests after this one.
    expect((await take(other, next)).status).toBe(200);
  });
});
