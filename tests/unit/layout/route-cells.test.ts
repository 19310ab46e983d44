import { describe, expect, it } from "vitest";
import { accessDistance, buildGraph, floydWarshall, generateWarehouse } from "../../../lib/routing";
import { batchWalkPoints, joinedCells, walkLegs } from "../../../lib/layout-versions/route-cells";
import { batchLegs } from "../../../lib/picking/legs";
import { batchRouteCells } from "../../../lib/waves/batch-route";

const graph = buildGraph(generateWarehouse({ aisles: 3, positions: 5, levels: 1, crossAisles: 2 }));
const matrix = floydWarshall(graph);
const stops = [2, 9, 13];

/** Cells side by side on the grid (a walk never jumps). */
function steps(cells: number[]): boolean {
  const w = graph.width;
  return cells.every((c, i) => i === 0 || Math.abs(c - cells[i - 1]!) === 1 || Math.abs(c - cells[i - 1]!) === w);
}

describe("the walk drawn on a plan", () => {
  it("has one leg per hop, each as long as the distance table says and drawn cell by cell", () => {
    const points = batchWalkPoints(graph, "D1", "P1", stops);
    const legs = walkLegs(graph, matrix, points);
    expect(legs).toHaveLength(stops.length + 1);
    legs.forEach((leg, i) => {
      expect(leg.mm).toBe(accessDistance(graph, matrix, points[i]!, points[i + 1]!));
      expect(steps(leg.cells)).toBe(true);
    });
  });

  it("joins the legs without drawing a shared cell twice", () => {
    const legs = walkLegs(graph, matrix, batchWalkPoints(graph, "D1", "P1", stops));
    const cells = joinedCells(legs);
    expect(steps(cells)).toBe(true);
    expect(cells.every((c, i) => i === 0 || c !== cells[i - 1])).toBe(true);
    expect(cells[0]).toBe(legs[0]!.cells[0]);
    expect(cells.at(-1)).toBe(legs.at(-1)!.cells.at(-1));
  });

  it("gives the handheld's legs and the batch page's walk from the same search", () => {
    const legs = batchLegs(graph, matrix, "D1", "P1", stops);
    const route = batchRouteCells(graph, matrix, "D1", "P1", stops);
    expect(route.legsMm).toEqual(legs.map((l) => l.mm));
    expect(route.cells).toEqual(joinedCells(legs));
  });

  it("leaves a leg empty where an end is unknown; the batch page then draws nothing", () => {
    const legs = batchLegs(graph, matrix, "nowhere", "P1", stops);
    expect(legs[0]).toEqual({ cells: [], mm: 0 });
    expect(legs[1]!.cells.length).toBeGreaterThan(0);
    expect(batchRouteCells(graph, matrix, "nowhere", "P1", stops)).toEqual({ cells: [], legsMm: [] });
  });

  it("passes by a stop the graph does not hold on the batch page, and leaves its legs empty on the handheld", () => {
    const withGhost = [stops[0]!, 9999, ...stops.slice(1)];
    expect(batchRouteCells(graph, matrix, "D1", "P1", withGhost)).toEqual(
      batchRouteCells(graph, matrix, "D1", "P1", stops),
    );
    const legs = batchLegs(graph, matrix, "D1", "P1", withGhost);
    expect(legs[1]).toEqual({ cells: [], mm: 0 });
    expect(legs[2]).toEqual({ cells: [], mm: 0 });
  });
});
