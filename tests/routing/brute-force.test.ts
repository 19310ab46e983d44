import { describe, expect, it } from "vitest";
import { heldKarp, localSearch, sequenceStops, walkLength } from "../../lib/routing";
import { permutations, randomInstance } from "./helpers/instances";

// Exhaustive enumeration of every visiting order is the definition of the optimum.
describe("Held–Karp against brute force (fixed start, different fixed end)", () => {
  for (const symmetric of [true, false]) {
    for (let m = 0; m <= 8; m++) {
      it(`${symmetric ? "symmetric" : "asymmetric"}, ${m} stops`, () => {
        const cm = randomInstance(m + 2, 100 + m + (symmetric ? 0 : 50), symmetric);
        const stops = Array.from({ length: m }, (_, i) => i + 2);
        let best = Infinity;
        for (const p of permutations(stops)) best = Math.min(best, walkLength(cm, 0, p, 1));
        const r = heldKarp(cm, 0, 1, stops);
        expect(r.length).toBe(best);
        expect(walkLength(cm, 0, r.order, 1)).toBe(best);
        expect([...r.order].sort((a, b) => a - b)).toEqual(stops);
      });
    }
  }
});

describe("local search", () => {
  it("is never shorter than the exact optimum, and reports its own walk's length", () => {
    for (let seed = 1; seed <= 40; seed++) {
      const m = 6 + (seed % 9);
      const cm = randomInstance(m + 2, seed, seed % 2 === 0);
      const stops = Array.from({ length: m }, (_, i) => i + 2);
      const exact = heldKarp(cm, 0, 1, stops);
      const h = localSearch(cm, 0, 1, stops, { seed });
      expect(h.length).toBeGreaterThanOrEqual(exact.length);
      expect(h.length).toBe(walkLength(cm, 0, h.order, 1));
      expect([...h.order].sort((a, b) => a - b)).toEqual(stops);
    }
  });

  it("ends 2-opt and Or-opt optimal on directed costs (checked by re-walking every move)", () => {
    for (let seed = 1; seed <= 6; seed++) {
      const m = 30;
      const cm = randomInstance(m + 2, 900 + seed, false);
      const stops = Array.from({ length: m }, (_, i) => i + 2);
      const { order, length } = localSearch(cm, 0, 1, stops, { seed, kicks: 0 });
      for (let i = 0; i < m; i++) {
        for (let j = i + 1; j < m; j++) {
          const rev = [...order.slice(0, i), ...order.slice(i, j + 1).reverse(), ...order.slice(j + 1)];
          expect(walkLength(cm, 0, rev, 1)).toBeGreaterThanOrEqual(length);
        }
        const without = [...order.slice(0, i), ...order.slice(i + 1)];
        for (let q = 0; q <= without.length; q++) {
          const moved = [...without.slice(0, q), order[i]!, ...without.slice(q)];
          expect(walkLength(cm, 0, moved, 1)).toBeGreaterThanOrEqual(length);
        }
      }
    }
  });

  it("is used above the exact limit and leaves with the LP's bound, or its proof", () => {
    const cm = randomInstance(30, 7, false);
    const stops = Array.from({ length: 28 }, (_, i) => i + 2);
    const r = sequenceStops(cm, { start: 0, end: 1, stops });
    expect(r.length).toBe(walkLength(cm, 0, r.order, 1));
    expect(r.lowerBound).toBeGreaterThan(0);
    expect(r.lowerBound).toBeLessThanOrEqual(r.length);
    expect(r.optimal).toBe(r.lowerBound === r.length);
    expect(r.method).toBe(r.optimal ? "lp-cuts" : "local-search");
    expect(sequenceStops(cm, { start: 0, end: 1, stops, heuristic: { seed: 3 } })).toEqual(
      sequenceStops(cm, { start: 0, end: 1, stops, heuristic: { seed: 3 } }),
    );
  });
});
