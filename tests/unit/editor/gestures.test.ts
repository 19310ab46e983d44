import { describe, expect, it } from "vitest";
import { editorReducer, initialEditorState, type Intent } from "@/lib/floor-plan/editor-state";
import {
  drawnRun,
  hitTest,
  isWalkable,
  pointerAt,
  pointerCancel,
  pointerDown,
  pointerMove,
  pointerUp,
  previewCells,
  wheelIntent,
  type Cell,
  type Drag,
  type GestureContext,
  type PointerAt,
  type Step,
} from "@/lib/floor-plan/gestures";
import type { Tool } from "@/lib/floor-plan/tools";
import { depot, docFromRows, dropoff, rackRun } from "./fixtures";

// 6 × 4 cells: a rack run R1 on row 1 (x 0..2), a second run R2 drawn later across its end cell,
// a depot at (5, 3), a drop-off at (4, 3), a blocked cell at (5, 0) and an outside cell at (4, 0).
const doc = docFromRows(["ffff.x", "ffffff", "ffffff", "ffffff"], {
  rackRuns: [rackRun({ id: "R1", x: 0, y: 1 }), rackRun({ id: "R2", x: 2, y: 0, orientation: "v", length: 2 })],
  depots: [depot(5, 3)],
  dropoffs: [dropoff(4, 3)],
});
const W = doc.width;

const ctx = (tool: Tool, over: Partial<GestureContext> = {}): GestureContext => ({
  doc,
  tool,
  canEdit: true,
  paintShape: "brush",
  oneWayDir: "E",
  ...over,
});
const at = (x: number, y: number, client = { clientX: 100 + x * 10, clientY: 100 + y * 10 }): PointerAt => ({
  cell: { x, y },
  clamped: { x, y },
  ...client,
});
const off = (clamped: Cell, clientX = 0, clientY = 0): PointerAt => ({ cell: null, clamped, clientX, clientY });
const press = (p: PointerAt, over: Partial<{ button: number; shiftKey: boolean }> = {}) => ({
  ...p,
  button: 0,
  shiftKey: false,
  ...over,
});
const SCROLL = { left: 40, top: 30 };
const intents = (s: Step | null): Intent[] =>
  (s?.effects ?? []).flatMap((e) => (e.type === "intent" ? [e.intent] : []));

/** Presses at the first cell, moves through the rest and releases: what would be dispatched. */
function stroke(c: GestureContext, cells: (PointerAt | [number, number])[], shiftKey = false): Step {
  const points = cells.map((p) => (Array.isArray(p) ? at(p[0], p[1]) : p));
  const down = pointerDown(c, null, press(points[0]!, { shiftKey }), SCROLL);
  let drag = down?.drag ?? null;
  for (const p of points.slice(1)) drag = pointerMove(c, drag, p).drag;
  return pointerUp(c, drag);
}

describe("where the pointer is", () => {
  it("finds the cell under a screen point and the nearest cell on the grid", () => {
    const origin = { left: 128, top: 78 };
    expect(pointerAt(128 + 2 * 20 + 19, 78 + 3 * 20, origin, 20, doc)).toEqual({
      cell: { x: 2, y: 3 },
      clamped: { x: 2, y: 3 },
      clientX: 187,
      clientY: 138,
    });
    // On the rulers (left of and above the grid) and past the far edges there is no cell, but the nearest one.
    expect(pointerAt(120, 60, origin, 20, doc)).toMatchObject({ cell: null, clamped: { x: 0, y: 0 } });
    expect(pointerAt(128 + 6 * 20, 78 + 4 * 20 + 500, origin, 20, doc)).toMatchObject({
      cell: null,
      clamped: { x: 5, y: 3 },
    });
    expect(pointerAt(128 + 6 * 20 - 1, 78 + 4 * 20 - 1, origin, 20, doc).cell).toEqual({ x: 5, y: 3 });
  });
});

