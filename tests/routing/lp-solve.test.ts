import { readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { heldKarp, localSearch, parseTsplib, UNREACHABLE, walkLength, type CostMatrix } from "../../lib/routing";
import { allowedArcs } from "../../lib/routing/lp/arcs";
import { highsSolver, loadHighs, recycleHighsIfLarge } from "../../lib/routing/lp/highs";
import { lpRoute } from "../../lib/routing/lp/solve";
import type { StopSegment } from "../../lib/routing/segments";
import { randomInstance } from "./helpers/instances";
import { obstructedWarehouse } from "./helpers/layouts";
import { layoutOf, warehouseBatch, warehouseLayout, type WarehouseBatch } from "./helpers/warehouse-batch";

beforeAll(async () => {
  await loadHighs();
});

const sorted = (xs: readonly number[]) => [...xs].sort((a, b) => a - b);

/** Seeded batches of 1–16 stops on both layouts and 2–4 cross aisles, open and closed walks. */
function batches(count: number, aisles: number, positions: number): (WarehouseBatch & { name: string })[] {
  const out: (WarehouseBatch & { name: string })[] = [];
  for (const oneWay of [true, false]) {
    for (const crossAisles of [2, 3, 4]) {
      const layout = warehouseLayout({ aisles, positions, crossAisles, oneWay });
      for (let k = 0; k < count; k++) {
        const m = 1 + (k % 16);
        const closed = k % 2 === 0;
        const seed = 7919 * crossAisles + 104729 * Number(oneWay) + k;
        out.push({
          ...warehouseBatch(layout, m, seed, closed),
          name: `${oneWay ? "one" : "two"}-way, ${crossAisles} cross, ${m} stops, ${closed ? "closed" : "open"}`,
        });
      }
    }
  }
  return out;
}

// 6 layouts × 50 = 300 batches; a small floor so stops crowd the same aisles and the pruning rules bite.
const warehouse = batches(50, 4, 10);

/** The matrix with every arc the pruning drops made unreachable (arcs out of the merged node leave the start, into it reach the end). */
function prunedMatrix(b: WarehouseBatch, segments: readonly StopSegment[]): CostMatrix {
  return maskedMatrix(b, allowedArcs(b.stops, segments));
}

function maskedMatrix(b: WarehouseBatch, allowed: Uint8Array): CostMatrix {
  const k = b.stops.length + 1;
  const cost = Int32Array.from(b.cm.cost);
  const pt = (i: number, leaving: boolean) => (i === 0 ? (leaving ? b.start : b.end) : b.stops[i - 1]!);
  for (let i = 0; i < k; i++)
    for (let j = 0; j < k; j++)
      if (i !== j && !allowed[i * k + j]) cost[pt(i, true) * b.cm.n + pt(j, false)] = UNREACHABLE;
  return { n: b.cm.n, cost };
}

describe("lpRoute proves the Held–Karp optimum on warehouse batches", () => {
  // Independent check: Held–Karp (lib/routing/held-karp.ts) on the same matrix.
  it("300 batches, all arcs, no upper bound given (integer rounds find the tour)", () => {
    for (const b of warehouse) {
      const hk = heldKarp(b.cm, b.start, b.end, b.stops);
      const r = lpRoute(b.cm, b);
      expect(r.proved, b.name).toBe(true);
      expect(r.length, b.name).toBe(hk.length);
      expect(r.lowerBound, b.name).toBe(hk.length);
      expect(sorted(r.order!), b.name).toEqual(sorted(b.stops));
      expect(walkLength(b.cm, b.start, r.order!, b.end), b.name).toBe(hk.length);
    }
  });

  it("300 batches, pruned arcs, local search as the upper bound", () => {
    for (const b of warehouse) {
      const hk = heldKarp(b.cm, b.start, b.end, b.stops);
      const ls = localSearch(b.cm, b.start, b.end, b.stops);
      const r = lpRoute(b.cm, b, { upperOrder: ls.order });
      expect(r.proved, b.name).toBe(true);
      expect(r.length, b.name).toBe(hk.length);
      expect(r.lowerBound, b.name).toBe(hk.length);
      expect(walkLength(b.cm, b.start, r.order!, b.end), b.name).toBe(hk.length);
    }
  });

  it("pruning never loses the optimum: Held–Karp with the dropped arcs removed gives the same length", () => {
    let dropped = 0;
    for (const b of warehouse) {
      const full = heldKarp(b.cm, b.start, b.end, b.stops).length;
      const pruned = prunedMatrix(b, b.segments);
      dropped += b.cm.cost.filter((c, i) => c !== pruned.cost[i]).length;
      expect(heldKarp(pruned, b.start, b.end, b.stops).length, b.name).toBe(full);
    }
    // The check means something only if the rules removed arcs.
    expect(dropped).toBeGreaterThan(1000);
  });

  it("pruning never loses the optimum on long aisles, where picking an aisle from both ends pays", () => {
    for (const oneWay of [false, true]) {
      const layout = warehouseLayout({ aisles: 3, positions: 30, crossAisles: 2, oneWay });
      for (let k = 0; k < 60; k++) {
        const b = warehouseBatch(layout, 6 + (k % 7), 31 * k + 5, k % 2 === 0);
        const full = heldKarp(b.cm, b.start, b.end, b.stops).length;
        expect(heldKarp(prunedMatrix(b, b.segments), b.start, b.end, b.stops).length, `${oneWay} ${k}`).toBe(full);
      }
    }
  });

  it("arcs out of an inner two-way stop must stay: restricting them to neighbours loses optima", () => {
    // The walk that enters an aisle from both ends turns back at inner stops (lib/routing/lp/arcs.ts).
    const layout = warehouseLayout({ aisles: 3, positions: 30, crossAisles: 2, oneWay: false });
    let lost = 0;
    for (let k = 0; k < 40; k++) {
      const b = warehouseBatch(layout, 6 + (k % 7), 31 * k + 5, k % 2 === 0);
      const allowed = allowedArcs(b.stops, b.segments);
      const n = b.stops.length + 1;
      const local = new Map(b.stops.map((s, i) => [s, i + 1]));
      for (const seg of b.segments) {
        const run = seg.stops.map((s) => local.get(s)!);
        for (let t = 1; t + 1 < run.length; t++)
          for (let j = 0; j < n; j++) if (j !== run[t - 1] && j !== run[t + 1]) allowed[run[t]! * n + j] = 0;
      }
      const full = heldKarp(b.cm, b.start, b.end, b.stops).length;
      if (heldKarp(maskedMatrix(b, allowed), b.start, b.end, b.stops).length > full) lost++;
    }
    expect(lost).toBeGreaterThan(0);
  });

  it("pruning never loses the optimum on floors with blocked cells and stray one-way marks", () => {
    let segmented = 0;
    for (let seed = 1; seed <= 12; seed++) {
      const layout = layoutOf(obstructedWarehouse(seed));
      for (let k = 0; k < 10; k++) {
        const b = warehouseBatch(layout, 6 + (k % 9), 1000 * seed + k, k % 2 === 0);
        segmented += b.segments.length;
        const full = heldKarp(b.cm, b.start, b.end, b.stops).length;
        expect(heldKarp(prunedMatrix(b, b.segments), b.start, b.end, b.stops).length, `seed ${seed}/${k}`).toBe(full);
      }
    }
    expect(segmented).toBeGreaterThan(100);
  });

  it("the LP bound alone never passes the optimum", () => {
    for (const b of warehouse) {
      const hk = heldKarp(b.cm, b.start, b.end, b.stops);
      expect(lpRoute(b.cm, b, { integer: false }).lowerBound, b.name).toBeLessThanOrEqual(hk.length);
    }
  });
});

describe("lpRoute on a published instance", () => {
  // br17 optimum 39: TSPLIB (Reinelt 1991), tests/fixtures/tsplib/br17.atsp.
  it("br17 (asymmetric, 17 cities) closes at 39 through integer rounds", () => {
    const inst = parseTsplib(readFileSync(path.join(__dirname, "../fixtures/tsplib/br17.atsp"), "utf8"));
    const stops = Array.from({ length: inst.n - 1 }, (_, i) => i + 1);
    const r = lpRoute(inst, { start: 0, end: 0, stops });
    expect(r.proved).toBe(true);
    expect(r.length).toBe(39);
    expect(r.lowerBound).toBe(39);
    expect(walkLength(inst, 0, r.order!, 0)).toBe(39);
    expect(sorted(r.order!)).toEqual(stops);
  });
});

describe("lpRoute on random asymmetric matrices", () => {
  // Held–Karp on tests/routing/helpers/instances.ts randomInstance is the reference.
  it("the bound never passes the optimum, and a proved tour is the optimum", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 11 }),
        fc.integer({ min: 0, max: 1e6 }),
        fc.boolean(),
        fc.integer({ min: 1, max: 6 }),
        (m, seed, closed, maxRounds) => {
          const cm = randomInstance(m + 2, seed, false);
          const stops = Array.from({ length: m }, (_, i) => i + 2);
          const end = closed ? 0 : 1;
          const hk = heldKarp(cm, 0, end, stops).length;
          const bound = lpRoute(cm, { start: 0, end, stops }, { integer: false, maxRounds });
          expect(bound.lowerBound).toBeLessThanOrEqual(hk);
          const upperOrder = localSearch(cm, 0, end, stops, { kicks: 0 }).order;
          for (const full of [
            lpRoute(cm, { start: 0, end, stops }),
            lpRoute(cm, { start: 0, end, stops }, { upperOrder }),
          ]) {
            expect(full.proved).toBe(true);
            expect(full.length).toBe(hk);
            expect(full.lowerBound).toBe(hk);
            expect(walkLength(cm, 0, full.order!, end)).toBe(hk);
          }
        },
      ),
      { numRuns: 150, seed: 20261203 },
    );
  });
});

