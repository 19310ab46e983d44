import { describe, expect, it } from "vitest";
import { checkDocument, hasErrors, type Problem } from "@/lib/floor-plan/checks";
import type { EditorDocument } from "@/lib/floor-plan/document";
import * as engine from "@/lib/floor-plan/engine-checks";
import { bramblegateDocument } from "@/db/seeds/demo/floor-plan";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { depot, docFromRows, dropoff, rackRun } from "./fixtures";

const W = 7;
const at = (x: number, y: number) => y * W + x;

/** Two rack runs either side of one aisle, cross-aisles front and back, depot and drop-off at the front. */
function small(extra: Partial<EditorDocument> = {}): EditorDocument {
  return docFromRows(["xxxxxxx", "xfffffx", "xfffffx", "xfffffx", "xfffffx", "xxxxxxx"], {
    rackRuns: [
      rackRun({ id: "A", x: 1, y: 2, orientation: "v", length: 2, facing: "E", bayStep: 2, firstBay: 1 }),
      rackRun({ id: "B", x: 3, y: 2, orientation: "v", length: 2, facing: "W", bayStep: 2, firstBay: 2 }),
    ],
    depots: [depot(1, 4)],
    dropoffs: [dropoff(5, 4)],
    ...extra,
  });
}

const kinds = (ps: Problem[]) => ps.map((p) => p.kind);
const only = (ps: Problem[], kind: Problem["kind"]) => ps.filter((p) => p.kind === kind);

