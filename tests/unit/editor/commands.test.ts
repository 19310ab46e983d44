import { describe, expect, it } from "vitest";
import {
  applyCommand,
  describeCommand,
  execute,
  nextId,
  rectCells,
  resizeProblem,
  runProblem,
  type Command,
} from "@/lib/floor-plan/commands";
import { editorDocumentSchema } from "@/lib/floor-plan/document";
import { docFromRows, rackRun, depot, dropoff } from "./fixtures";

const BG = "0123456789abcdef0123456789abcdef";

function base() {
  return docFromRows(["xxxxxxxx", "xffffffx", "xffffffx", "xffffffx", "xffffffx", "xxxxxxxx"], {
    rackRuns: [
      rackRun({ id: "R0", x: 1, y: 1, length: 2 }),
      rackRun({ id: "R1", x: 2, y: 3, length: 3, facing: "N", aisle: 2 }),
    ],
    oneWay: [
      { cell: 1 * 8 + 5, dir: "E" },
      { cell: 4 * 8 + 3, dir: "W" },
    ],
    depots: [depot(1, 4), depot(2, 4, "D2")],
    dropoffs: [dropoff(6, 4)],
    background: { fileId: BG, opacity: 0.4 },
  });
}

const changing: [string, Command][] = [
  ["paint floor on walls", { type: "paint", cells: [0, 1, 1], ground: "f" }],
  ["paint blocked over a one-way mark", { type: "paint", cells: [13, 14], ground: "x" }],
  ["erase a rectangle", { type: "paint-rect", x0: 5, y0: 4, x1: 2, y1: 3, ground: "." }],
  ["paint a rectangle of floor", { type: "paint-rect", x0: 0, y0: 0, x1: 7, y1: 0, ground: "f" }],
  ["set ground cell by cell", { type: "set-ground-cells", cells: [9, 10, 9], ground: "x.f" }],
  ["mark one-way", { type: "set-one-way", cells: [17, 9, 13], dir: "S" }],
  ["clear a one-way mark", { type: "set-one-way", cells: [35], dir: null }],
  ["replace the marks", { type: "replace-one-way", marks: [{ cell: 10, dir: "N" }] }],
  [
    "add a rack run",
    { type: "add-rack-run", run: rackRun({ id: "R9", x: 6, y: 1, orientation: "v", facing: "W", length: 3 }) },
  ],
  [
    "add a rack run at the front",
    { type: "add-rack-run", run: rackRun({ id: "R8", x: 1, y: 2, length: 1 }), index: 0 },
  ],
  [
    "change a rack run",
    { type: "update-rack-run", id: "R1", changes: { levels: 4, facing: "S", pattern: "B{bay}-{level}" } },
  ],
  ["turn a rack run", { type: "update-rack-run", id: "R0", changes: { orientation: "v", facing: "E", length: 3 } }],
  ["move a rack run", { type: "move-rack-run", id: "R1", dx: 1, dy: -1 }],
  ["delete the first rack run", { type: "delete-rack-run", id: "R0" }],
  ["import custom codes", { type: "set-custom-codes", id: "R1", customCodes: [{ bay: 2, level: 1, code: "X-1" }] }],
  ["add a depot", { type: "add-point", kind: "depot", point: depot(3, 2, "D3") }],
  ["add a drop-off", { type: "add-point", kind: "dropoff", point: dropoff(4, 2, "P2") }],
  ["move a depot", { type: "move-point", kind: "depot", id: "D2", x: 5, y: 2 }],
  ["rename a drop-off", { type: "rename-point", kind: "dropoff", id: "P1", name: "Packing" }],
  ["delete the first depot", { type: "delete-point", kind: "depot", id: "D1" }],
  ["delete a drop-off", { type: "delete-point", kind: "dropoff", id: "P1" }],
  ["grow the grid", { type: "resize", width: 10, height: 7 }],
  ["crop the grid", { type: "resize", width: 7, height: 5 }],
  ["change the cell size", { type: "set-cell-size", cellMm: 1200 }],
  ["remove the background", { type: "set-background", background: null }],
  ["replace the background", { type: "set-background", background: { fileId: "f".repeat(32), opacity: 0.7 } }],
  ["set background opacity", { type: "set-background-opacity", opacity: 0.9 }],
  ["replace the document", { type: "replace-document", document: docFromRows(["ffff", "ffff", "ffff", "ffff"]) }],
  [
    "a batch",
    {
      type: "batch",
      label: "place the packing area",
      commands: [
        { type: "paint", cells: [0], ground: "f" },
        { type: "move-point", kind: "dropoff", id: "P1", x: 5, y: 3 },
        { type: "delete-rack-run", id: "R0" },
      ],
    },
  ],
];

describe("every command and its undo", () => {
  it.each(changing)("%s: changes a valid document into a valid one, and its inverse restores it", (_name, cmd) => {
    const doc = base();
    const before = structuredClone(doc);
    const done = execute(doc, cmd);
    expect(done).not.toBeNull();
    if (!done) return;
    expect(done.doc).not.toEqual(doc);
    expect(editorDocumentSchema.safeParse(done.doc).success).toBe(true);
    expect(doc).toEqual(before);
    expect(applyCommand(done.doc, done.inverse)).toEqual(doc);
    expect(describeCommand(cmd).length).toBeGreaterThan(0);
  });
});

