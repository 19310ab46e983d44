import { describe, expect, it } from "vitest";
import { emptyDrawing, generateWarehouse, validateDrawing } from "../../lib/routing";

describe("validateDrawing", () => {
  it("passes a generated warehouse, with and without one-way aisles", () => {
    expect(validateDrawing(generateWarehouse({ aisles: 4, positions: 6, levels: 2, crossAisles: 2 }))).toEqual([]);
    expect(
      validateDrawing(generateWarehouse({ aisles: 4, positions: 6, levels: 2, crossAisles: 3, oneWayAisles: true })),
    ).toEqual([]);
  });

  it("reports missing depot and drop-off", () => {
    const codes = validateDrawing(emptyDrawing(3, 3, 1000)).map((i) => i.code);
    expect(codes).toContain("missing-depot");
    expect(codes).toContain("missing-dropoff");
  });

  it("reports a bin facing no floor, duplicate codes and a disconnected floor region", () => {
    const d = emptyDrawing(5, 3, 1000);
    for (let y = 0; y < 3; y++) d.cells[y * 5 + 2] = "blocked";
    d.cells[0] = "rack";
    d.facing[0] = "N";
    d.depots = [{ id: "D1", x: 0, y: 2 }];
    d.dropoffs = [{ id: "P1", x: 1, y: 2 }];
    d.bins = [
      { code: "X", aisle: 1, bay: 1, level: 1, x: 0, y: 0 },
      { code: "X", aisle: 1, bay: 1, level: 2, x: 0, y: 0 },
    ];
    const issues = validateDrawing(d);
    expect(issues.map((i) => i.code).sort()).toEqual(["bin-without-access", "duplicate-bin-code", "unreachable-floor"]);
    expect(issues.find((i) => i.code === "unreachable-floor")!.cells!.length).toBe(6);
  });

  it("reports a one-way trap and the bins inside it", () => {
    // A one-way aisle pointing into a dead end: in from the depot, no way back out.
    const d = emptyDrawing(4, 3, 1000);
    d.cells[1 * 4 + 1] = "blocked";
    d.cells[1 * 4 + 2] = "blocked";
    d.cells[1 * 4 + 3] = "blocked";
    d.cells[2 * 4 + 2] = "blocked";
    d.cells[2 * 4 + 3] = "rack";
    d.facing[2 * 4 + 3] = "N";
    d.oneWay[0 * 4 + 2] = "E";
    d.depots = [{ id: "D1", x: 0, y: 2 }];
    d.dropoffs = [{ id: "P1", x: 1, y: 2 }];
    d.bins = [{ code: "B1", aisle: 1, bay: 1, level: 1, x: 3, y: 2 }];
    d.cells[1 * 4 + 3] = "floor";
    const issues = validateDrawing(d);
    const trap = issues.find((i) => i.code === "one-way-trap");
    // The marked cell itself is already past the point of no return.
    expect(trap?.cells).toEqual([
      { x: 2, y: 0 },
      { x: 3, y: 0 },
      { x: 3, y: 1 },
    ]);
    expect(issues.find((i) => i.code === "bin-unreachable")?.bins).toEqual(["B1"]);
  });
});