describe("pressing", () => {
  it("ignores every button but the primary one", () => {
    expect(pointerDown(ctx("floor"), null, press(at(1, 2), { button: 2 }), SCROLL)).toBeNull();
    expect(pointerDown(ctx("select"), null, press(at(5, 3), { button: 1 }), SCROLL)).toBeNull();
  });

  it("selects what is under the select tool, points before runs and the run drawn last first, and starts moving it", () => {
    const onDepot = pointerDown(ctx("select"), null, press(at(5, 3)), SCROLL);
    expect(intents(onDepot)).toEqual([{ type: "select", selection: { kind: "depot", id: "D1" } }]);
    expect(onDepot?.drag).toEqual({
      kind: "move-point",
      point: "depot",
      id: "D1",
      from: { x: 5, y: 3 },
      to: { x: 5, y: 3 },
    });
    expect(pointerDown(ctx("select"), null, press(at(4, 3)), SCROLL)?.drag).toMatchObject({
      kind: "move-point",
      point: "dropoff",
      id: "P1",
    });
    const onRun = pointerDown(ctx("select"), null, press(at(2, 1)), SCROLL);
    expect(intents(onRun)).toEqual([{ type: "select", selection: { kind: "run", id: "R2" } }]);
    expect(onRun?.drag).toEqual({ kind: "move-run", id: "R2", from: { x: 2, y: 1 }, to: { x: 2, y: 1 } });
    expect(hitTest(doc, { x: 0, y: 1 })).toEqual({ kind: "run", id: "R1" });
    expect(hitTest(doc, { x: 0, y: 3 })).toBeNull();
  });

  it("lets a viewer select but not move, whatever tool was left chosen", () => {
    const viewer = ctx("floor", { canEdit: false });
    const s = pointerDown(viewer, null, press(at(0, 1)), SCROLL);
    expect(intents(s)).toEqual([{ type: "select", selection: { kind: "run", id: "R1" } }]);
    expect(s?.drag).toBeNull();
    // On empty floor a viewer pans, as with the select tool.
    const pan = pointerDown(viewer, null, press(at(0, 3)), SCROLL);
    expect(intents(pan)).toEqual([{ type: "select", selection: null }]);
    expect(pan?.drag).toMatchObject({ kind: "pan" });
  });

  it("clears the selection and pans from empty floor with the select tool", () => {
    const s = pointerDown(ctx("select"), null, press(at(0, 3, { clientX: 7, clientY: 9 })), SCROLL);
    expect(intents(s)).toEqual([{ type: "select", selection: null }]);
    expect(s?.drag).toEqual({ kind: "pan", clientX: 7, clientY: 9, left: 40, top: 30 });
  });

  it("pans from off the grid with any tool, leaving the selection alone", () => {
    const s = pointerDown(ctx("floor"), null, press(off({ x: 0, y: 0 }, 3, 4)), SCROLL);
    expect(s).toEqual({ drag: { kind: "pan", clientX: 3, clientY: 4, left: 40, top: 30 }, effects: [] });
  });

  it("starts no pan without a scroll box to move", () => {
    expect(pointerDown(ctx("select"), null, press(at(0, 3)), null)?.drag).toBeNull();
  });

  it("starts a brush stroke or a rectangle by the paint shape, Shift giving the other", () => {
    expect(pointerDown(ctx("floor"), null, press(at(1, 2)), SCROLL)?.drag).toEqual({
      kind: "paint",
      cells: new Set([2 * W + 1]),
    });
    expect(pointerDown(ctx("blocked"), null, press(at(1, 2), { shiftKey: true }), SCROLL)?.drag).toEqual({
      kind: "rect",
      from: { x: 1, y: 2 },
      to: { x: 1, y: 2 },
    });
    expect(pointerDown(ctx("erase", { paintShape: "rect" }), null, press(at(1, 2)), SCROLL)?.drag).toMatchObject({
      kind: "rect",
    });
    expect(
      pointerDown(ctx("erase", { paintShape: "rect" }), null, press(at(1, 2), { shiftKey: true }), SCROLL)?.drag,
    ).toMatchObject({ kind: "paint" });
  });

  it("starts a one-way stroke only counting walkable floor, and a rack run at the cell", () => {
    expect(pointerDown(ctx("one-way"), null, press(at(1, 2)), SCROLL)?.drag).toEqual({
      kind: "one-way",
      cells: new Set([2 * W + 1]),
    });
    expect(pointerDown(ctx("one-way"), null, press(at(1, 1)), SCROLL)?.drag).toEqual({
      kind: "one-way",
      cells: new Set(),
    });
    expect(pointerDown(ctx("rack"), null, press(at(3, 2)), SCROLL)?.drag).toEqual({
      kind: "rack",
      from: { x: 3, y: 2 },
      to: { x: 3, y: 2 },
    });
  });

  it("places a depot or drop-off on walkable floor with the next id, and selects it", () => {
    const s = pointerDown(ctx("depot"), null, press(at(3, 3)), SCROLL);
    expect(s?.drag).toBeNull();
    expect(intents(s)).toEqual([
      { type: "do", command: { type: "add-point", kind: "depot", point: { id: "D2", x: 3, y: 3, name: "Depot 2" } } },
      { type: "select", selection: { kind: "depot", id: "D2" } },
    ]);
    expect(intents(pointerDown(ctx("dropoff"), null, press(at(0, 0)), SCROLL))[0]).toMatchObject({
      command: { point: { id: "P2", name: "Drop-off 2" } },
    });
  });

  it("selects the point already there instead of adding one, and places nothing off the floor or on a rack", () => {
    expect(intents(pointerDown(ctx("depot"), null, press(at(5, 3)), SCROLL))).toEqual([
      { type: "select", selection: { kind: "depot", id: "D1" } },
    ]);
    // A depot tool on the drop-off's cell: that cell is walkable, so the depot goes there too.
    expect(intents(pointerDown(ctx("depot"), null, press(at(4, 3)), SCROLL))[0]).toMatchObject({ type: "do" });
    for (const [x, y] of [
      [5, 0],
      [4, 0],
      [1, 1],
    ] as const)
      expect(intents(pointerDown(ctx("dropoff"), null, press(at(x, y)), SCROLL))).toEqual([]);
    expect(isWalkable(doc, { x: 1, y: 1 })).toBe(false);
    expect(isWalkable(doc, { x: 1, y: 2 })).toBe(true);
  });

  it("lets a second pointer's press replace the drag in progress, and leaves it when the press starts none", () => {
    const first = pointerDown(ctx("select"), null, press(at(0, 1)), SCROLL)!.drag;
    const second = pointerDown(ctx("select"), first, press(at(0, 3)), SCROLL)!;
    expect(second.drag).toMatchObject({ kind: "pan" });
    // A depot press starts no drag of its own, and a viewer's press on a run neither.
    const stroke: Drag = { kind: "paint", cells: new Set([0]) };
    expect(pointerDown(ctx("depot"), stroke, press(at(3, 3)), SCROLL)!.drag).toBe(stroke);
    expect(pointerDown(ctx("select", { canEdit: false }), stroke, press(at(0, 1)), SCROLL)!.drag).toBe(stroke);
  });
});

