import { describe, expect, it } from "vitest";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { depot, docFromRows, dropoff, rackRun } from "./fixtures";

describe("toGridDrawing", () => {
  const doc = docFromRows(["xxxxx", "f.fff", "fffff"], {
    rackRuns: [rackRun({ id: "R1", x: 1, y: 0, length: 2, levels: 1, facing: "S" })],
    oneWay: [
      { cell: 5, dir: "E" },
      { cell: 1, dir: "N" },
    ],
    depots: [depot(0, 2)],
    dropoffs: [dropoff(4, 2)],
  });
  const d = toGridDrawing(doc);

  it("makes outside and blocked ground blocked, floor floor, and rack cells rack with their facing", () => {
    expect(d.cells).toEqual([
      "blocked",
      "rack",
      "rack",
      "blocked",
      "blocked",
      "floor",
      "blocked",
      "floor",
      "floor",
      "floor",
      "floor",
      "floor",
      "floor",
      "floor",
      "floor",
    ]);
    expect(d.facing[1]).toBe("S");
    expect(d.facing[2]).toBe("S");
    expect(d.facing[0]).toBeNull();
  });
  it("keeps one-way marks on floor cells only", () => {
    expect(d.oneWay[5]).toBe("E");
    expect(d.oneWay[1]).toBeNull();
  });
  it("passes points by id and position and lists every bin", () => {
    expect(d.depots).toEqual([{ id: "D1", x: 0, y: 2 }]);
    expect(d.dropoffs).toEqual([{ id: "P1", x: 4, y: 2 }]);
    expect(d.bins).toEqual([
      { code: "01-001-1", aisle: 1, bay: 1, level: 1, x: 1, y: 0 },
      { code: "01-002-1", aisle: 1, bay: 2, level: 1, x: 2, y: 0 },
    ]);
  });
  it("gives the same drawing for the same document", () => {
    expect(JSON.stringify(toGridDrawing(structuredClone(doc)))).toBe(JSON.stringify(d));
  });
});
