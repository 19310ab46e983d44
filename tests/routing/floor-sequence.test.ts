import { describe, expect, it } from "vitest";
import { heldKarp, planPick, randomBatch, walkLength } from "../../lib/routing";
import { accessCostMatrix } from "../../lib/routing/plan";
import { lpRoute } from "../../lib/routing/lp/solve";
import { warehouseLayout } from "./helpers/warehouse-batch";

// planPick picks the method per batch; whichever it picks, the route must be the one another,
// independent method proves shortest. The cross-checks: Held–Karp where it reaches, and between
// the corridor sweep and the LP above it (the two share no code beyond the cost matrix).
const twoWay = warehouseLayout({ aisles: 8, positions: 24, crossAisles: 3, oneWay: false });
const oneWay = warehouseLayout({ aisles: 8, positions: 24, crossAisles: 3, oneWay: true });

function planned(layout: typeof twoWay, m: number, seed: number, to = "P1") {
  const binCodes = randomBatch(layout.graph, m, seed);
  return planPick(layout.graph, layout.dm, { from: "D1", to, binCodes });
}

/** The plan's matrix rebuilt from its stops, for a second opinion on the same batch. */
function matrixOf(layout: typeof twoWay, plan: ReturnType<typeof planPick>, closed: boolean) {
  const depot = layout.graph.depots[0]!.node;
  const drop = closed ? depot : layout.graph.dropoffs[0]!.node;
  const ap = (node: number) => ({ id: -1, x: 0, y: 0, node, edge: -1, offsetMm: 0 });
  const points = [ap(depot), ap(drop), ...plan.stops.map((s) => s.accessPoint)];
  return accessCostMatrix(layout.graph, layout.dm, points);
}

describe("planPick's choice of method", () => {
  it("takes Held–Karp for a handful of stops", () => {
    const p = planned(twoWay, 8, 11);
    expect(p.method).toBe("held-karp");
    expect(p.optimal).toBe(true);
  });

  it.each([13, 15, 17])("matches Held–Karp at %i stops on both floors", (m) => {
    for (const layout of [twoWay, oneWay]) {
      for (const seed of [1, 2]) {
        const p = planned(layout, m, 300 + 10 * m + seed);
        const cm = matrixOf(layout, p, false);
        const stops = p.stops.map((_, i) => i + 2);
        expect(p.optimal).toBe(true);
        expect(p.lowerBoundMm).toBe(p.lengthMm);
        expect(p.lengthMm).toBe(heldKarp(cm, 0, 1, stops).length);
        expect(p.method).toBe(layout === twoWay ? "corridor-dp" : "lp-cuts");
      }
    }
  });

  // No upper order and no pruning for the second opinion: the LP must find the optimum on its own.
  it.each([
    { floor: "two-way", m: 24, seed: 901, closed: false, method: "corridor-dp" },
    { floor: "two-way", m: 30, seed: 902, closed: true, method: "corridor-dp" },
    { floor: "two-way", m: 36, seed: 903, closed: false, method: "corridor-dp" },
    { floor: "one-way", m: 30, seed: 1904, closed: false, method: "lp-cuts" },
    { floor: "one-way", m: 45, seed: 1905, closed: true, method: "lp-cuts" },
    { floor: "one-way", m: 60, seed: 1906, closed: false, method: "lp-cuts" },
  ])(
    "$floor, $m stops: proved by $method, and the unpruned LP finds no shorter walk",
    ({ floor, m, seed, closed, method }) => {
      const layout = floor === "two-way" ? twoWay : oneWay;
      const p = planned(layout, m, seed, closed ? "D1" : "P1");
      expect(p.method).toBe(method);
      expect(p.optimal).toBe(true);
      const cm = matrixOf(layout, p, closed);
      const stops = p.stops.map((_, i) => i + 2);
      expect(walkLength(cm, 0, stops, 1)).toBe(p.lengthMm);
      const lp = lpRoute(cm, { start: 0, end: 1, stops });
      expect(lp.proved).toBe(true);
      expect(lp.length).toBe(p.lengthMm);
    },
  );

  it("gives the same route each time (a re-plan never moves a picker's stops)", () => {
    const a = planned(oneWay, 40, 77);
    const b = planned(oneWay, 40, 77);
    expect(b).toEqual(a);
  });
});
