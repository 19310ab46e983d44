import { beforeAll, describe, expect, it } from "vitest";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { planPick } from "@/lib/routing/plan";
import {
  BatchingCancelled,
  batchOrders,
  binCodesOf,
  compareUrgency,
  cutoffMs,
  type BatchingMethod,
  type BatchingResult,
  type CartLimits,
  type WaveOrder,
} from "@/lib/batching";
import { demoOrders, type DemoItem } from "@/db/seeds/demo/orders";
import { demoLayout } from "./fixture";

const LIMITS: CartLimits = { totesPerCart: 6, maxLines: 20, maxWeightG: 40_000 };
const METHODS: BatchingMethod[] = ["first-come", "savings"];

let layout: BuiltLayout;
let items: DemoItem[];
let orders: WaveOrder[];
beforeAll(async () => {
  ({ layout, items } = await demoLayout());
  orders = demoOrders(items, { days: 1, perDay: 80, seed: 11 });
});

function run(method: BatchingMethod, wave: readonly WaveOrder[] = orders, limits = LIMITS, extra = {}): BatchingResult {
  return batchOrders(layout.graph, layout.matrix, wave, limits, { method, from: "D1", to: "P1", ...extra });
}

function weight(o: WaveOrder): number {
  return o.lines.reduce((s, l) => s + l.quantity * l.unitWeightG, 0);
}

/** Orders that cannot go on any cart: too many lines, too heavy, an unknown bin, no lines, a bad cut-off. */
function awkwardOrders(): WaveOrder[] {
  const line = (lineId: number, binCode: string, quantity = 1, unitWeightG = 100) => ({
    lineId,
    sku: `X-${lineId}`,
    binCode,
    quantity,
    unitWeightG,
  });
  const bins = items.map((i) => i.binCode);
  return [
    {
      orderId: 9001,
      orderNumber: "FS-TEST-LINES",
      cutoffAt: null,
      priority: 1,
      lines: Array.from({ length: 21 }, (_, i) => line(90010 + i, bins[i] as string)),
    },
    {
      orderId: 9002,
      orderNumber: "FS-TEST-HEAVY",
      cutoffAt: null,
      priority: 1,
      lines: [line(90020, bins[0] as string, 50, 1000)],
    },
    {
      orderId: 9003,
      orderNumber: "FS-TEST-BIN",
      cutoffAt: null,
      priority: 1,
      lines: [line(90030, "99-999-9"), line(90031, bins[1] as string)],
    },
    { orderId: 9004, orderNumber: "FS-TEST-EMPTY", cutoffAt: null, priority: 1, lines: [] },
    {
      orderId: 9005,
      orderNumber: "FS-TEST-DATE",
      cutoffAt: "next Tuesday",
      priority: 1,
      lines: [line(90050, bins[2] as string)],
    },
  ];
}

describe.each(METHODS)("batchOrders (%s)", (method) => {
  it("keeps every batch within every cart limit", () => {
    const r = run(method);
    expect(r.batches.length).toBeGreaterThan(1);
    const byId = new Map(orders.map((o) => [o.orderId, o]));
    for (const b of r.batches) {
      const os = b.orders.map((id) => byId.get(id) as WaveOrder);
      expect(os.length).toBeGreaterThan(0);
      expect(os.length).toBeLessThanOrEqual(LIMITS.totesPerCart);
      expect(b.lineCount).toBe(os.reduce((s, o) => s + o.lines.length, 0));
      expect(b.lineCount).toBeLessThanOrEqual(LIMITS.maxLines);
      expect(b.weightG).toBeCloseTo(
        os.reduce((s, o) => s + weight(o), 0),
        6,
      );
      expect(b.weightG).toBeLessThanOrEqual(LIMITS.maxWeightG);
    }
  });

  it("puts every line in exactly one batch, or reports its order with a reason", () => {
    const wave = [...orders, ...awkwardOrders()];
    const r = run(method, wave);
    const lineIds = (ids: number[]) =>
      ids.flatMap((id) => wave.find((o) => o.orderId === id)?.lines.map((l) => l.lineId) ?? []);
    const batched = lineIds(r.batches.flatMap((b) => b.orders));
    expect(new Set(batched).size).toBe(batched.length);
    const reported = r.unbatchable.map((u) => u.orderId);
    expect(new Set([...r.batches.flatMap((b) => b.orders), ...reported]).size).toBe(wave.length);
    expect(batched.length + lineIds(reported).length).toBe(wave.reduce((s, o) => s + o.lines.length, 0));
    for (const u of r.unbatchable) expect(u.reason.length).toBeGreaterThan(20);
  });

  it("reports orders over a limit, on unknown bins, empty or undated, and still batches the rest", () => {
    const r = run(method, [...orders, ...awkwardOrders()]);
    const reason = (id: number) => r.unbatchable.find((u) => u.orderId === id)?.reason ?? "";
    expect(r.unbatchable.map((u) => u.orderId).sort()).toEqual([9001, 9002, 9003, 9004, 9005]);
    expect(reason(9001)).toMatch(/FS-TEST-LINES has 21 lines but a cart takes at most 20/);
    expect(reason(9002)).toMatch(/FS-TEST-HEAVY weighs 50\.0 kg but a cart takes at most 40\.0 kg/);
    expect(reason(9003)).toMatch(/99-999-9.*not on the published layout/);
    expect(reason(9004)).toMatch(/no lines/);
    expect(reason(9005)).toMatch(/not a date/);
    expect(r.batches.flatMap((b) => b.orders).sort((a, b) => a - b)).toEqual(
      orders.map((o) => o.orderId).sort((a, b) => a - b),
    );
  });

  it("stores for each batch the route a fresh planPick gives for its lines", () => {
    const r = run(method);
    const byId = new Map(orders.map((o) => [o.orderId, o]));
    for (const b of r.batches) {
      const fresh = planPick(layout.graph, layout.matrix, {
        from: "D1",
        to: "P1",
        binCodes: binCodesOf(b.orders.map((id) => byId.get(id) as WaveOrder)),
      });
      expect(b.route.lengthMm).toBe(fresh.lengthMm);
      expect(b.route.baselineMm).toBe(fresh.baselineMm);
      expect(b.route.optimal).toBe(fresh.optimal);
    }
  });

  it("gives the same batches for the same input, whatever order the orders arrive in", () => {
    const a = run(method);
    const b = run(method, [...orders].reverse());
    expect(b).toEqual(a);
  });

  it("reports progress up to 1 and stops between batches when asked", () => {
    const seen: number[] = [];
    run(method, orders, LIMITS, { onProgress: (f: number) => seen.push(f) });
    expect(seen.at(-1)).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1] as number);

    let asked = 0;
    let caught: unknown;
    try {
      run(method, orders, LIMITS, { shouldStop: () => ++asked > 2 });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(BatchingCancelled);
    expect((caught as BatchingCancelled).batchesDone).toBe(2);
  });
});