describe("moving", () => {
  it("does nothing without a drag", () => {
    expect(pointerMove(ctx("floor"), null, at(1, 1))).toEqual({ drag: null, effects: [] });
  });

  it("pans by the distance moved since the press", () => {
    const pan: Drag = { kind: "pan", clientX: 100, clientY: 50, left: 40, top: 30 };
    const s = pointerMove(ctx("select"), pan, off({ x: 0, y: 0 }, 130, 20));
    expect(s).toEqual({ drag: pan, effects: [{ type: "scroll", left: 10, top: 60 }] });
  });

  it("gathers brush cells on the grid, and none while the pointer is off it", () => {
    let d: Drag | null = { kind: "paint", cells: new Set([0]) };
    d = pointerMove(ctx("floor"), d, at(1, 0)).drag;
    d = pointerMove(ctx("floor"), d, off({ x: 5, y: 0 })).drag;
    d = pointerMove(ctx("floor"), d, at(1, 0)).drag;
    expect(d).toEqual({ kind: "paint", cells: new Set([0, 1]) });
  });

  it("gathers one-way cells only on walkable floor", () => {
    let d: Drag | null = { kind: "one-way", cells: new Set() };
    for (const p of [at(1, 1), at(1, 2), at(4, 0), at(5, 0), off({ x: 0, y: 3 }), at(3, 2)])
      d = pointerMove(ctx("one-way"), d, p).drag;
    expect(d).toEqual({ kind: "one-way", cells: new Set([2 * W + 1, 2 * W + 3]) });
  });

  it("keeps rectangles, rack runs and moves on the nearest grid cell", () => {
    for (const kind of ["rect", "rack"] as const) {
      expect(
        pointerMove(ctx("floor"), { kind, from: { x: 1, y: 1 }, to: { x: 1, y: 1 } }, off({ x: 5, y: 0 })).drag,
      ).toEqual({ kind, from: { x: 1, y: 1 }, to: { x: 5, y: 0 } });
    }
    expect(
      pointerMove(ctx("select"), { kind: "move-run", id: "R1", from: { x: 0, y: 1 }, to: { x: 0, y: 1 } }, at(2, 3))
        .drag,
    ).toMatchObject({ to: { x: 2, y: 3 } });
    expect(
      pointerMove(
        ctx("select"),
        { kind: "move-point", point: "depot", id: "D1", from: { x: 5, y: 3 }, to: { x: 5, y: 3 } },
        at(0, 3),
      ).drag,
    ).toMatchObject({ to: { x: 0, y: 3 } });
  });
});

