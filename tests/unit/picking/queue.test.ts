import { describe, expect, it } from "vitest";
import {
  afterAnswer,
  confirmationFor,
  dropFromQueue,
  enqueue,
  flushQueue,
  lineStatus,
  markOf,
  marksAfterAnswer,
  mergeQueued,
  nextToSend,
  outcomeOf,
  readQueue,
  refusalText,
  withEntry,
  withMark,
  withoutEntry,
  type KeyValueStore,
  type QueuedConfirmation,
  type SendResult,
} from "@/lib/picking/queue";

const entry = (key: string, orderLineId: number, more: Partial<QueuedConfirmation> = {}): QueuedConfirmation => ({
  idempotencyKey: key,
  orderLineId,
  quantity: 2,
  binCode: `A0${orderLineId}`,
  batchVersion: 1,
  ...more,
});
const keys = (q: readonly QueuedConfirmation[]) => q.map((c) => c.idempotencyKey);

function memoryStore() {
  const mem = new Map<string, string>();
  const store: KeyValueStore = {
    getItem: (k) => mem.get(k) ?? null,
    setItem: (k, v) => void mem.set(k, v),
    removeItem: (k) => void mem.delete(k),
  };
  return { mem, store };
}

describe("the queue's list", () => {
  it("enqueues at the end, keeps the order, and leaves the list it was given alone", () => {
    const empty: QueuedConfirmation[] = [];
    const one = withEntry(empty, entry("a", 1));
    const two = withEntry(one, entry("b", 2));
    expect(keys(two)).toEqual(["a", "b"]);
    expect(empty).toEqual([]);
    expect(keys(one)).toEqual(["a"]);
  });

  it("a re-send of the same pick key stays one entry, where it was first queued, with the first content", () => {
    const q = withEntry(withEntry(withEntry([], entry("a", 1)), entry("b", 2)), entry("a", 1, { quantity: 9 }));
    expect(keys(q)).toEqual(["a", "b"]);
    expect(q[0]!.quantity).toBe(2);
  });

  it("two actions on the same line with different keys are two entries", () => {
    expect(keys(withEntry(withEntry([], entry("a", 1)), entry("b", 1)))).toEqual(["a", "b"]);
  });

  it("sends the oldest first, and nothing when empty", () => {
    expect(nextToSend([])).toBeNull();
    expect(nextToSend([entry("a", 1), entry("b", 2)])?.idempotencyKey).toBe("a");
  });

  it("drops only the entry with the key", () => {
    expect(keys(withoutEntry([entry("a", 1), entry("b", 2), entry("c", 3)], "b"))).toEqual(["a", "c"]);
    expect(keys(withoutEntry([entry("a", 1)], "zz"))).toEqual(["a"]);
  });
});

describe("the server's answers", () => {
  it("no answer or a 5xx keeps the entry; 200 and 409 are done; other statuses are refusals", () => {
    expect([0, 500, 502, 503, 504].map(outcomeOf)).toEqual(Array(5).fill("undelivered"));
    expect(outcomeOf(200)).toBe("accepted");
    expect(outcomeOf(409)).toBe("already");
    expect([201, 302, 400, 401, 403, 404, 413, 422, 429].map(outcomeOf)).toEqual(Array(9).fill("refused"));
  });

  it("an undelivered entry stays in place; any answer drops it, refusals included", () => {
    const q = [entry("a", 1), entry("b", 2)];
    expect(keys(afterAnswer(q, "a", "undelivered"))).toEqual(["a", "b"]);
    for (const o of ["accepted", "already", "refused"] as const) expect(keys(afterAnswer(q, "a", o))).toEqual(["b"]);
  });

  it("says the server's own words for a refusal, or its status", () => {
    expect(refusalText({ status: 422, body: { error: "That bin was moved." } })).toBe("That bin was moved.");
    expect(refusalText({ status: 403, body: null })).toBe("The server refused a confirmation (403).");
    expect(refusalText({ status: 400, body: "<html>" })).toBe("The server refused a confirmation (400).");
  });
});