const refused: [string, Command][] = [
  ["paint with the ground already there", { type: "paint", cells: [0, 8], ground: "x" }],
  ["paint outside the grid", { type: "paint", cells: [-1, 48, 1.5], ground: "f" }],
  ["mark a cell with the mark it has", { type: "set-one-way", cells: [13], dir: "E" }],
  ["add a run with a taken id", { type: "add-rack-run", run: rackRun({ id: "R1", x: 5, y: 1, length: 1 }) }],
  ["add a run past the edge", { type: "add-rack-run", run: rackRun({ id: "R5", x: 6, y: 1, length: 3 }) }],
  ["face a horizontal run east", { type: "update-rack-run", id: "R1", changes: { facing: "E" } }],
  ["change a run that is not there", { type: "update-rack-run", id: "nope", changes: { levels: 3 } }],
  ["move a run off the grid", { type: "move-rack-run", id: "R1", dx: 4, dy: 0 }],
  ["move a run by nothing", { type: "move-rack-run", id: "R1", dx: 0, dy: 0 }],
  ["delete a run that is not there", { type: "delete-rack-run", id: "nope" }],
  ["add a depot with a drop-off's id", { type: "add-point", kind: "depot", point: depot(3, 3, "P1") }],
  ["add a depot off the grid", { type: "add-point", kind: "depot", point: depot(8, 0, "D9") }],
  ["move a depot off the grid", { type: "move-point", kind: "depot", id: "D1", x: 0, y: 6 }],
  ["rename a depot to blank", { type: "rename-point", kind: "depot", id: "D1", name: "   " }],
  ["crop away a rack run", { type: "resize", width: 4, height: 6 }],
  ["resize below the minimum", { type: "resize", width: 3, height: 6 }],
  ["set a cell size out of range", { type: "set-cell-size", cellMm: 100 }],
  ["set a background with a bad file id", { type: "set-background", background: { fileId: "../etc", opacity: 0.5 } }],
  [
    "a batch of refused commands",
    { type: "batch", label: "nothing", commands: [{ type: "delete-rack-run", id: "nope" }] },
  ],
];

describe("refused and empty commands", () => {
  it.each(refused)("%s: gives back the same document", (_name, cmd) => {
    const doc = base();
    expect(execute(doc, cmd)).toBeNull();
    expect(applyCommand(doc, cmd)).toBe(doc);
  });
  it("opacity without a background changes nothing", () => {
    const doc = { ...base(), background: null };
    expect(applyCommand(doc, { type: "set-background-opacity", opacity: 0.5 })).toBe(doc);
  });
});

describe("what the commands do", () => {
  it("paints the rectangle between two corners, whichever way it was dragged", () => {
    const doc = applyCommand(base(), { type: "paint-rect", x0: 3, y0: 2, x1: 1, y1: 1, ground: "." });
    expect(doc.ground.slice(8, 24)).toEqual("x...fffx" + "x...fffx");
    expect(rectCells(doc, 6, 4, 9, 9)).toEqual([38, 39, 46, 47]);
  });
  it("drops one-way marks where floor is painted over, keeps them where floor is painted", () => {
    const blocked = applyCommand(base(), { type: "paint", cells: [13], ground: "x" });
    expect(blocked.oneWay).toEqual([{ cell: 35, dir: "W" }]);
    const floor = applyCommand(base(), { type: "paint", cells: [13, 0], ground: "f" });
    expect(floor.oneWay).toHaveLength(2);
  });
  it("keeps one-way marks one per cell and sorted", () => {
    const doc = applyCommand(base(), { type: "set-one-way", cells: [35, 9], dir: "N" });
    expect(doc.oneWay).toEqual([
      { cell: 9, dir: "N" },
      { cell: 13, dir: "E" },
      { cell: 35, dir: "N" },
    ]);
  });
  it("moves a rack run and its bins with it", () => {
    const doc = applyCommand(base(), { type: "move-rack-run", id: "R1", dx: 1, dy: -2 });
    expect(doc.rackRuns[1]).toMatchObject({ id: "R1", x: 3, y: 1 });
  });
  it("crops the grid at the right and bottom and keeps marks on their cells", () => {
    const doc = applyCommand(base(), { type: "resize", width: 7, height: 5 });
    expect(doc.ground).toBe("xxxxxxx" + "xffffff" + "xffffff" + "xffffff" + "xffffff");
    expect(doc.oneWay).toEqual([
      { cell: 1 * 7 + 5, dir: "E" },
      { cell: 4 * 7 + 3, dir: "W" },
    ]);
    const grown = applyCommand(base(), { type: "resize", width: 9, height: 7 });
    expect(grown.ground.slice(0, 9)).toBe("xxxxxxxx.");
    expect(grown.ground.slice(54)).toBe(".........");
  });
  it("clamps background opacity to what the document allows", () => {
    expect(applyCommand(base(), { type: "set-background-opacity", opacity: 0 }).background?.opacity).toBe(0.05);
  });
  it("says why a run or a resize is refused", () => {
    expect(runProblem(base(), rackRun({ id: "R7", x: 7, y: 1, length: 2 }))).toMatch(/edge/);
    expect(runProblem(base(), rackRun({ id: "R7", x: 1, y: 1, pattern: "{aisle}-{bay}" }))).toMatch(/level/);
    expect(resizeProblem(base(), 4, 6)).toMatch(/rack runs/);
    expect(resizeProblem(base(), 8, 6)).toBeNull();
  });
  it("picks the next free id for runs and points", () => {
    expect(nextId(base(), "run")).toBe("R2");
    expect(nextId(base(), "depot")).toBe("D3");
    expect(nextId(base(), "dropoff")).toBe("P2");
  });
});
