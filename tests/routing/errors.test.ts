import { describe, expect, it } from "vitest";
import {
  buildGraph,
  CostOverflowError,
  emptyDrawing,
  floydWarshall,
  planPick,
  sequenceStops,
  UNREACHABLE,
  UnknownLocationError,
  UnreachableStopError,
  type GridDrawing,
} from "../../lib/routing";

/**
 * 5×3, depot (0,2), drop-off (4,2):
 *   row 0  F F F F> F      (3,0) one-way east: (4,0) can be entered but not left
 *   row 1  F R # # R       racks at (1,1) and (4,1) open north
 *   row 2  F F F F F
 */
function drawing(): GridDrawing {
  const d = emptyDrawing(5, 3, 1000);
  d.cells[5 + 1] = "rack";
  d.facing[5 + 1] = "N";
  d.cells[5 + 2] = "blocked";
  d.cells[5 + 3] = "blocked";
  d.cells[5 + 4] = "rack";
  d.facing[5 + 4] = "N";
  d.oneWay[3] = "E";
  d.depots = [{ id: "D1", x: 0, y: 2 }];
  d.dropoffs = [{ id: "P1", x: 4, y: 2 }];
  d.bins = [
    { code: "OK-1", aisle: 1, bay: 1, level: 1, x: 1, y: 1 },
    { code: "TRAP-1", aisle: 1, bay: 3, level: 1, x: 4, y: 1 },
  ];
  return d;
}

describe("explicit errors", () => {
  it("an unreachable stop raises UnreachableStopError naming its bin code", () => {
    const graph = buildGraph(drawing());
    const dm = floydWarshall(graph);
    const attempt = () => planPick(graph, dm, { from: "D1", to: "P1", binCodes: ["OK-1", "TRAP-1"] });
    expect(attempt).toThrow(UnreachableStopError);
    expect(attempt).toThrow(/TRAP-1/);
    try {
      attempt();
    } catch (e) {
      expect((e as UnreachableStopError).codes).toEqual(["TRAP-1"]);
    }
    expect(planPick(graph, dm, { from: "D1", to: "P1", binCodes: ["OK-1"] }).lengthMm).toBeLessThan(UNREACHABLE);
  });

  it("unknown bin codes and points are named", () => {
    const graph = buildGraph(drawing());
    const dm = floydWarshall(graph);
    expect(() => planPick(graph, dm, { from: "D1", to: "P9", binCodes: ["NOPE"] })).toThrow(UnknownLocationError);
    expect(() => planPick(graph, dm, { from: "D1", to: "P9", binCodes: ["NOPE"] })).toThrow(/P9, NOPE/);
  });

  it("stops that are each reachable but cannot share one walk are named", () => {
    // Two one-way arcs 0→2 and 0→3 with no way between 2 and 3: each alone is fine.
    const U = UNREACHABLE;
    const cost = Int32Array.from([0, U, 1, 1, U, 0, U, U, U, 1, 0, U, U, 1, U, 0]);
    const cm = { n: 4, cost };
    expect(sequenceStops(cm, { start: 0, end: 1, stops: [2] }).length).toBe(2);
    expect(() => sequenceStops(cm, { start: 0, end: 1, stops: [2, 3] })).toThrow(UnreachableStopError);
  });

  it("costs that could overflow Int32 sums are refused", () => {
    const big = 400_000_000;
    const cm = {
      n: 4,
      cost: Int32Array.from([0, big, big, big, big, 0, big, big, big, big, 0, big, big, big, big, 0]),
    };
    expect(() => sequenceStops(cm, { start: 0, end: 1, stops: [2, 3] })).toThrow(CostOverflowError);
  });

  it("a bin whose face reaches no floor cell is reported, not dropped silently", () => {
    const d = drawing();
    d.facing[5 + 4] = "E"; // off the grid
    const graph = buildGraph(d);
    expect(graph.unattachedBins).toEqual([{ code: "TRAP-1", reason: "face-reaches-no-floor" }]);
    expect(graph.bins.map((b) => b.code)).toEqual(["OK-1"]);
  });
});