describe("releasing", () => {
  it("paints a brush stroke with the ground of the tool", () => {
    expect(
      intents(
        stroke(ctx("blocked"), [
          [0, 3],
          [1, 3],
          [2, 3],
        ]),
      ),
    ).toEqual([{ type: "do", command: { type: "paint", cells: [18, 19, 20], ground: "x" } }]);
    expect(intents(stroke(ctx("erase"), [[0, 0]]))).toEqual([
      { type: "do", command: { type: "paint", cells: [0], ground: "." } },
    ]);
  });

  it("paints a rectangle from the press to the release", () => {
    expect(intents(stroke(ctx("floor"), [[4, 0], off({ x: 5, y: 2 }), [1, 3]], true))).toEqual([
      { type: "do", command: { type: "paint-rect", x0: 4, y0: 0, x1: 1, y1: 3, ground: "f" } },
    ]);
  });

  it("paints with the tool chosen at the release, and not at all after switching to one that does not paint", () => {
    const d: Drag = { kind: "paint", cells: new Set([3]) };
    expect(intents(pointerUp(ctx("blocked"), d))).toEqual([
      { type: "do", command: { type: "paint", cells: [3], ground: "x" } },
    ]);
    expect(pointerUp(ctx("select"), d)).toEqual({ drag: null, effects: [] });
    expect(pointerUp(ctx("rack"), { kind: "rect", from: { x: 0, y: 0 }, to: { x: 1, y: 1 } })).toEqual({
      drag: null,
      effects: [],
    });
  });

  it("marks one-way cells in the chosen direction, or clears them, and ignores a stroke over no floor", () => {
    expect(
      intents(
        stroke(ctx("one-way"), [
          [0, 2],
          [1, 2],
        ]),
      ),
    ).toEqual([{ type: "do", command: { type: "set-one-way", cells: [12, 13], dir: "E" } }]);
    expect(intents(stroke(ctx("one-way", { oneWayDir: null }), [[0, 2]]))).toEqual([
      { type: "do", command: { type: "set-one-way", cells: [12], dir: null } },
    ]);
    expect(
      stroke(ctx("one-way"), [
        [0, 1],
        [5, 0],
      ]),
    ).toEqual({ drag: null, effects: [] });
  });

  it("hands a drawn rack run to the session along the axis moved further", () => {
    expect(
      stroke(ctx("rack"), [
        [4, 3],
        [3, 2],
        [1, 2],
      ]).effects,
    ).toEqual([{ type: "rack-drawn", run: { x: 1, y: 3, orientation: "h", length: 4 } }]);
    expect(
      stroke(ctx("rack"), [
        [5, 3],
        [4, 0],
      ]).effects,
    ).toEqual([{ type: "rack-drawn", run: { x: 5, y: 0, orientation: "v", length: 4 } }]);
    expect(drawnRun({ x: 2, y: 2 }, { x: 2, y: 2 })).toEqual({ x: 2, y: 2, orientation: "h", length: 1 });
  });

  it("moves the run by the cells dragged, and the point to the release cell", () => {
    const run = stroke(ctx("select"), [
      [0, 1],
      [1, 2],
      [1, 3],
    ]);
    expect(intents(run)).toEqual([{ type: "do", command: { type: "move-rack-run", id: "R1", dx: 1, dy: 2 } }]);
    const point = stroke(ctx("select"), [
      [5, 3],
      [0, 3],
    ]);
    expect(intents(point)).toEqual([
      { type: "do", command: { type: "move-point", kind: "depot", id: "D1", x: 0, y: 3 } },
    ]);
  });

  it("ends a pan, and a release without a drag, with nothing to do", () => {
    expect(pointerUp(ctx("select"), { kind: "pan", clientX: 0, clientY: 0, left: 0, top: 0 })).toEqual({
      drag: null,
      effects: [],
    });
    expect(pointerUp(ctx("floor"), null)).toEqual({ drag: null, effects: [] });
  });

  it("drops any drag on cancel without an edit", () => {
    expect(pointerCancel()).toEqual({ drag: null, effects: [] });
  });

  it("edits the document through the reducer as the canvas dispatches it", () => {
    let s = initialEditorState(doc, true);
    const apply = (step: Step | null) => {
      for (const i of intents(step)) s = editorReducer(s, i);
    };
    apply(
      stroke(ctx("blocked"), [
        [0, 3],
        [1, 3],
      ]),
    );
    const down = pointerDown(ctx("select"), null, press(at(5, 3)), SCROLL);
    apply(down);
    apply(pointerUp(ctx("select"), pointerMove(ctx("select"), down!.drag, at(3, 2)).drag));
    expect(s.history.present.ground.slice(18, 20)).toBe("xx");
    expect(s.history.present.depots[0]).toMatchObject({ x: 3, y: 2 });
    expect(s.selection).toEqual({ kind: "depot", id: "D1" });
  });
});

