import { describe, expect, it } from "vitest";
import { editorReducer, initialEditorState, isDirty, type Intent } from "@/lib/floor-plan/editor-state";
import { intentForKey } from "@/lib/floor-plan/shortcuts";
import { depot, docFromRows, rackRun } from "./fixtures";

const doc = docFromRows(["ffffff", "ffffff", "ffffff", "ffffff"], {
  rackRuns: [rackRun({ id: "R1", x: 0, y: 1 })],
  depots: [depot(5, 3)],
});
const run = (intents: Intent[], canEdit = true) => intents.reduce(editorReducer, initialEditorState(doc, canEdit));
const key = (
  key: string,
  mods: Partial<{ ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }> = {},
) => ({ key, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

describe("editor state", () => {
  it("moves and deletes the selected rack run, and undoes both", () => {
    const s = run([
      { type: "select", selection: { kind: "run", id: "R1" } },
      { type: "nudge", dx: 1, dy: 1 },
      { type: "delete-selection" },
    ]);
    expect(s.history.present.rackRuns).toEqual([]);
    expect(s.selection).toBeNull();
    const back = editorReducer(editorReducer(s, { type: "undo" }), { type: "undo" });
    expect(back.history.present).toEqual(doc);
  });
  it("nudges a selected depot", () => {
    const s = run([
      { type: "select", selection: { kind: "depot", id: "D1" } },
      { type: "nudge", dx: -1, dy: 0 },
    ]);
    expect(s.history.present.depots[0]).toMatchObject({ x: 4, y: 3 });
  });
  it("drops the selection when an undo takes the selected run away", () => {
    const added = rackRun({ id: "R2", x: 0, y: 3 });
    const s = run([
      { type: "do", command: { type: "add-rack-run", run: added } },
      { type: "select", selection: { kind: "run", id: "R2" } },
      { type: "undo" },
    ]);
    expect(s.selection).toBeNull();
  });
  it("ignores a selection of something that is not there", () => {
    expect(run([{ type: "select", selection: { kind: "run", id: "nope" } }]).selection).toBeNull();
  });
  it("tracks unsaved changes against the last save", () => {
    const paint: Intent = { type: "do", command: { type: "paint", cells: [0], ground: "x" } };
    const s = run([paint]);
    expect(isDirty(s)).toBe(true);
    const saved = editorReducer(s, { type: "saved" });
    expect(isDirty(saved)).toBe(false);
    expect(isDirty(editorReducer(saved, { type: "undo" }))).toBe(true);
  });
  it("lets a read-only viewer look and select but not edit", () => {
    const s = run(
      [
        { type: "tool", tool: "floor" },
        { type: "do", command: { type: "paint", cells: [0], ground: "x" } },
        { type: "select", selection: { kind: "run", id: "R1" } },
        { type: "delete-selection" },
        { type: "zoom", by: "in" },
      ],
      false,
    );
    expect(s.tool).toBe("select");
    expect(s.history.present).toBe(doc);
    expect(s.selection).toEqual({ kind: "run", id: "R1" });
    expect(s.cellPx).toBeGreaterThan(initialEditorState(doc, false).cellPx);
  });
  it("zooms in and out through the steps and stops at the ends", () => {
    let s = initialEditorState(doc, true);
    const start = s.cellPx;
    s = editorReducer(s, { type: "zoom", by: "in" });
    expect(s.cellPx).toBeGreaterThan(start);
    s = editorReducer(s, { type: "zoom", by: "out" });
    expect(s.cellPx).toBe(start);
    for (let i = 0; i < 30; i++) s = editorReducer(s, { type: "zoom", by: "out" });
    expect(s.cellPx).toBe(3);
  });
});

describe("keyboard shortcuts", () => {
  it("maps tool letters, undo and redo", () => {
    expect(intentForKey(key("f"), { hasSelection: false })).toEqual({ type: "tool", tool: "floor" });
    expect(intentForKey(key("O"), { hasSelection: false })).toEqual({ type: "tool", tool: "one-way" });
    expect(intentForKey(key("z", { ctrlKey: true }), { hasSelection: false })).toEqual({ type: "undo" });
    expect(intentForKey(key("Z", { metaKey: true, shiftKey: true }), { hasSelection: false })).toEqual({
      type: "redo",
    });
    expect(intentForKey(key("y", { ctrlKey: true }), { hasSelection: false })).toEqual({ type: "redo" });
  });
  it("moves and deletes only with a selection", () => {
    expect(intentForKey(key("ArrowLeft"), { hasSelection: true })).toEqual({ type: "nudge", dx: -1, dy: 0 });
    expect(intentForKey(key("Delete"), { hasSelection: true })).toEqual({ type: "delete-selection" });
    expect(intentForKey(key("ArrowLeft"), { hasSelection: false })).toBeNull();
    expect(intentForKey(key("Delete"), { hasSelection: false })).toBeNull();
  });
  it("leaves other browser shortcuts alone", () => {
    expect(intentForKey(key("c", { ctrlKey: true }), { hasSelection: true })).toBeNull();
    expect(intentForKey(key("f", { altKey: true }), { hasSelection: false })).toBeNull();
    expect(intentForKey(key("+"), { hasSelection: false })).toEqual({ type: "zoom", by: "in" });
  });
});
