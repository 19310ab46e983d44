import { describe, expect, it } from "vitest";
import { cautionsOf, judgeConfirmation, scanMatches, walkingOrder } from "@/lib/picking/rules";
import { enqueue, flushQueue, readQueue, type KeyValueStore } from "@/lib/picking/queue";

const line = { binCode: "A03-04-2", sku: "FX-1001", quantity: 4, pickStatus: "open" as const };

describe("a scan", () => {
  it("matches the bin code or the SKU, ignoring case and spaces around", () => {
    expect(scanMatches(" a03-04-2\n", line)).toBe(true);
    expect(scanMatches("fx-1001", line)).toBe(true);
    expect(scanMatches("A03-04-3", line)).toBe(false);
    expect(scanMatches("   ", line)).toBe(false);
  });
});

describe("judging a confirmation", () => {
  it("refuses a wrong scan naming both bins, a line already done, a planned batch and a wrong quantity", () => {
    expect(judgeConfirmation(line, "released", { scan: "B01-01-1", quantity: 4 })).toMatchObject({ status: 422, error: expect.stringContaining("That is B01-01-1; this stop is bin A03-04-2") });
    expect(judgeConfirmation({ ...line, pickStatus: "picked" }, "picking", { quantity: 4 })).toMatchObject({ status: 409 });
    expect(judgeConfirmation(line, "planned", { quantity: 4 })).toMatchObject({ status: 409 });
    expect(judgeConfirmation(null, "released", { quantity: 4 })).toMatchObject({ status: 404 });
    expect(judgeConfirmation(line, "released", { quantity: 3 })).toMatchObject({ status: 422 });
  });
  it("accepts a full pick and a short pick of 0 to ordered − 1", () => {
    expect(judgeConfirmation(line, "released", { scan: "FX-1001", quantity: 4 }).apply).toEqual({ status: "picked", pickedQty: 4, shortReason: null });
    expect(judgeConfirmation(line, "picking", { quantity: 0, short: { reason: "empty bin" } }).apply).toEqual({ status: "short", pickedQty: 0, shortReason: "empty bin" });
    expect(judgeConfirmation(line, "picking", { quantity: 4, short: { reason: "damaged" } }).status).toBe(422);
  });
});

describe("walking order and cautions", () => {
  it("puts skipped stops after the others, the last skipped last", () => {
    expect(walkingOrder([1, 2, 3, 4], [])).toEqual([1, 2, 3, 4]);
    expect(walkingOrder([1, 2, 3, 4], [2, 1])).toEqual([3, 4, 2, 1]);
  });
  it("warns of high levels and heavy lines", () => {
    expect(cautionsOf([{ binCode: "A01-01-3", unitWeightG: 5000, quantity: 3 }], new Set(["A01-01-3"]))).toEqual(["high-level", "heavy"]);
    expect(cautionsOf([{ binCode: "A01-01-1", unitWeightG: 100, quantity: 3 }], new Set())).toEqual([]);
  });
});

describe("the device's queue", () => {
  it("keeps confirmations in order until the server answers, and drops a repeat of the same key", async () => {
    const mem = new Map<string, string>();
    const store: KeyValueStore = { getItem: (k) => mem.get(k) ?? null, setItem: (k, v) => void mem.set(k, v), removeItem: (k) => void mem.delete(k) };
    enqueue(store, 7, { idempotencyKey: "k1", orderLineId: 1, quantity: 1 });
    enqueue(store, 7, { idempotencyKey: "k2", orderLineId: 2, quantity: 1 });
    enqueue(store, 7, { idempotencyKey: "k1", orderLineId: 1, quantity: 1 });
    expect(readQueue(store, 7).map((c) => c.idempotencyKey)).toEqual(["k1", "k2"]);
    const sent: string[] = [];
    const offline = await flushQueue(store, 7, async (c) => (sent.push(c.idempotencyKey), { status: 0, body: null }));
    expect(offline).toEqual({ sent: 0, left: 2 });
    const online = await flushQueue(store, 7, async (c) => (sent.push(c.idempotencyKey), { status: 200, body: {} }));
    expect(online).toEqual({ sent: 2, left: 0 });
    expect(sent).toEqual(["k1", "k1", "k2"]);
    expect(mem.size).toBe(0);
  });
});
