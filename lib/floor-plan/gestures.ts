import type { Side } from "@/lib/routing/drawing";
import type { EditorDocument, RackRun } from "./document";
import type { Intent, PaintShape, Selection } from "./editor-state";
import { nextId, rectCells } from "./commands";
import { rackRunCells } from "./bin-codes";
import { paintsWith, toolRow, type Tool } from "./tools";

/**
 * The editor canvas's pointer gestures as pure steps: each pointer event takes the drag in progress and
 * gives the next one plus what to do about it, so the canvas only measures events and renders.
 */

export type Cell = { x: number; y: number };
export type DrawnRun = Pick<RackRun, "x" | "y" | "orientation" | "length">;

/** A drag in progress, from pointer down to pointer up. */
export type Drag =
  | { kind: "paint"; cells: Set<number> }
  | { kind: "rect"; from: Cell; to: Cell }
  | { kind: "one-way"; cells: Set<number> }
  | { kind: "rack"; from: Cell; to: Cell }
  | { kind: "move-run"; id: string; from: Cell; to: Cell }
  | { kind: "move-point"; point: "depot" | "dropoff"; id: string; from: Cell; to: Cell }
  | { kind: "pan"; clientX: number; clientY: number; left: number; top: number };

export interface GestureContext {
  doc: EditorDocument;
  /** The tool as chosen; a person who may not edit always gestures as with the select tool. */
  tool: Tool;
  canEdit: boolean;
  paintShape: PaintShape;
  oneWayDir: Side | null;
}

/** Where a pointer is: the cell under it (null off the grid), the grid cell nearest to it, and its screen point. */
export interface PointerAt {
  cell: Cell | null;
  clamped: Cell;
  clientX: number;
  clientY: number;
}

export interface PointerPress extends PointerAt {
  button: number;
  shiftKey: boolean;
}

export type Effect =
  | { type: "intent"; intent: Intent }
  /** Scroll the plan's box to these offsets (panning). */
  | { type: "scroll"; left: number; top: number }
  /** A rack run was drawn: the session asks for its numbering before adding it. */
  | { type: "rack-drawn"; run: DrawnRun };

export interface Step {
  drag: Drag | null;
  effects: Effect[];
}

/** The pointer at a screen point, with `origin` the screen point of the grid's top-left corner. */
export function pointerAt(
  clientX: number,
  clientY: number,
  origin: { left: number; top: number },
  cellPx: number,
  doc: Pick<EditorDocument, "width" | "height">,
): PointerAt {
  const x = Math.floor((clientX - origin.left) / cellPx);
  const y = Math.floor((clientY - origin.top) / cellPx);
  const cell = x >= 0 && y >= 0 && x < doc.width && y < doc.height ? { x, y } : null;
  return { cell, clamped: { x: clamp(x, 0, doc.width - 1), y: clamp(y, 0, doc.height - 1) }, clientX, clientY };
}

/**
 * A press: only the primary button starts anything (null: leave the event alone). `scroll` is where the
 * plan's box is scrolled now, for a pan. A press that starts no drag leaves `drag` as it was.
 */
export function pointerDown(
  ctx: GestureContext,
  drag: Drag | null,
  p: PointerPress,
  scroll: { left: number; top: number } | null,
): Step | null {
  if (p.button !== 0) return null;
  const { doc } = ctx;
  const c = p.cell;
  const tool = ctx.canEdit ? ctx.tool : "select";
  if (tool === "select" || !c) {
    const hit = c && hitTest(doc, c);
    if (hit && c) {
      const select = intent({ type: "select", selection: hit });
      if (!ctx.canEdit) return { drag, effects: [select] };
      const move: Drag =
        hit.kind === "run"
          ? { kind: "move-run", id: hit.id, from: c, to: c }
          : { kind: "move-point", point: hit.kind, id: hit.id, from: c, to: c };
      return { drag: move, effects: [select] };
    }
    const effects = tool === "select" ? [intent({ type: "select", selection: null })] : [];
    return {
      drag: scroll ? { kind: "pan", clientX: p.clientX, clientY: p.clientY, left: scroll.left, top: scroll.top } : drag,
      effects,
    };
  }
  if (paintsWith(tool) !== undefined) {
    const rect = (ctx.paintShape === "rect") !== p.shiftKey;
    return {
      drag: rect ? { kind: "rect", from: c, to: c } : { kind: "paint", cells: new Set([index(doc, c)]) },
      effects: [],
    };
  }
  if (tool === "one-way")
    return { drag: { kind: "one-way", cells: new Set(isWalkable(doc, c) ? [index(doc, c)] : []) }, effects: [] };
  if (tool === "rack") return { drag: { kind: "rack", from: c, to: c }, effects: [] };
  const kind = toolRow(tool).places;
  return { drag, effects: kind ? placePoint(doc, kind, c) : [] };
}

/** Clicking a depot or drop-off tool on the grid: select the point there, or place a new one on walkable floor. */
function placePoint(doc: EditorDocument, kind: "depot" | "dropoff", c: Cell): Effect[] {
  const there = (kind === "depot" ? doc.depots : doc.dropoffs).find((p) => p.x === c.x && p.y === c.y);
  if (there) return [intent({ type: "select", selection: { kind, id: there.id } })];
  if (!isWalkable(doc, c)) return [];
  const id = nextId(doc, kind);
  const name = `${kind === "depot" ? "Depot" : "Drop-off"} ${id.slice(1)}`;
  return [
    intent({ type: "do", command: { type: "add-point", kind, point: { id, x: c.x, y: c.y, name } } }),
    intent({ type: "select", selection: { kind, id } }),
  ];
}

