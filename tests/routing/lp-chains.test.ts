import { beforeAll, describe, expect, it } from "vitest";
import { heldKarp, localSearch, walkLength } from "../../lib/routing";
import { chainedLocalSearch } from "../../lib/routing/chains";
import { loadHighs } from "../../lib/routing/lp/highs";
import { lpRoute } from "../../lib/routing/lp/solve";
import { warehouseBatch, warehouseLayout } from "./helpers/warehouse-batch";

beforeAll(async () => {
  await loadHighs();
});

const sorted = (xs: readonly number[]) => [...xs].sort((a, b) => a - b);

describe("stop segments", () => {
  it("hold the stops of one edge in offset order, one-way as the edge is, and no stop on a node", () => {
    for (const oneWay of [true, false]) {
      const layout = warehouseLayout({ aisles: 6, positions: 20, crossAisles: 3, oneWay });
      const b = warehouseBatch(layout, 60, 42, false);
      const seen = new Set<number>();
      for (const seg of b.segments) {
        const edge = layout.graph.edges[seg.edge]!;
        expect(seg.oneWay).toBe(edge.oneWay);
        expect(seg.oneWay).toBe(oneWay);
        const offsets = seg.stops.map((s) => b.points[s]!.offsetMm);
        expect(offsets).toEqual([...offsets].sort((x, y) => x - y));
        for (const s of seg.stops) {
          expect(b.points[s]!.edge).toBe(seg.edge);
          expect(seen.has(s)).toBe(false);
          seen.add(s);
        }
      }
      // Every stop inside an edge is in exactly one segment; stops on nodes in none.
      for (const s of b.stops) expect(seen.has(s)).toBe(b.points[s]!.edge >= 0);
    }
  });
});

describe("chained local search", () => {
  it("keeps each one-way run together and in walking order, and never beats Held–Karp", () => {
    const layout = warehouseLayout({ aisles: 4, positions: 12, crossAisles: 3, oneWay: true });
    for (let seed = 1; seed <= 40; seed++) {
      const b = warehouseBatch(layout, 4 + (seed % 11), seed, seed % 2 === 0);
      const r = chainedLocalSearch(b.cm, b.start, b.end, b.stops, b.segments);
      expect(sorted(r.order)).toEqual(sorted(b.stops));
      expect(walkLength(b.cm, b.start, r.order, b.end)).toBe(r.length);
      for (const seg of b.segments.filter((s) => s.oneWay && s.stops.length > 1)) {
        const at = r.order.indexOf(seg.stops[0]!);
        expect(r.order.slice(at, at + seg.stops.length)).toEqual(seg.stops);
      }
      // Held–Karp (lib/routing/held-karp.ts) is the optimum on the same matrix.
      expect(r.length).toBeGreaterThanOrEqual(heldKarp(b.cm, b.start, b.end, b.stops).length);
    }
  });

  it("on one-way layouts with 60 stops, against the LP-proved optimum", () => {
    const layout = warehouseLayout({ aisles: 12, positions: 40, crossAisles: 3, oneWay: true });
    const gaps: number[] = [];
    const plainGaps: number[] = [];
    for (let seed = 1; seed <= 8; seed++) {
      const b = warehouseBatch(layout, 60, 500 + seed, seed % 2 === 0);
      const chained = chainedLocalSearch(b.cm, b.start, b.end, b.stops, b.segments);
      const plain = localSearch(b.cm, b.start, b.end, b.stops);
      const opt = lpRoute(b.cm, b, { upperOrder: chained.order });
      expect(opt.proved).toBe(true);
      expect(walkLength(b.cm, b.start, opt.order!, b.end)).toBe(opt.length);
      expect(sorted(opt.order!)).toEqual(sorted(b.stops));
      expect(chained.length).toBeGreaterThanOrEqual(opt.length!);
      expect(plain.length).toBeGreaterThanOrEqual(opt.length!);
      gaps.push((100 * (chained.length - opt.length!)) / opt.length!);
      plainGaps.push((100 * (plain.length - opt.length!)) / opt.length!);
    }
    const mean = (xs: number[]) => (xs.reduce((a, x) => a + x, 0) / xs.length).toFixed(2);
    console.log(
      `one-way, 60 stops: chained local search ${mean(gaps)} % above the optimum, plain ${mean(plainGaps)} %`,
    );
  });
});
