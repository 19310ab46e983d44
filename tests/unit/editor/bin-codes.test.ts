import { describe, expect, it } from "vitest";
import {
  bayAt,
  documentBins,
  formatCode,
  rackRunBins,
  rackRunCells,
  unusedCustomCodes,
} from "@/lib/floor-plan/bin-codes";
import { rackRun } from "./fixtures";

describe("formatCode", () => {
  it("pads each placeholder to its width with zeros", () => {
    expect(formatCode("{aisle:2}-{bay:3}-{level}", { aisle: 3, bay: 7, level: 2 })).toBe("03-007-2");
    expect(formatCode("A{aisle}.{bay:2}.{level:2}", { aisle: 12, bay: 5, level: 1 })).toBe("A12.05.01");
  });
  it("never truncates a number longer than its width", () => {
    expect(formatCode("{aisle:2}-{bay:3}-{level}", { aisle: 123, bay: 4567, level: 10 })).toBe("123-4567-10");
  });
  it("fills every occurrence and leaves literal text alone", () => {
    expect(formatCode("Z{bay}/{bay:2}-L{level}", { aisle: 1, bay: 4, level: 3 })).toBe("Z4/04-L3");
  });
});

describe("rackRunCells", () => {
  it("walks along x for a horizontal run and along y for a vertical one", () => {
    expect(rackRunCells({ x: 2, y: 5, orientation: "h", length: 3 })).toEqual([
      { x: 2, y: 5 },
      { x: 3, y: 5 },
      { x: 4, y: 5 },
    ]);
    expect(rackRunCells({ x: 2, y: 5, orientation: "v", length: 2 })).toEqual([
      { x: 2, y: 5 },
      { x: 2, y: 6 },
    ]);
  });
});

describe("rackRunBins", () => {
  it("gives every bay all its levels, bays counting up from firstBay", () => {
    const bins = rackRunBins(rackRun({ id: "R1", x: 0, y: 0, length: 2, levels: 3, aisle: 4, firstBay: 10 }));
    expect(bins.map((b) => b.code)).toEqual(["04-010-1", "04-010-2", "04-010-3", "04-011-1", "04-011-2", "04-011-3"]);
    expect(bins[3]).toEqual({ code: "04-011-1", aisle: 4, bay: 11, level: 1, x: 1, y: 0, runId: "R1" });
  });
  it("numbers odd bays on one side and even on the other with bayStep 2", () => {
    const odd = rackRunBins(rackRun({ id: "odd", x: 0, y: 0, length: 3, levels: 1, bayStep: 2, firstBay: 1 }));
    const even = rackRunBins(
      rackRun({ id: "even", x: 0, y: 2, length: 3, levels: 1, bayStep: 2, firstBay: 2, facing: "N" }),
    );
    expect(odd.map((b) => b.bay)).toEqual([1, 3, 5]);
    expect(even.map((b) => b.bay)).toEqual([2, 4, 6]);
  });
  it("counts bays down along the run when the direction is reversed", () => {
    const run = rackRun({
      id: "R",
      x: 3,
      y: 1,
      orientation: "v",
      facing: "E",
      length: 4,
      levels: 1,
      bayStep: 2,
      firstBay: 1,
      bayDirection: "reverse",
    });
    expect(rackRunBins(run).map((b) => [b.y, b.bay])).toEqual([
      [1, 7],
      [2, 5],
      [3, 3],
      [4, 1],
    ]);
    expect(bayAt(run, 3)).toBe(1);
  });
  it("uses an imported custom code where one is given for that bay and level", () => {
    const run = rackRun({
      id: "R",
      x: 0,
      y: 0,
      length: 2,
      levels: 2,
      customCodes: [{ bay: 2, level: 1, code: "SPECIAL-1" }],
    });
    expect(rackRunBins(run).map((b) => b.code)).toEqual(["01-001-1", "01-001-2", "SPECIAL-1", "01-002-2"]);
  });
  it("reports custom codes for bays or levels the run no longer has", () => {
    const run = rackRun({
      id: "R",
      x: 0,
      y: 0,
      length: 2,
      levels: 2,
      customCodes: [
        { bay: 2, level: 2, code: "KEEP" },
        { bay: 3, level: 1, code: "GONE" },
        { bay: 1, level: 3, code: "HIGH" },
      ],
    });
    expect(unusedCustomCodes(run).map((c) => c.code)).toEqual(["GONE", "HIGH"]);
  });
  it("lists a document's bins run after run", () => {
    const bins = documentBins({
      rackRuns: [
        rackRun({ id: "A", x: 0, y: 0, length: 1, levels: 1 }),
        rackRun({ id: "B", x: 0, y: 1, length: 1, levels: 1, aisle: 2 }),
      ],
    });
    expect(bins.map((b) => `${b.runId}:${b.code}`)).toEqual(["A:01-001-1", "B:02-001-1"]);
  });
});
