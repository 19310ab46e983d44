import { describe, expect, it } from "vitest";
import {
  generateWarehouse,
  localSearch,
  mulberry32,
  nodeAccessPoint,
  walkLength,
  UnreachableStopError,
  type AccessPoint,
} from "../../lib/routing";
import { corridorFrontWidth, corridorSweep, type CorridorResult } from "../../lib/routing/corridor-dp";
import {
  batchCase,
  blockedWarehouse,
  caseOf,
  heldKarpLength,
  irregularDrawing,
  published,
  reachablePoints,
  type CorridorCase,
} from "./helpers/corridor-cases";
import { permutations } from "./helpers/instances";
import { obstructedWarehouse } from "./helpers/layouts";

function solved(r: CorridorResult): { order: number[]; lengthMm: number } {
  if ("skipped" in r) throw new Error(`skipped: ${r.skipped}`);
  return r;
}

/** The sweep's order, priced on the same matrix Held–Karp uses, must give exactly its length. */
function priced(c: CorridorCase, order: readonly number[]): number {
  return walkLength(
    c.cm,
    0,
    order.map((i) => i + 2),
    1,
  );
}

function expectHeldKarp(c: CorridorCase): void {
  const r = solved(corridorSweep(c));
  expect([...r.order].sort((a, b) => a - b)).toEqual(c.stops.map((_, i) => i));
  expect(priced(c, r.order)).toBe(r.lengthMm);
  expect(r.lengthMm).toBe(heldKarpLength(c));
}

function pick<T>(rand: () => number, xs: readonly T[]): T {
  return xs[Math.floor(rand() * xs.length)] as T;
}

describe("corridor sweep DP against Held–Karp (lib/routing/held-karp.ts)", () => {
  for (const crossAisles of [2, 3, 4, 5]) {
    it(`equals the Held–Karp optimum on 80 seeded warehouse batches with ${crossAisles} cross aisles`, () => {
      for (let k = 0; k < 80; k++) {
        const seed = 1000 * crossAisles + k;
        const d = generateWarehouse({ aisles: 2 + (k % 6), positions: 4 + (k % 9), levels: 1 + (k % 2), crossAisles });
        const stops = 1 + (k % 16);
        // Half return to the depot (start = end), half end at the drop-off across the front.
        expectHeldKarp(batchCase(d, stops, seed, "D1", k % 2 === 0 ? "D1" : "P1"));
      }
    });
  }

  it("equals Held–Karp on blocked two-way warehouses, from and to random nodes and access points", () => {
    let checked = 0;
    for (let seed = 1; seed <= 60; seed++) {
      const d = blockedWarehouse(seed, 2 + (seed % 4));
      const { graph, dm } = published(d);
      const rand = mulberry32(seed);
      const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
      const pts = reachablePoints(graph, dm, depot);
      const start = seed % 3 === 0 ? depot : pick(rand, pts);
      const end = seed % 4 === 0 ? start : pick(rand, pts);
      const stops = Array.from({ length: 1 + (seed % 12) }, () => pick(rand, graph.accessPoints)).filter((p) =>
        pts.includes(p),
      );
      expectHeldKarp(caseOf(graph, dm, start, end, [...new Set(stops)]));
      checked++;
    }
    expect(checked).toBe(60);
  });

  it("equals Held–Karp on obstructed warehouses (helpers/layouts.ts) with their one-way marks cleared", () => {
    for (let seed = 1; seed <= 30; seed++) {
      const d = obstructedWarehouse(seed);
      d.oneWay = d.oneWay.map(() => null);
      const { graph, dm } = published(d);
      const rand = mulberry32(seed);
      const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
      const pts = reachablePoints(graph, dm, depot);
      const end = seed % 2 === 0 ? depot : pick(rand, pts);
      const stops = [...new Set(Array.from({ length: 4 + (seed % 11) }, () => pick(rand, pts)))];
      expectHeldKarp(caseOf(graph, dm, depot, end, stops));
    }
  });

  it("equals Held–Karp on irregular small drawings, stops on nodes and on edges", () => {
    let checked = 0;
    for (let seed = 1; checked < 120; seed++) {
      const { graph, dm } = published(irregularDrawing(seed));
      if (graph.depots.length === 0 || graph.edges.length === 0) continue;
      const rand = mulberry32(seed);
      const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
      const pts = reachablePoints(graph, dm, depot);
      const start = seed % 2 === 0 ? depot : pick(rand, pts);
      const end = seed % 3 === 0 ? start : pick(rand, pts);
      const stops = [...new Set(Array.from({ length: 1 + (seed % 10) }, () => pick(rand, pts)))];
      expectHeldKarp(caseOf(graph, dm, start, end, stops));
      checked++;
    }
  });
});

describe("corridor sweep DP against brute force over permutations (tests/routing/helpers/instances.ts)", () => {
  it("finds the shortest of all visiting orders on tiny batches", () => {
    for (let seed = 1; seed <= 60; seed++) {
      const d = generateWarehouse({
        aisles: 2 + (seed % 3),
        positions: 3 + (seed % 4),
        levels: 1,
        crossAisles: 2 + (seed % 3),
      });
      const c = batchCase(d, 1 + (seed % 6), seed, "D1", seed % 2 === 0 ? "D1" : "P1");
      const best = Math.min(...permutations(c.stops.map((_, i) => i)).map((o) => priced(c, o)));
      const r = solved(corridorSweep(c));
      expect(r.lengthMm).toBe(best);
      expect(priced(c, r.order)).toBe(best);
    }
  });
});

