import { describe, expect, it } from "vitest";
import { HISTORY_LIMIT, canRedo, canUndo, record, redo, revision, startHistory, undo } from "@/lib/floor-plan/history";
import { docFromRows, rackRun } from "./fixtures";

const doc = docFromRows(["ffff", "ffff", "ffff", "ffff"]);

describe("undo and redo", () => {
  it("undoes and redoes a sequence of edits in order", () => {
    let h = startHistory(doc);
    h = record(h, { type: "paint", cells: [0], ground: "x" });
    const afterPaint = h.present;
    h = record(h, { type: "add-rack-run", run: rackRun({ id: "R1", x: 0, y: 1, length: 2 }) });
    const afterRun = h.present;
    h = undo(h);
    expect(h.present).toEqual(afterPaint);
    h = undo(h);
    expect(h.present).toEqual(doc);
    expect(canUndo(h)).toBe(false);
    h = redo(redo(h));
    expect(h.present).toEqual(afterRun);
    expect(canRedo(h)).toBe(false);
  });
  it("forgets the redo steps when a new edit is made", () => {
    let h = record(startHistory(doc), { type: "paint", cells: [0], ground: "x" });
    h = undo(h);
    h = record(h, { type: "paint", cells: [1], ground: "x" });
    expect(canRedo(h)).toBe(false);
    expect(h.present.ground.slice(0, 2)).toBe("fx");
  });
  it("makes no undo step for a command that changes nothing", () => {
    const h = startHistory(doc);
    expect(record(h, { type: "paint", cells: [0], ground: "f" })).toBe(h);
  });
  it("tells the saved state by revision, also after undoing back to it", () => {
    let h = record(startHistory(doc), { type: "paint", cells: [0], ground: "x" });
    const saved = revision(h);
    h = record(h, { type: "paint", cells: [1], ground: "x" });
    expect(revision(h)).not.toBe(saved);
    h = undo(h);
    expect(revision(h)).toBe(saved);
    h = undo(h);
    expect(revision(h)).not.toBe(saved);
    h = record(h, { type: "paint", cells: [0], ground: "x" });
    // Same drawing as the saved one, but reached by a new edit: still counted as a change.
    expect(revision(h)).not.toBe(saved);
  });
  it("keeps at most HISTORY_LIMIT undo steps", () => {
    let h = startHistory(docFromRows(["f".repeat(20), ...Array(14).fill("f".repeat(20))]));
    for (let i = 0; i < HISTORY_LIMIT + 5; i++) h = record(h, { type: "paint", cells: [i], ground: "x" });
    expect(h.past).toHaveLength(HISTORY_LIMIT);
    while (canUndo(h)) h = undo(h);
    expect(h.present.ground.slice(0, 6)).toBe("xxxxxf");
    expect(revision(h)).toBe(h.baseRevision);
  });
});
