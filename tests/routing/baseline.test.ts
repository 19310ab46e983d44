import { describe, expect, it } from "vitest";
import { baselineOrder, buildGraph, floydWarshall, generateWarehouse, planPick, randomBatch } from "../../lib/routing";

describe("baseline walk", () => {
  it("sorts by aisle, bays ascending in odd aisles and descending in even ones", () => {
    const line = (stop: number, aisle: number, bay: number) => ({
      stop,
      code: `A${aisle}-${bay}`,
      aisle,
      bay,
      level: 1,
    });
    const order = baselineOrder([
      line(1, 2, 3),
      line(2, 1, 9),
      line(3, 3, 5),
      line(4, 2, 8),
      line(5, 1, 2),
      line(6, 3, 1),
    ]);
    expect(order).toEqual([5, 2, 4, 1, 6, 3]);
  });

  it("visits a stop where its first line in that order falls", () => {
    const order = baselineOrder([
      { stop: 7, code: "A01-004-1", aisle: 1, bay: 4, level: 1 },
      { stop: 8, code: "A01-002-1", aisle: 1, bay: 2, level: 1 },
      { stop: 7, code: "A01-001-1", aisle: 1, bay: 1, level: 1 },
    ]);
    expect(order).toEqual([7, 8]);
  });
});

describe("planPick on a generated warehouse", () => {
  const graph = buildGraph(generateWarehouse({ aisles: 8, positions: 10, levels: 3, crossAisles: 2 }));
  const dm = floydWarshall(graph);

  it("collapses levels of a bay and facing bays into one stop", () => {
    const plan = planPick(graph, dm, {
      from: "D1",
      to: "P1",
      binCodes: ["A03-005-1", "A03-005-3", "A03-006-2", "A03-005-1"],
    });
    expect(plan.stops).toHaveLength(1);
    expect(plan.stops[0]!.codes).toEqual(["A03-005-1", "A03-005-3", "A03-006-2"]);
  });

  it("an optimal plan is never longer than the baseline walk", () => {
    for (let seed = 1; seed <= 10; seed++) {
      const plan = planPick(graph, dm, { from: "D1", to: "P1", binCodes: randomBatch(graph, 12, seed) });
      expect(plan.optimal).toBe(true);
      expect(plan.stops).toHaveLength(12);
      expect(plan.savingMm).toBe(plan.baselineMm - plan.lengthMm);
      expect(plan.savingMm).toBeGreaterThanOrEqual(0);
    }
  });
});