/** A move: strokes gather the cells passed over (off the grid adds nothing); rectangles and moves follow the nearest cell. */
export function pointerMove(ctx: GestureContext, drag: Drag | null, p: PointerAt): Step {
  if (!drag) return { drag, effects: [] };
  if (drag.kind === "pan")
    return {
      drag,
      effects: [
        { type: "scroll", left: drag.left - (p.clientX - drag.clientX), top: drag.top - (p.clientY - drag.clientY) },
      ],
    };
  const c = p.cell;
  if (drag.kind === "paint")
    return { drag: c ? { ...drag, cells: new Set(drag.cells).add(index(ctx.doc, c)) } : drag, effects: [] };
  if (drag.kind === "one-way")
    return {
      drag: c && isWalkable(ctx.doc, c) ? { ...drag, cells: new Set(drag.cells).add(index(ctx.doc, c)) } : drag,
      effects: [],
    };
  return { drag: { ...drag, to: p.clamped }, effects: [] };
}

/**
 * A release ends the drag and turns it into an edit. Paint strokes paint with the tool chosen at the
 * release, and with none if the person has switched to a tool that does not paint meanwhile.
 */
export function pointerUp(ctx: GestureContext, drag: Drag | null): Step {
  const done: Step = { drag: null, effects: [] };
  if (!drag) return done;
  const ground = paintsWith(ctx.tool);
  if (drag.kind === "paint" && ground)
    done.effects.push(intent({ type: "do", command: { type: "paint", cells: [...drag.cells], ground } }));
  else if (drag.kind === "rect" && ground)
    done.effects.push(
      intent({
        type: "do",
        command: { type: "paint-rect", x0: drag.from.x, y0: drag.from.y, x1: drag.to.x, y1: drag.to.y, ground },
      }),
    );
  else if (drag.kind === "one-way" && drag.cells.size > 0)
    done.effects.push(
      intent({ type: "do", command: { type: "set-one-way", cells: [...drag.cells], dir: ctx.oneWayDir } }),
    );
  else if (drag.kind === "rack") done.effects.push({ type: "rack-drawn", run: drawnRun(drag.from, drag.to) });
  else if (drag.kind === "move-run")
    done.effects.push(
      intent({
        type: "do",
        command: { type: "move-rack-run", id: drag.id, dx: drag.to.x - drag.from.x, dy: drag.to.y - drag.from.y },
      }),
    );
  else if (drag.kind === "move-point")
    done.effects.push(
      intent({
        type: "do",
        command: { type: "move-point", kind: drag.point, id: drag.id, x: drag.to.x, y: drag.to.y },
      }),
    );
  return done;
}

/** The browser took the pointer away (a touch turned into a scroll, a dialog): drop the drag, change nothing. */
export function pointerCancel(): Step {
  return { drag: null, effects: [] };
}

/** Ctrl/⌘ + wheel zooms; a plain wheel is left to scroll the plan. */
export function wheelIntent(w: { ctrlKey: boolean; metaKey: boolean; deltaY: number }): Intent | null {
  if (!(w.ctrlKey || w.metaKey)) return null;
  return { type: "zoom", by: w.deltaY < 0 ? "in" : "out" };
}

/** The depot, drop-off or rack run at a cell; points sit on top of runs. */
export function hitTest(doc: EditorDocument, c: Cell): NonNullable<Selection> | null {
  const d = doc.depots.find((p) => p.x === c.x && p.y === c.y);
  if (d) return { kind: "depot", id: d.id };
  const p = doc.dropoffs.find((q) => q.x === c.x && q.y === c.y);
  if (p) return { kind: "dropoff", id: p.id };
  // The run drawn last is on top, so it is the one picked.
  const run = [...doc.rackRuns].reverse().find((r) => covers(r, c));
  return run ? { kind: "run", id: run.id } : null;
}

/** Walkable floor that no rack run stands on: where points go and one-way marks are drawn. */
export function isWalkable(doc: EditorDocument, c: Cell): boolean {
  return doc.ground[index(doc, c)] === "f" && !doc.rackRuns.some((r) => covers(r, c));
}

/** A straight run from where the drag began, along whichever axis it moved further. */
export function drawnRun(from: Cell, to: Cell): DrawnRun {
  const h = Math.abs(to.x - from.x) >= Math.abs(to.y - from.y);
  return h
    ? { x: Math.min(from.x, to.x), y: from.y, orientation: "h", length: Math.abs(to.x - from.x) + 1 }
    : { x: from.x, y: Math.min(from.y, to.y), orientation: "v", length: Math.abs(to.y - from.y) + 1 };
}

/** The cells a drag would change if released now, and whether they are one-way marks rather than paint. */
export function previewCells(doc: EditorDocument, drag: Drag | null): { cells: number[]; oneWay: boolean } {
  if (!drag) return { cells: [], oneWay: false };
  if (drag.kind === "paint") return { cells: [...drag.cells], oneWay: false };
  if (drag.kind === "one-way") return { cells: [...drag.cells], oneWay: true };
  if (drag.kind === "rect")
    return { cells: rectCells(doc, drag.from.x, drag.from.y, drag.to.x, drag.to.y), oneWay: false };
  return { cells: [], oneWay: false };
}

function covers(run: RackRun, c: Cell): boolean {
  return rackRunCells(run).some((q) => q.x === c.x && q.y === c.y);
}

function index(doc: Pick<EditorDocument, "width">, c: Cell): number {
  return c.y * doc.width + c.x;
}

function intent(i: Intent): Effect {
  return { type: "intent", intent: i };
}

export function clamp(v: number, lo: number, hi: number): number {
  return Math.max(lo, Math.min(hi, v));
}
