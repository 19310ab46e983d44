import { afterAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { DEMO_ACCOUNTS } from "@/lib/demo-accounts";
import { enqueue, flushQueue, readQueue, type KeyValueStore, type QueuedConfirmation } from "@/lib/picking/queue";
import { pickerWithBatch } from "../support/jobs";

afterAll(closeDb);

// Batch 1 stays untouched for the browser test and the access test (GET /pick/1 as the picker);
// these tests work batch 2 (also the demo picker's) and batches they take themselves.

type Line = { orderLineId: number; binCode: string; sku: string; quantity: number; pickStatus: string };

const picker2 = () => {
  const a = DEMO_ACCOUNTS.find((x) => x.email === "picker2@bramblegate.example")!;
  return signIn(a.email, a.password);
};

async function linesOf(cookie: string, batchId: number): Promise<Line[]> {
  const res = await api().get(`/api/batches/${batchId}/pick`).set("Cookie", cookie);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.stops.flatMap((s: { lines: Line[] }) => s.lines);
}

const confirm = (cookie: string, batchId: number, body: Record<string, unknown>) => api().post(`/api/batches/${batchId}/confirm`).set("Cookie", cookie).set("Origin", ORIGIN).send(body);

const lineRow = (id: number) => db()("batch_lines").where({ order_line_id: id }).first("pick_status", "picked_qty", "short_reason", "confirmed_by");
const stateOf = async (batchId: number) => ({
  lines: await db()("batch_lines").where({ batch_id: batchId }).orderBy("order_line_id").select("order_line_id", "pick_status", "picked_qty", "short_reason"),
  batch: await db()("batches").where({ id: batchId }).first("status"),
  confirmations: Number((await db()("pick_confirmations").where({ batch_id: batchId }).count({ n: "*" }).first())!.n),
});

describe("confirming picks", () => {
  it("refuses a wrong scan and records nothing; records the right scan (case and spaces ignored) once", async () => {
    const picker = await signInAs("picker");
    const [line] = await linesOf(picker, 2);
    expect(line!.pickStatus).toBe("open");

    const wrongKey = randomUUID();
    const wrong = { idempotencyKey: wrongKey, orderLineId: line!.orderLineId, scan: "ZZ-99-9", quantity: line!.quantity };
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
    const right = await confirm(picker, 2, { idempotencyKey: rightKey, orderLineId: line!.orderLineId, scan: `  ${line!.binCode.toLowerCase()} `, quantity: line!.quantity });
    expect(right.status, JSON.stringify(right.body)).toBe(200);
    expect(right.body.line.pickStatus).toBe("picked");
    const row = await lineRow(line!.orderLineId);
    expect(row.pick_status).toBe("picked");
    expect(row.picked_qty).toBe(line!.quantity);
    const batch = await db()("batches").where({ id: 2 }).first("status", "started_at");
    expect(batch.status).toBe("picking");
    expect(batch.started_at).not.toBeNull();

    // A new action on a line already picked, and an old key reused for something else, are both refused.
    const twice = await confirm(picker, 2, { idempotencyKey: randomUUID(), orderLineId: line!.orderLineId, quantity: line!.quantity });
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatch(/already confirmed/);
    const reused = await confirm(picker, 2, { idempotencyKey: rightKey, orderLineId: line!.orderLineId, quantity: line!.quantity });
    expect(reused.status).toBe(409);
    expect(reused.body.error).toMatch(/different pick/);
  });

  it("20 identical confirmations at once (one key) count once and all get the same answer", async () => {
    const picker = await signInAs("picker");
    const line = (await linesOf(picker, 2)).find((l) => l.pickStatus === "open")!;
    const body = { idempotencyKey: randomUUID(), orderLineId: line.orderLineId, scan: line.sku, quantity: line.quantity };
    const answers = await Promise.all(Array.from({ length: 20 }, () => confirm(picker, 2, body)));
    for (const a of answers) {
      expect(a.status, JSON.stringify(a.body)).toBe(200);
      expect(a.body).toEqual(answers[0]!.body);
    }
    expect(answers.filter((a) => a.headers["idempotent-replayed"] !== "true")).toHaveLength(1);
    expect(Number((await db()("pick_confirmations").where({ idempotency_key: body.idempotencyKey }).count({ n: "*" }).first())!.n)).toBe(1);
    const row = await lineRow(line.orderLineId);
    expect(row.pick_status).toBe("picked");
    expect(row.picked_qty).toBe(line.quantity);
  });

  it("records a short pick with the quantity found and the reason", async () => {
    const picker = await signInAs("picker");
    const line = (await linesOf(picker, 2)).find((l) => l.pickStatus === "open")!;
    const tooMany = await confirm(picker, 2, { idempotencyKey: randomUUID(), orderLineId: line.orderLineId, quantity: line.quantity, short: { reason: "damaged" } });
    expect(tooMany.status).toBe(422);
    const found = line.quantity - 1;
    const res = await confirm(picker, 2, { idempotencyKey: randomUUID(), orderLineId: line.orderLineId, quantity: found, short: { reason: "damaged" } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.line).toMatchObject({ pickStatus: "short", pickedQty: found, shortReason: "damaged" });
    expect(await lineRow(line.orderLineId)).toMatchObject({ pick_status: "short", picked_qty: found, short_reason: "damaged" });
    const audited = await db()("audit_log").where({ event: "pick.short", subject: "batch:2" }).first("id");
    expect(audited).toBeTruthy();
  });

  it("a queue replayed in order, with repeats and a lost answer, ends as if each was sent once; the batch is done", async () => {
    const { cookie, batchId } = await pickerWithBatch();
    const lines = await linesOf(cookie, batchId);
    const queue: QueuedConfirmation[] = lines.map((l, i) =>
      i === 0 ? { idempotencyKey: randomUUID(), orderLineId: l.orderLineId, quantity: 0, short: { reason: "empty bin" } } : { idempotencyKey: randomUUID(), orderLineId: l.orderLineId, scan: l.binCode, quantity: l.quantity },
    );
    const send = async (c: QueuedConfirmation) => {
      const r = await confirm(cookie, batchId, c);
      return { status: r.status, body: r.body };
    };

    // The device's own queue: the second answer is lost on the way back, so that one is sent again.
    const mem = new Map<string, string>();
    const store: KeyValueStore = { getItem: (k) => mem.get(k) ?? null, setItem: (k, v) => void mem.set(k, v), removeItem: (k) => void mem.delete(k) };
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
    expect(once.lines.filter((l: { pick_status: string }) => l.pick_status === "picked")).toHaveLength(queue.length - 1);

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
    const line = (await db()("batch_lines").where({ batch_id: 1 }).orderBy("order_line_id").first("order_line_id", "bin_code"))!;
    const key = randomUUID();
    const res = await confirm(other, 1, { idempotencyKey: key, orderLineId: line.order_line_id, scan: line.bin_code, quantity: 1 });
    expect(res.status).toBe(403);
    expect(await db()("pick_confirmations").where({ idempotency_key: key }).first()).toBeUndefined();
    expect((await lineRow(line.order_line_id)).pick_status).toBe("open");
    const denied = await db()("audit_log").where({ event: "access.denied" }).where("subject", "like", "%/api/batches/1/%").first("id");
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
    const take = (c: string) => api().post(`/api/batches/${next.id}/take`).set("Cookie", c).set("Origin", ORIGIN).send({ version: next.version });
    const [ra, rb] = await Promise.all([take(ca), take(cb)]);
    expect([ra.status, rb.status].sort()).toEqual([200, 409]);
    const loser = ra.status === 409 ? ra : rb;
    expect(loser.body.error).toMatch(/someone else took/i);
    const winner = ra.status === 200 ? a : b;
    expect((await db()("batches").where({ id: next.id }).first("assigned_to")).assigned_to).toBe(winner.id);
    const mine = (await api().get("/api/my-batches").set("Cookie", ra.status === 200 ? ca : cb)).body.batches;
    expect(mine.map((x: { id: number }) => x.id)).toEqual([next.id]);
  });
});