describe("batch order and cut-offs", () => {
  const queue = (wave: readonly WaveOrder[]) =>
    [...wave].map((order) => ({ order, cutoffMs: cutoffMs(order) })).sort(compareUrgency);

  it("first-come fills carts in cut-off, priority, order-number order", () => {
    const r = run("first-come");
    expect(r.batches.flatMap((b) => b.orders)).toEqual(queue(orders).map((q) => q.order.orderId));
  });

  it("savings starts each batch with the most urgent order left", () => {
    const r = run("savings");
    const rank = new Map(queue(orders).map((q, i) => [q.order.orderId, i]));
    r.batches.forEach((b, i) => {
      const seed = rank.get(b.orders[0] as number) as number;
      for (const later of r.batches.slice(i))
        for (const id of later.orders) expect(rank.get(id)).toBeGreaterThanOrEqual(seed);
    });
  });

  it("savings takes a later cut-off into a cart only when no order of the seed's cut-off is left", () => {
    // Totes are the only binding limit here, so every order left would have fitted.
    const r = run("savings", orders, { totesPerCart: 6, maxLines: 1000, maxWeightG: 1e9 });
    const cut = new Map(orders.map((o) => [o.orderId, cutoffMs(o)]));
    let mixed = 0;
    r.batches.forEach((b, i) => {
      const seedCut = cut.get(b.orders[0] as number) as number;
      if (!b.orders.some((id) => (cut.get(id) as number) > seedCut)) return;
      mixed++;
      const leftBehind = r.batches
        .slice(i + 1)
        .flatMap((x) => x.orders)
        .filter((id) => cut.get(id) === seedCut);
      expect(leftBehind).toEqual([]);
    });
    // The demo's cut-off windows do not divide into whole carts, so some carts must be topped up.
    expect(mixed).toBeGreaterThan(0);
  });
});

describe("input checks", () => {
  it("throws for an unknown depot or drop-off, and for limits that are not positive", () => {
    expect(() =>
      batchOrders(layout.graph, layout.matrix, orders, LIMITS, { method: "savings", from: "NOPE", to: "P1" }),
    ).toThrow(/NOPE/);
    expect(() => run("savings", orders, { ...LIMITS, totesPerCart: 0 })).toThrow(RangeError);
  });

  it("lists a repeated order once in the batches and reports the copy", () => {
    const first = orders[0] as WaveOrder;
    const r = run("first-come", [...orders, first]);
    expect(r.batches.flatMap((b) => b.orders).filter((id) => id === first.orderId)).toHaveLength(1);
    expect(r.unbatchable).toEqual([{ orderId: first.orderId, reason: expect.stringMatching(/more than once/) }]);
  });

  it("returns no batches for an empty wave", () => {
    expect(run("savings", [])).toEqual({ batches: [], unbatchable: [] });
  });
});