describe("checkDocument", () => {
  it("finds nothing wrong with a connected floor plan", () => {
    expect(checkDocument(small())).toEqual([]);
  });

  it("asks for a depot and a drop-off when they are missing", () => {
    expect(kinds(checkDocument(small({ depots: [] })))).toEqual(["no-depot"]);
    expect(kinds(checkDocument(small({ dropoffs: [] })))).toEqual(["no-dropoff"]);
    const none = checkDocument(small({ depots: [], dropoffs: [] }));
    expect(kinds(none)).toEqual(["no-depot", "no-dropoff"]);
    expect(none.every((p) => p.severity === "error")).toBe(true);
  });

  it("flags a depot placed on a wall", () => {
    const ps = checkDocument(small({ depots: [depot(0, 4)] }));
    expect(kinds(ps)).toEqual(["point-not-on-floor"]);
    expect(ps[0]?.cells).toEqual([at(0, 4)]);
    expect(ps[0]?.message).toContain("Depot D1");
  });

  it("flags bins whose rack face opens onto a wall", () => {
    const doc = small();
    doc.rackRuns[0] = { ...doc.rackRuns[0]!, facing: "W" };
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["bin-unreachable"]);
    expect(ps[0]).toMatchObject({ severity: "error", runId: "A", cells: [at(1, 2), at(1, 3)] });
    expect(ps[0]?.message).toMatch(/bays 1, 3 open onto no walkable floor on the west side/);
  });

  it("flags bins facing a walled-off pocket of floor, and the pocket itself as a warning", () => {
    const doc = docFromRows(["xxxxxxx", "xfffffx", "xxxxxfx", "xfxxxfx", "xxxxxfx", "xfffffx", "xxxxxxx"], {
      rackRuns: [rackRun({ id: "R", x: 2, y: 3, length: 1, facing: "W", orientation: "v" })],
      depots: [depot(1, 5)],
      dropoffs: [dropoff(5, 1)],
    });
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["bin-unreachable", "floor-cut-off"]);
    expect(ps[0]).toMatchObject({ runId: "R", cells: [at(2, 3)], severity: "error" });
    expect(ps[1]).toMatchObject({ cells: [at(1, 3)], severity: "warning" });
  });

  it("reports a walk that cannot be made between a walled-off depot and drop-off", () => {
    const doc = docFromRows(["xxxxxxx", "xfffxfx", "xfffxfx", "xxxxxxx"], {
      depots: [depot(1, 1)],
      dropoffs: [dropoff(5, 1)],
    });
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["no-path", "no-bins"]);
    expect(ps[0]).toMatchObject({ severity: "error", cells: [at(1, 1), at(5, 1)] });
    expect(ps[0]?.message).toMatch(/Connect them/);
  });

  describe("one-way marks", () => {
    // A cross-aisle on row 1 and a dead-end spur going south from it at x = 3.
    const spur = (dir: "N" | "S" | null) =>
      docFromRows(["xxxxxxx", "xfffffx", "xxxfxxx", "xxxfxxx", "xxxfxxx", "xxxxxxx"], {
        depots: [depot(1, 1)],
        dropoffs: [dropoff(5, 1)],
        rackRuns: [rackRun({ id: "S", x: 2, y: 3, orientation: "v", length: 1, facing: "E" })],
        oneWay: dir ? [2, 3, 4].map((y) => ({ cell: at(3, y), dir })) : [],
      });

    it("accept a two-way dead end", () => {
      expect(checkDocument(spur(null))).toEqual([]);
    });
    it("flag a one-way dead end that can be walked into but not out of", () => {
      const ps = checkDocument(spur("S"));
      const trap = only(ps, "one-way-trap");
      expect(trap).toHaveLength(1);
      expect(trap[0]).toMatchObject({ severity: "error", cells: [at(3, 2), at(3, 3), at(3, 4)] });
      expect(trap[0]?.message).toMatch(/walked into but have no way back/);
      expect(only(ps, "bin-unreachable")[0]).toMatchObject({ runId: "S", cells: [at(2, 3)] });
    });
    it("flag a one-way dead end that cannot be entered", () => {
      const trap = only(checkDocument(spur("N")), "one-way-trap");
      expect(trap[0]?.message).toMatch(/cannot be entered from a depot/);
    });
    it("accept a one-way loop that leads back", () => {
      // Two aisles between a back and a front cross-aisle: up one, down the other.
      const rows = ["xxxxxxx", "xfffffx", "xfxfxfx", "xfxfxfx", "xfffffx", "xxxxxxx"];
      const oneWay = [2, 3].flatMap((y) => [
        { cell: at(1, y), dir: "N" as const },
        { cell: at(5, y), dir: "S" as const },
      ]);
      const doc = docFromRows(rows, {
        depots: [depot(1, 4)],
        dropoffs: [dropoff(5, 4)],
        oneWay,
        rackRuns: [rackRun({ id: "M", x: 2, y: 2, orientation: "v", length: 2, facing: "W" })],
      });
      expect(checkDocument(doc)).toEqual([]);
    });
    it("report a depot cut from the drop-off by marks alone", () => {
      // One corridor, marked westwards: the drop-off at its east end cannot be reached.
      const doc = docFromRows(["xxxxxxx", "xfffffx", "xxxxxxx", "xxxxxxx"], {
        depots: [depot(1, 1)],
        dropoffs: [dropoff(5, 1)],
        oneWay: [{ cell: at(3, 1), dir: "W" }],
      });
      const path = only(checkDocument(doc), "no-path");
      expect(path[0]?.message).toMatch(/One-way marks block/);
    });
    it("warn about marks left on walls", () => {
      const ps = checkDocument(small({ oneWay: [{ cell: at(0, 0), dir: "N" }] }));
      expect(kinds(ps)).toEqual(["one-way-off-floor"]);
      expect(hasErrors(ps)).toBe(false);
    });
  });

  it("flags overlapping rack runs on the shared cells", () => {
    const doc = small();
    doc.rackRuns.push(rackRun({ id: "C", x: 1, y: 2, orientation: "v", length: 1, facing: "E", aisle: 5 }));
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["rack-overlap"]);
    expect(ps[0]).toMatchObject({ runId: "C", cells: [at(1, 2)] });
  });

  it("flags two runs numbered alike as one problem", () => {
    const doc = small();
    doc.rackRuns.push(
      rackRun({ id: "C", x: 5, y: 2, orientation: "v", length: 2, facing: "W", bayStep: 2, firstBay: 1 }),
    );
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["duplicate-code"]);
    expect(ps[0]?.message).toMatch(
      /A \(aisle 1\) and rack run C \(aisle 1\) give the same location codes \(4 codes: 01-001-1/,
    );
    expect(ps[0]?.cells).toEqual([at(1, 2), at(5, 2), at(1, 3), at(5, 3)]);
  });

  it("flags an imported code that repeats another bin's code", () => {
    const doc = small();
    doc.rackRuns[0] = { ...doc.rackRuns[0]!, customCodes: [{ bay: 1, level: 1, code: "01-003-1" }] };
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["duplicate-code"]);
    expect(ps[0]?.message).toMatch(/gives the same location code twice \(1 code: 01-003-1\)/);
  });

  it("warns about imported codes for bays the run no longer has", () => {
    const doc = small();
    doc.rackRuns[1] = { ...doc.rackRuns[1]!, customCodes: [{ bay: 8, level: 1, code: "OLD-8" }] };
    const ps = checkDocument(doc);
    expect(kinds(ps)).toEqual(["custom-code-unused"]);
    expect(ps[0]?.severity).toBe("warning");
  });

  it("flags two rack runs with the same id", () => {
    const doc = small();
    doc.rackRuns.push(rackRun({ id: "A", x: 5, y: 2, orientation: "v", length: 1, facing: "W", aisle: 7 }));
    expect(kinds(checkDocument(doc))).toEqual(["duplicate-id"]);
  });

  it("warns that a plan without rack runs has nothing to pick", () => {
    const ps = checkDocument(small({ rackRuns: [] }));
    expect(kinds(ps)).toEqual(["no-bins"]);
    expect(hasErrors(ps)).toBe(false);
  });

  it("lists errors before warnings", () => {
    const ps = checkDocument(small({ rackRuns: [], depots: [], oneWay: [{ cell: 0, dir: "N" }] }));
    expect(ps.map((p) => p.severity)).toEqual(["error", "warning", "warning"]);
  });

  it("checks a 200 × 150 floor plan of 130 rack runs without a false alarm", () => {
    const width = 200;
    const height = 150;
    const rows: string[] = [];
    for (let y = 0; y < height; y++) {
      let row = "";
      for (let x = 0; x < width; x++) row += x === 0 || y === 0 || x === width - 1 || y === height - 1 ? "x" : "f";
      rows.push(row);
    }
    const rackRuns = [];
    // Rack runs two cells apart with a cross-aisle every 30 rows: every bin faces a walkway.
    for (let band = 0; band < 5; band++) {
      for (let k = 0; k < 26; k++) {
        rackRuns.push(
          rackRun({
            id: `b${band}k${k}`,
            x: 2 + k * 7,
            y: 2 + band * 30,
            orientation: "v",
            length: 27,
            facing: k % 2 ? "W" : "E",
            aisle: band * 100 + k + 1,
            levels: 3,
          }),
        );
      }
    }
    const doc = docFromRows(rows, { rackRuns, depots: [depot(1, 1)], dropoffs: [dropoff(198, 148)] });
    // Its six-cell-wide walkways put a junction at nearly every bin, more than a publish can take: that is
    // the one problem, and nothing about walks or codes.
    expect(checkDocument(doc).map((p) => p.kind)).toEqual(["too-many-junctions"]);
  });
});

