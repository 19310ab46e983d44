import { describe, expect, it } from "vitest";
import { editorReducer, initialEditorState } from "@/lib/floor-plan/editor-state";
import { intentForKey } from "@/lib/floor-plan/shortcuts";
import { offeredTools, paintsWith, toolForKey, toolRow, TOOLS } from "@/lib/floor-plan/tools";
import { docFromRows, rackRun } from "./fixtures";

const doc = docFromRows(["ffff", "ffff"], { rackRuns: [rackRun({ id: "R1", x: 0, y: 0 })] });
const key = (k: string) => ({ key: k, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false });

describe("the tools table", () => {
  it("gives every tool its own key and its own label", () => {
    expect(new Set(TOOLS.map((t) => t.key.toLowerCase())).size).toBe(TOOLS.length);
    expect(new Set(TOOLS.map((t) => t.label)).size).toBe(TOOLS.length);
    expect(TOOLS.map((t) => t.tool)).toEqual([
      "select",
      "floor",
      "blocked",
      "erase",
      "rack",
      "one-way",
      "depot",
      "dropoff",
    ]);
  });

  it("keys pick the tool of their row, in either case, and nothing else does", () => {
    for (const t of TOOLS) {
      expect(toolForKey(t.key)).toBe(t.tool);
      expect(intentForKey(key(t.key.toLowerCase()), { hasSelection: false })).toEqual({ type: "tool", tool: t.tool });
      expect(intentForKey(key(t.key.toUpperCase()), { hasSelection: false })).toEqual({ type: "tool", tool: t.tool });
    }
    expect(toolForKey("q")).toBeUndefined();
    // A named key whose first letter is a tool key is not that tool.
    expect(intentForKey(key("Escape"), { hasSelection: false })).toEqual({ type: "select", selection: null });
    expect(intentForKey(key("Delete"), { hasSelection: false })).toBeNull();
  });

  it("offers a viewer only the tools that do not edit, and the reducer refuses the others", () => {
    expect(offeredTools(false).map((t) => t.tool)).toEqual(["select"]);
    expect(offeredTools(true)).toHaveLength(TOOLS.length);
    for (const t of TOOLS) {
      const viewer = editorReducer(initialEditorState(doc, false), { type: "tool", tool: t.tool });
      expect(viewer.tool).toBe(t.edits ? "select" : t.tool);
      expect(editorReducer(initialEditorState(doc, true), { type: "tool", tool: t.tool }).tool).toBe(t.tool);
    }
  });

  it("keeps the selection only for the tools whose row says so", () => {
    const selected = editorReducer(initialEditorState(doc, true), {
      type: "select",
      selection: { kind: "run", id: "R1" },
    });
    for (const t of TOOLS) {
      const s = editorReducer(selected, { type: "tool", tool: t.tool });
      expect(s.selection).toEqual(t.tool === "select" || t.tool === "rack" ? { kind: "run", id: "R1" } : null);
    }
  });

  it("names the ground each paint tool paints", () => {
    expect(paintsWith("floor")).toBe("f");
    expect(paintsWith("blocked")).toBe("x");
    expect(paintsWith("erase")).toBe(".");
    expect(TOOLS.filter((t) => paintsWith(t.tool) !== undefined).map((t) => t.tool)).toEqual([
      "floor",
      "blocked",
      "erase",
    ]);
    expect(toolRow("depot").places).toBe("depot");
    expect(toolRow("dropoff").places).toBe("dropoff");
    for (const t of TOOLS) expect(toolRow(t.tool).hint.length).toBeGreaterThan(10);
  });
});