describe("what the screen shows", () => {
  it("a confirmation carries the action, what the screen showed and its key", () => {
    const c = confirmationFor({ orderLineId: 4, scan: "A04", quantity: 3 }, { binCode: "A04", batchVersion: 7 }, "k");
    expect(c).toEqual({
      idempotencyKey: "k",
      orderLineId: 4,
      scan: "A04",
      quantity: 3,
      binCode: "A04",
      batchVersion: 7,
    });
    expect(Object.keys(c)[0]).toBe("idempotencyKey");
  });

  it("marks a pick or a short pick at once, over what the server says", () => {
    const marks = withMark(withMark({}, { orderLineId: 1, quantity: 2 }), {
      orderLineId: 2,
      quantity: 0,
      short: { reason: "damaged" },
    });
    expect(marks).toEqual({
      1: { status: "picked", pickedQty: 2, shortReason: null },
      2: { status: "short", pickedQty: 0, shortReason: "damaged" },
    });
    expect(lineStatus(marks, 1, "open")).toBe("picked");
    expect(lineStatus(marks, 2, "open")).toBe("short");
    expect(lineStatus(marks, 3, "open")).toBe("open");
  });

  it("a refusal undoes the tick; success, already-confirmed and no answer keep it", () => {
    const marks = withMark({}, { orderLineId: 1, quantity: 2 });
    expect(marksAfterAnswer(marks, { orderLineId: 1, quantity: 2 }, "refused")).toEqual({});
    for (const o of ["accepted", "already", "undelivered"] as const)
      expect(marksAfterAnswer(marks, { orderLineId: 1, quantity: 2 }, o)).toBe(marks);
  });

  it("after a reload, queued confirmations count again, and a mark made since wins", () => {
    const queued = [entry("a", 1), entry("b", 2, { quantity: 0, short: { reason: "empty bin" } })];
    expect(mergeQueued({}, queued)).toEqual({
      1: markOf(queued[0]!),
      2: { status: "short", pickedQty: 0, shortReason: "empty bin" },
    });
    const since = withMark({}, { orderLineId: 1, quantity: 1, short: { reason: "damaged" } });
    expect(mergeQueued(since, queued)[1]).toEqual({ status: "short", pickedQty: 1, shortReason: "damaged" });
    expect(mergeQueued(since, [])).toEqual(since);
  });
});

describe("the queue in storage", () => {
  it("keeps one list per batch, and removes the stored key when a list empties", () => {
    const { mem, store } = memoryStore();
    enqueue(store, 1, entry("a", 1));
    enqueue(store, 2, entry("b", 2));
    expect(keys(readQueue(store, 1))).toEqual(["a"]);
    expect(keys(readQueue(store, 2))).toEqual(["b"]);
    expect(keys(dropFromQueue(store, 1, "a"))).toEqual([]);
    expect([...mem.keys()]).toEqual(["trailbin.pick-queue.2"]);
  });

  it("reads a missing, broken or foreign stored value as an empty queue", () => {
    const { mem, store } = memoryStore();
    expect(readQueue(store, 1)).toEqual([]);
    mem.set("trailbin.pick-queue.1", "{not json");
    expect(readQueue(store, 1)).toEqual([]);
    mem.set("trailbin.pick-queue.1", '{"a":1}');
    expect(readQueue(store, 1)).toEqual([]);
  });

  it("a send run stops at the first undelivered entry and keeps the order for the next run", async () => {
    const { store } = memoryStore();
    for (const c of [entry("a", 1), entry("b", 2), entry("c", 3)]) enqueue(store, 5, c);
    const sent: string[] = [];
    const answers: Record<string, number> = { a: 200, b: 503 };
    const first = await flushQueue(
      store,
      5,
      async (c) => (sent.push(c.idempotencyKey), { status: answers[c.idempotencyKey] ?? 200, body: {} }),
    );
    expect(first).toEqual({ sent: 1, left: 2 });
    expect(keys(readQueue(store, 5))).toEqual(["b", "c"]);
    const second = await flushQueue(store, 5, async (c) => (sent.push(c.idempotencyKey), { status: 200, body: {} }));
    expect(second).toEqual({ sent: 2, left: 0 });
    expect(sent).toEqual(["a", "b", "b", "c"]);
  });

  it("a refusal leaves the queue and is reported, and the run goes on", async () => {
    const { store } = memoryStore();
    for (const c of [entry("a", 1), entry("b", 2), entry("c", 3)]) enqueue(store, 5, c);
    const status: Record<string, number> = { a: 422, b: 409, c: 200 };
    const seen: [string, number][] = [];
    const run = await flushQueue(
      store,
      5,
      async (c): Promise<SendResult> => ({ status: status[c.idempotencyKey]!, body: null }),
      (c, r) => seen.push([c.idempotencyKey, r.status]),
    );
    expect(run).toEqual({ sent: 3, left: 0 });
    expect(seen).toEqual([
      ["a", 422],
      ["b", 409],
      ["c", 200],
    ]);
  });

  it("sends in the same run what is queued while it runs; a repeat of the key in flight merges into it", async () => {
    const { store } = memoryStore();
    enqueue(store, 5, entry("a", 1));
    const sent: string[] = [];
    await flushQueue(store, 5, async (c) => {
      sent.push(c.idempotencyKey);
      if (c.idempotencyKey === "a") {
        enqueue(store, 5, entry("b", 2));
        enqueue(store, 5, entry("a", 1));
      }
      return { status: 200, body: {} };
    });
    // "a" was still queued when its repeat came, so the repeat merged into it and went out once.
    expect(sent).toEqual(["a", "b"]);
    expect(readQueue(store, 5)).toEqual([]);
  });
});
