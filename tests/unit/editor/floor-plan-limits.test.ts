import { describe, expect, it } from "vitest";
import { checkDocument } from "@/lib/floor-plan/checks";
import { GROUND, type EditorDocument } from "@/lib/floor-plan/document";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { buildGraph } from "@/lib/routing/build-graph";
import { depot, docFromRows, dropoff, rackRun } from "./fixtures";

/** Column 32 of layout_bins.code (migrations/20261202000100_floor_plans_and_layout_versions.ts). */
const CODE_COLUMN = 32;

function aisleDoc(pattern: string): EditorDocument {
  return docFromRows(["xxxxxxx", "xfffffx", "xfffffx", "xfffffx", "xfffffx", "xxxxxxx"], {
    rackRuns: [rackRun({ id: "A", x: 1, y: 2, orientation: "v", length: 2, facing: "E", pattern })],
    depots: [depot(1, 4)],
    dropoffs: [dropoff(5, 4)],
  });
}

describe("location code length", () => {
  it("refuses a pattern whose codes are longer than the database column, naming the pattern and the run", () => {
    const pattern = "WH-NORTH-{aisle:9}-{bay:9}-{level:4}";
    expect("WH-NORTH-000000001-000000001-0001".length).toBeGreaterThan(CODE_COLUMN);
    const problems = checkDocument(aisleDoc(pattern));
    const tooLong = problems.filter((p) => p.kind === "code-too-long");
    expect(tooLong).toHaveLength(1);
    expect(tooLong[0]).toMatchObject({ severity: "error", runId: "A" });
    expect(tooLong[0]!.message).toContain(pattern);
    expect(tooLong[0]!.message).toContain("WH-NORTH-000000001-000000001-0001");
    expect(tooLong[0]!.message).toContain(`at most ${CODE_COLUMN}`);
  });

  it("accepts a pattern whose longest code is exactly the column length", () => {
    const pattern = "WH-NORTH-{aisle:9}-{bay:9}-{level:3}";
    expect("WH-NORTH-000000001-000000001-001").toHaveLength(CODE_COLUMN);
    expect(checkDocument(aisleDoc(pattern)).filter((p) => p.kind === "code-too-long")).toEqual([]);
  });
});

/** A hall with a building column on every other cell: nothing to compress, about (side/2)² junctions. */
function pillarHall(side: number): EditorDocument {
  const rows = Array.from({ length: side }, (_, y) =>
    Array.from({ length: side }, (_, x) => (x % 2 === 1 && y % 2 === 1 ? GROUND.blocked : GROUND.floor)).join(""),
  );
  return docFromRows(rows, { cellMm: 500, depots: [depot(0, 0)], dropoffs: [dropoff(side - 1, 0)] });
}

describe("largest floor plan", () => {
  it("refuses a plan with more junctions than Trailbin can publish, saying how many, the limit and what to change", () => {
    const doc = pillarHall(400);
    const junctions = buildGraph(toGridDrawing(doc)).nodes.length;
    expect(junctions).toBeGreaterThan(30_000);
    const problems = checkDocument(doc).filter((p) => p.kind === "too-many-junctions");
    expect(problems).toHaveLength(1);
    expect(problems[0]!.severity).toBe("error");
    const message = problems[0]!.message;
    expect(message).toContain(junctions.toLocaleString("en-US"));
    const limit = Number(/at most ([\d,]+)/.exec(message)?.[1]?.replace(/,/g, ""));
    expect(limit).toBeGreaterThan(0);
    expect(limit).toBeLessThan(junctions);
    expect(message).toMatch(/wider|fewer|split/i);
  });

  it("a 200 × 200 m open floor (400 × 400 cells of 500 mm) around a block of 20 aisles compresses and passes the checks", () => {
    const side = 400;
    const runs = [];
    // Columns repeat [rack facing E, aisle, rack facing W]; neighbouring aisles' runs stand back to back.
    for (let a = 0; a < 20; a++) {
      runs.push(
        rackRun({
          id: `W${a}`,
          x: 100 + 3 * a,
          y: 100,
          orientation: "v",
          length: 150,
          facing: "E",
          aisle: a + 1,
          firstBay: 1,
          bayStep: 2,
          levels: 4,
        }),
      );
      runs.push(
        rackRun({
          id: `E${a}`,
          x: 102 + 3 * a,
          y: 100,
          orientation: "v",
          length: 150,
          facing: "W",
          aisle: a + 1,
          firstBay: 2,
          bayStep: 2,
          levels: 4,
        }),
      );
    }
    const doc = docFromRows(
      Array.from({ length: side }, () => GROUND.floor.repeat(side)),
      { cellMm: 500, rackRuns: runs, depots: [depot(0, side - 1)], dropoffs: [dropoff(side - 1, side - 1)] },
    );
    expect(checkDocument(doc).filter((p) => p.severity === "error")).toEqual([]);
    const graph = buildGraph(toGridDrawing(doc));
    expect(graph.bins).toHaveLength(40 * 150 * 4);
    // One junction per open cell would be over 100,000; the hall only needs its lines through the points that matter.
    expect(graph.nodes.length).toBeLessThan(500);
  });
});