describe("previews and the wheel", () => {
  it("previews the cells a paint or one-way drag would change", () => {
    expect(previewCells(doc, null)).toEqual({ cells: [], oneWay: false });
    expect(previewCells(doc, { kind: "paint", cells: new Set([4, 5]) })).toEqual({ cells: [4, 5], oneWay: false });
    expect(previewCells(doc, { kind: "one-way", cells: new Set([7]) })).toEqual({ cells: [7], oneWay: true });
    expect(
      previewCells(doc, { kind: "rect", from: { x: 1, y: 2 }, to: { x: 0, y: 3 } }).cells.sort((a, b) => a - b),
    ).toEqual([12, 13, 18, 19]);
    expect(previewCells(doc, { kind: "rack", from: { x: 1, y: 2 }, to: { x: 0, y: 3 } }).cells).toEqual([]);
  });

  it("zooms on Ctrl or ⌘ with the wheel, and leaves a plain wheel to scroll", () => {
    expect(wheelIntent({ ctrlKey: true, metaKey: false, deltaY: -3 })).toEqual({ type: "zoom", by: "in" });
    expect(wheelIntent({ ctrlKey: false, metaKey: true, deltaY: 3 })).toEqual({ type: "zoom", by: "out" });
    expect(wheelIntent({ ctrlKey: false, metaKey: false, deltaY: -3 })).toBeNull();
  });
});
