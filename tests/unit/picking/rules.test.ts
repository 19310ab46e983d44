import { describe, expect, it } from "vitest";
import {
  cautionsOf,
  judgeConfirmation,
  lineForScan,
  NEW_BIN_TAP_HOLD_MS,
  scanMatches,
  TAP_HOLD_MS,
  tapHoldMs,
  walkingOrder,
} from "@/lib/picking/rules";
import { newIdempotencyKey } from "@/lib/picking/key";
import { enqueue, flushQueue, readQueue, type KeyValueStore } from "@/lib/picking/queue";

const line = { binCode: "A03-04-2", sku: "FX-1001", quantity: 4, pickStatus: "open" as const };
/** What the handheld saw: this line's bin, batch version 5. */
const SAW = { binCode: "A03-04-2", batchVersion: 5 };

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
    expect(
      judgeConfirmation(line, { status: "released", version: 5 }, { scan: "B01-01-1", quantity: 4, ...SAW }),
    ).toMatchObject({ status: 422, error: expect.stringContaining("That is B01-01-1; this stop is bin A03-04-2") });
    expect(
      judgeConfirmation({ ...line, pickStatus: "picked" }, { status: "picking", version: 5 }, { quantity: 4, ...SAW }),
    ).toMatchObject({ status: 409 });
    expect(judgeConfirmation(line, { status: "planned", version: 5 }, { quantity: 4, ...SAW })).toMatchObject({
      status: 409,
    });
    expect(judgeConfirmation(null, { status: "released", version: 5 }, { quantity: 4, ...SAW })).toMatchObject({
      status: 404,
    });
    expect(judgeConfirmation(line, { status: "released", version: 5 }, { quantity: 3, ...SAW })).toMatchObject({
      status: 422,
    });
  });
  it("accepts a full pick and a short pick of 0 to ordered − 1", () => {
    expect(
      judgeConfirmation(line, { status: "released", version: 5 }, { scan: "FX-1001", quantity: 4, ...SAW }).apply,
    ).toEqual({ status: "picked", pickedQty: 4, shortReason: null });
    expect(
      judgeConfirmation(
        line,
        { status: "picking", version: 5 },
        { quantity: 0, short: { reason: "empty bin" }, ...SAW },
      ).apply,
    ).toEqual({ status: "short", pickedQty: 0, shortReason: "empty bin" });
    expect(
      judgeConfirmation(line, { status: "picking", version: 5 }, { quantity: 4, short: { reason: "damaged" }, ...SAW })
        .status,
    ).toBe(422);
  });
});

describe("a confirmation belongs to what the picker saw", () => {
  it("is refused when the screen showed another bin for the line, or the batch was given back or taken since", () => {
    const otherBin = judgeConfirmation(
      line,
      { status: "picking", version: 5 },
      { quantity: 4, binCode: "A03-05-1", batchVersion: 5 },
    );
    expect(otherBin).toMatchObject({ status: 409, error: expect.stringContaining("showed bin A03-05-1") });
    expect(otherBin.apply).toBeUndefined();
    const moved = judgeConfirmation(line, { status: "picking", version: 6 }, { quantity: 4, ...SAW });
    expect(moved).toMatchObject({ status: 409, error: expect.stringContaining("given back or taken") });
    expect(moved.apply).toBeUndefined();
    expect(
      judgeConfirmation(
        line,
        { status: "picking", version: 5 },
        { quantity: 4, binCode: " a03-04-2 ", batchVersion: 5 },
      ).status,
    ).toBe(200);
  });
  it("keeps the tap button disarmed longer when the next line is in another bin", () => {
    expect(tapHoldMs(null, "A03-04-2")).toBe(TAP_HOLD_MS);
    expect(tapHoldMs("a03-04-2", "A03-04-2")).toBe(TAP_HOLD_MS);
    expect(tapHoldMs("A03-04-2", "A03-04-3")).toBe(NEW_BIN_TAP_HOLD_MS);
    expect(NEW_BIN_TAP_HOLD_MS).toBeGreaterThan(TAP_HOLD_MS);
  });
});

describe("a stop with lines in two bins", () => {
  const first = { orderLineId: 1, binCode: "A03-04-2", sku: "FX-1001" };
  const second = { orderLineId: 2, binCode: "A03-04-3", sku: "FX-2002" };
  it("a scan of the second line's bin picks that line, not a wrong scan; a bin outside the stop is none", () => {
    expect(lineForScan("a03-04-3", first, [first, second])).toBe(second);
    expect(lineForScan("FX-2002", first, [first, second])).toBe(second);
    expect(lineForScan("A03-04-2", first, [first, second])).toBe(first);
    expect(lineForScan("B01-01-1", first, [first, second])).toBeNull();
  });
});

describe("idempotency keys on a handheld over plain HTTP", () => {
  it("are made from getRandomValues alone (no randomUUID outside a secure context), 32 hex digits, all different", () => {
    const insecure = {
      getRandomValues: <T extends ArrayBufferView | null>(a: T) =>
        globalThis.crypto.getRandomValues(a as Uint8Array) as unknown as T,
    };
    expect("randomUUID" in insecure).toBe(false);
    const keys = new Set(
      Array.from({ length: 1000 }, () => newIdempotencyKey(insecure as Pick<Crypto, "getRandomValues">)),
    );
    expect(keys.size).toBe(1000);
    for (const k of keys) expect(k).toMatch(/^[0-9a-f]{32}$/);
  });
});

describe("walking order and cautions", () => {
  it("puts skipped stops after the others, the last skipped last", () => {
    expect(walkingOrder([1, 2, 3, 4], [])).toEqual([1, 2, 3, 4]);
    expect(walkingOrder([1, 2, 3, 4], [2, 1])).toEqual([3, 4, 2, 1]);
  });
  it("warns of high levels and heavy lines", () => {
    expect(cautionsOf([{ binCode: "A01-01-3", unitWeightG: 5000, quantity: 3 }], new Set(["A01-01-3"]))).toEqual([
      "high-level",
      "heavy",
    ]);
    expect(cautionsOf([{ binCode: "A01-01-1", unitWeightG: 100, quantity: 3 }], new Set())).toEqual([]);
  });
});

describe("the device's queue", () => {
  it("keeps confirmations in order until the server answers, and drops a repeat of the same key", async () => {
    const mem = new Map<string, string>();
    const store: KeyValueStore = {
      getItem: (k) => mem.get(k) ?? null,
      setItem: (k, v) => void mem.set(k, v),
      removeItem: (k) => void mem.delete(k),
    };
    enqueue(store, 7, { idempotencyKey: "k1", orderLineId: 1, quantity: 1, binCode: "A", batchVersion: 1 });
    enqueue(store, 7, { idempotencyKey: "k2", orderLineId: 2, quantity: 1, binCode: "B", batchVersion: 1 });
    enqueue(store, 7, { idempotencyKey: "k1", orderLineId: 1, quantity: 1, binCode: "A", batchVersion: 1 });
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