describe("agreement with the routing engine's validateDrawing", () => {
  const spurTrap = docFromRows(["xxxxxxx", "xfffffx", "xxxfxxx", "xxxfxxx", "xxxxxxx"], {
    depots: [depot(1, 1)],
    dropoffs: [dropoff(5, 1)],
    oneWay: [2, 3].map((y) => ({ cell: at(3, y), dir: "S" as const })),
  });
  const walled = docFromRows(["xxxxxxx", "xfffxfx", "xfffxfx", "xxxxxxx"], {
    depots: [depot(1, 1)],
    dropoffs: [dropoff(5, 1)],
  });
  const blind = small();
  blind.rackRuns[0] = { ...blind.rackRuns[0]!, facing: "W" };
  const dupes = small();
  dupes.rackRuns.push(
    rackRun({ id: "C", x: 5, y: 2, orientation: "v", length: 2, facing: "W", bayStep: 2, firstBay: 1 }),
  );
  const cases: [string, EditorDocument][] = [
    ["a clean plan", small()],
    ["no depot", small({ depots: [] })],
    ["no drop-off", small({ dropoffs: [] })],
    ["a depot on a wall", small({ depots: [depot(0, 4)] })],
    ["bins facing a wall", blind],
    ["duplicate codes", dupes],
    ["a one-way dead end", spurTrap],
    ["walled-off depot and drop-off", walled],
    [
      "a dead end that cannot be entered",
      { ...spurTrap, oneWay: spurTrap.oneWay.map((m) => ({ ...m, dir: "N" as const })) },
    ],
    [
      "a walled pocket",
      docFromRows(["xxxxxxx", "xfffffx", "xxxxxxx", "xfxfffx"], { depots: [depot(1, 1)], dropoffs: [dropoff(5, 1)] }),
    ],
    ["Bramblegate", bramblegateDocument()],
  ];

  it.each(cases)("%s: every engine issue is already among the editor's problems", (_name, doc) => {
    const ps = checkDocument(doc);
    const { engineOnlyProblems } = engine;
    expect(engineOnlyProblems(toGridDrawing(doc), ps)).toEqual([]);
  });

  it("passes on an engine error the editor's own checks did not report", () => {
    const doc = small({ depots: [] });
    const surfaced = engine.engineOnlyProblems(toGridDrawing(doc), []);
    expect(surfaced).toContainEqual(expect.objectContaining({ kind: "no-depot", severity: "error" }));
    expect(surfaced.every((p) => p.message.endsWith("."))).toBe(true);
  });
});