describe("corridor sweep DP edge cases (each checked against Held–Karp)", () => {
  const d = generateWarehouse({ aisles: 4, positions: 8, levels: 1, crossAisles: 3 });
  const { graph, dm } = published(d);
  const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
  const drop = nodeAccessPoint(graph, graph.dropoffs[0]!.node);

  it("zero stops: nothing to walk when start = end, the shortest path otherwise", () => {
    expect(solved(corridorSweep(caseOf(graph, dm, depot, depot, [])))).toEqual({ order: [], lengthMm: 0 });
    const c = caseOf(graph, dm, depot, drop, []);
    expect(solved(corridorSweep(c)).lengthMm).toBe(heldKarpLength(c));
  });

  it("all stops on one edge, start = end and start ≠ end", () => {
    const edge = graph.accessPoints[5]!.edge;
    const onEdge = graph.accessPoints.filter((p) => p.edge === edge);
    expect(onEdge.length).toBeGreaterThan(2);
    expectHeldKarp(caseOf(graph, dm, depot, depot, onEdge));
    expectHeldKarp(caseOf(graph, dm, depot, drop, onEdge));
  });

  it("stops exactly at the start, repeated stops, and a start or end part-way along an edge", () => {
    const some = graph.accessPoints.filter((_, i) => i % 5 === 1);
    expectHeldKarp(caseOf(graph, dm, depot, depot, [depot, ...some]));
    expectHeldKarp(caseOf(graph, dm, depot, drop, [...some, drop, depot]));
    expectHeldKarp(caseOf(graph, dm, depot, drop, [some[0]!, some[0]!, some[1]!]));
    const mid = graph.accessPoints[7]!;
    expectHeldKarp(caseOf(graph, dm, mid, mid, some));
    expectHeldKarp(caseOf(graph, dm, mid, depot, [mid, ...some]));
    const sameEdge = graph.accessPoints.filter((p) => p.edge === mid.edge && p !== mid);
    expectHeldKarp(caseOf(graph, dm, mid, sameEdge[0]!, sameEdge.slice(1)));
    expectHeldKarp(caseOf(graph, dm, sameEdge[0]!, sameEdge[0]!, [mid]));
  });

  it("an unreachable stop is an explicit error", () => {
    const split = generateWarehouse({ aisles: 3, positions: 6, levels: 1, crossAisles: 2 });
    // Block both cross aisles between the first and second aisle, cutting the first aisle off.
    for (const y of [0, split.height - 1]) split.cells[y * split.width + 2] = "blocked";
    const g = published(split);
    const far = g.graph.accessPoints.filter((p) => p.x > 3).slice(0, 2);
    const dep = nodeAccessPoint(g.graph, g.graph.depots[0]!.node);
    expect(() => corridorSweep(caseOf(g.graph, g.dm, dep, dep, far))).toThrow(UnreachableStopError);
  });

  it("skips layouts with one-way edges and says why", () => {
    const oneWay = generateWarehouse({ aisles: 4, positions: 8, levels: 1, crossAisles: 3, oneWayAisles: true });
    expect(corridorSweep(batchCase(oneWay, 5, 1, "D1", "P1"))).toEqual({ skipped: "one-way" });
    const obstructed = obstructedWarehouse(2);
    expect(published(obstructed).graph.edges.some((e) => e.oneWay)).toBe(true);
    expect(corridorSweep(batchCase(obstructed, 5, 2, "D1", "D1"))).toEqual({ skipped: "one-way" });
  });

  it("gives up with front-too-wide when a front holds more states than allowed", () => {
    const c = batchCase(generateWarehouse({ aisles: 6, positions: 10, levels: 1, crossAisles: 5 }), 12, 3, "D1", "P1");
    const r = corridorSweep({ ...c, maxStates: 3 });
    expect(r).toMatchObject({ skipped: "front-too-wide" });
  });

  it("reports a front of at most cross aisles + 1 on rectangular warehouses (swept aisle by aisle)", () => {
    for (const crossAisles of [2, 3, 4, 5]) {
      const g = published(generateWarehouse({ aisles: 8, positions: 12, levels: 1, crossAisles })).graph;
      expect(corridorFrontWidth(g)).toBeLessThanOrEqual(crossAisles + 1);
    }
  });
});

describe("corridor sweep DP on large batches, against local search (lib/routing/local-search.ts)", () => {
  it("40–150 stops: the order prices to exactly its length and is never longer than local search", () => {
    for (let k = 0; k < 12; k++) {
      const crossAisles = 2 + (k % 4);
      const d = generateWarehouse({ aisles: 10, positions: 24, levels: 2, crossAisles });
      const n = 40 + Math.floor((k * 110) / 11);
      const c = batchCase(d, n, 500 + k, "D1", k % 2 === 0 ? "D1" : "P1");
      const r = solved(corridorSweep(c));
      expect([...r.order].sort((a, b) => a - b)).toEqual(c.stops.map((_, i) => i));
      expect(priced(c, r.order)).toBe(r.lengthMm);
      const ls = localSearch(
        c.cm,
        0,
        1,
        c.stops.map((_, i) => i + 2),
        { seed: k, kicks: 50 },
      );
      expect(r.lengthMm).toBeLessThanOrEqual(ls.length);
    }
  });
});