describe("lpRoute with a time cap on the integer rounds", () => {
  it("returns either the Held–Karp optimum proved or an unproved bound below it", () => {
    for (let seed = 1; seed <= 6; seed++) {
      const cm = randomInstance(16, 900 + seed, false);
      const stops = Array.from({ length: 14 }, (_, i) => i + 2);
      const hk = heldKarp(cm, 0, 1, stops).length;
      const r = lpRoute(cm, { start: 0, end: 1, stops }, { integerTimeLimitMs: 0.01 });
      expect(r.lowerBound).toBeLessThanOrEqual(hk);
      if (r.proved) expect(r.length).toBe(hk);
    }
  });
});

describe("HiGHS heap recycling", () => {
  it("drops the instance past the budget and loads a fresh one on demand", async () => {
    const before = highsSolver();
    expect(before).toBeDefined();
    expect(recycleHighsIfLarge(Number.MAX_SAFE_INTEGER)).toBe(false);
    expect(recycleHighsIfLarge(0)).toBe(true);
    expect(highsSolver()).toBeUndefined();
    expect(() => lpRoute(randomInstance(5, 1, false), { start: 0, end: 1, stops: [2, 3, 4] })).toThrow(/not loaded/);
    await loadHighs();
    expect(highsSolver()).toBeDefined();
    expect(highsSolver()).not.toBe(before);
  });
});
