"use client";

import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState } from "react";
import type { EditorDocument, RackRun } from "@/lib/floor-plan/document";
import type { EditorState, Intent } from "@/lib/floor-plan/editor-state";
import { nextId, rectCells } from "@/lib/floor-plan/commands";
import { documentBins, rackRunCells, type RunBin } from "@/lib/floor-plan/bin-codes";
import { FloorDefs, GroundLayer, HighlightLayer, OneWayLayer, PointsLayer, RackLayer, RackShape } from "@/components/floor/FloorLayers";
import { FLOOR_COLOURS } from "@/components/floor/floor-style";
import { Rulers, RULER_PX } from "./Rulers";

export type DrawnRun = Pick<RackRun, "x" | "y" | "orientation" | "length">;
export type Focus = { cells: number[]; nonce: number };

type Props = {
  state: EditorState;
  dispatch: (i: Intent) => void;
  problemCells: number[];
  focus: Focus | null;
  backgroundUrl: string | null;
  pendingRun: RackRun | null;
  onRackDrawn: (run: DrawnRun) => void;
  scrollRef: React.RefObject<HTMLDivElement | null>;
};

type Cell = { x: number; y: number };
type Drag =
  | { kind: "paint"; cells: Set<number> }
  | { kind: "rect"; from: Cell; to: Cell }
  | { kind: "one-way"; cells: Set<number> }
  | { kind: "rack"; from: Cell; to: Cell }
  | { kind: "move-run"; id: string; from: Cell; to: Cell }
  | { kind: "move-point"; point: "depot" | "dropoff"; id: string; from: Cell; to: Cell }
  | { kind: "pan"; clientX: number; clientY: number; left: number; top: number };

const PAINT = { floor: "f", blocked: "x", erase: "." } as const;

/** The drawing surface: paints, draws and moves on pointer drags, in cells of the document. */
export function EditorCanvas({ state, dispatch, problemCells, focus, backgroundUrl, pendingRun, onRackDrawn, scrollRef }: Props) {
  const doc = state.history.present;
  const px = state.cellPx;
  const id = useId().replace(/:/g, "");
  const svgRef = useRef<SVGSVGElement>(null);
  const [drag, setDrag] = useState<Drag | null>(null);
  const [hover, setHover] = useState<Cell | null>(null);
  const centreAfterZoom = useRef<Cell | null>(null);

  const binsByCell = useMemo(() => {
    const m = new Map<number, RunBin[]>();
    for (const b of documentBins(doc)) {
      const k = b.y * doc.width + b.x;
      m.set(k, [...(m.get(k) ?? []), b]);
    }
    return m;
  }, [doc]);

  // Zooming to a problem: choose a scale that shows its cells, then centre them once the new size is laid out.
  useEffect(() => {
    const box = scrollRef.current;
    if (!focus || focus.cells.length === 0 || !box) return;
    const xs = focus.cells.map((c) => c % doc.width);
    const ys = focus.cells.map((c) => Math.floor(c / doc.width));
    const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
    const fit = Math.floor(Math.min(box.clientWidth / (x1 - x0 + 6), box.clientHeight / (y1 - y0 + 6)));
    centreAfterZoom.current = { x: (x0 + x1 + 1) / 2, y: (y0 + y1 + 1) / 2 };
    dispatch({ type: "set-zoom", cellPx: Math.min(32, Math.max(8, fit)) });
    // Only a new click on a problem moves the view, not edits while it is shown.
  }, [focus?.nonce]);

  useLayoutEffect(() => {
    const box = scrollRef.current;
    const c = centreAfterZoom.current;
    if (!box || !c) return;
    centreAfterZoom.current = null;
    box.scrollTo({ left: RULER_PX + c.x * px - box.clientWidth / 2, top: RULER_PX + c.y * px - box.clientHeight / 2, behavior: "smooth" });
  }, [px, focus?.nonce, scrollRef]);

  // Ctrl/⌘ + wheel zooms; a plain wheel scrolls (pans) the plan as usual. Needs a non-passive listener.
  useEffect(() => {
    const box = scrollRef.current;
    if (!box) return;
    const onWheel = (e: WheelEvent) => {
      if (!(e.ctrlKey || e.metaKey)) return;
      e.preventDefault();
      dispatch({ type: "zoom", by: e.deltaY < 0 ? "in" : "out" });
    };
    box.addEventListener("wheel", onWheel, { passive: false });
    return () => box.removeEventListener("wheel", onWheel);
  }, [dispatch, scrollRef]);

  function cellAt(e: React.PointerEvent): Cell | null {
    const r = svgRef.current?.getBoundingClientRect();
    if (!r) return null;
    const x = Math.floor((e.clientX - r.left - RULER_PX) / px);
    const y = Math.floor((e.clientY - r.top - RULER_PX) / px);
    return x >= 0 && y >= 0 && x < doc.width && y < doc.height ? { x, y } : null;
  }
  const clampCell = (e: React.PointerEvent): Cell => {
    const r = svgRef.current?.getBoundingClientRect();
    const x = Math.floor((e.clientX - (r?.left ?? 0) - RULER_PX) / px);
    const y = Math.floor((e.clientY - (r?.top ?? 0) - RULER_PX) / px);
    return { x: Math.max(0, Math.min(doc.width - 1, x)), y: Math.max(0, Math.min(doc.height - 1, y)) };
  };
  const idx = (c: Cell) => c.y * doc.width + c.x;
  const isWalkable = (c: Cell) => doc.ground[idx(c)] === "f" && !doc.rackRuns.some((r) => rackRunCells(r).some((q) => q.x === c.x && q.y === c.y));

  function onPointerDown(e: React.PointerEvent<SVGSVGElement>) {
    if (e.button !== 0) return;
    const c = cellAt(e);
    const tool = state.canEdit ? state.tool : "select";
    e.currentTarget.setPointerCapture(e.pointerId);
    if (tool === "select" || !c) {
      const hit = c && hitTest(doc, c);
      if (hit && c) {
        dispatch({ type: "select", selection: hit });
        if (state.canEdit) setDrag(hit.kind === "run" ? { kind: "move-run", id: hit.id, from: c, to: c } : { kind: "move-point", point: hit.kind, id: hit.id, from: c, to: c });
        return;
      }
      if (tool === "select") dispatch({ type: "select", selection: null });
      const box = scrollRef.current;
      if (box) setDrag({ kind: "pan", clientX: e.clientX, clientY: e.clientY, left: box.scrollLeft, top: box.scrollTop });
      return;
    }
    if (tool === "floor" || tool === "blocked" || tool === "erase") {
      const rect = (state.paintShape === "rect") !== e.shiftKey;
      setDrag(rect ? { kind: "rect", from: c, to: c } : { kind: "paint", cells: new Set([idx(c)]) });
    } else if (tool === "one-way") {
      setDrag({ kind: "one-way", cells: new Set(isWalkable(c) ? [idx(c)] : []) });
    } else if (tool === "rack") {
      setDrag({ kind: "rack", from: c, to: c });
    } else {
      const list = tool === "depot" ? doc.depots : doc.dropoffs;
      const there = list.find((p) => p.x === c.x && p.y === c.y);
      if (there) dispatch({ type: "select", selection: { kind: tool, id: there.id } });
      else if (isWalkable(c)) {
        const pid = nextId(doc, tool);
        const name = `${tool === "depot" ? "Depot" : "Drop-off"} ${pid.slice(1)}`;
        dispatch({ type: "do", command: { type: "add-point", kind: tool, point: { id: pid, x: c.x, y: c.y, name } } });
        dispatch({ type: "select", selection: { kind: tool, id: pid } });
      }
    }
  }

  function onPointerMove(e: React.PointerEvent<SVGSVGElement>) {
    const c = cellAt(e);
    setHover(c);
    if (!drag) return;
    if (drag.kind === "pan") {
      const box = scrollRef.current;
      if (box) box.scrollTo({ left: drag.left - (e.clientX - drag.clientX), top: drag.top - (e.clientY - drag.clientY) });
      return;
    }
    const to = clampCell(e);
    if (drag.kind === "paint" && c) setDrag({ ...drag, cells: new Set(drag.cells).add(idx(c)) });
    else if (drag.kind === "one-way" && c && isWalkable(c)) setDrag({ ...drag, cells: new Set(drag.cells).add(idx(c)) });
    else if (drag.kind === "rect" || drag.kind === "rack" || drag.kind === "move-run" || drag.kind === "move-point") setDrag({ ...drag, to });
  }

  function onPointerUp() {
    const d = drag;
    setDrag(null);
    if (!d) return;
    const tool = state.tool;
    if (d.kind === "paint" && (tool === "floor" || tool === "blocked" || tool === "erase")) dispatch({ type: "do", command: { type: "paint", cells: [...d.cells], ground: PAINT[tool] } });
    else if (d.kind === "rect" && (tool === "floor" || tool === "blocked" || tool === "erase")) dispatch({ type: "do", command: { type: "paint-rect", x0: d.from.x, y0: d.from.y, x1: d.to.x, y1: d.to.y, ground: PAINT[tool] } });
    else if (d.kind === "one-way" && d.cells.size > 0) dispatch({ type: "do", command: { type: "set-one-way", cells: [...d.cells], dir: state.oneWayDir } });
    else if (d.kind === "rack") onRackDrawn(drawnRun(d.from, d.to));
    else if (d.kind === "move-run") dispatch({ type: "do", command: { type: "move-rack-run", id: d.id, dx: d.to.x - d.from.x, dy: d.to.y - d.from.y } });
    else if (d.kind === "move-point") dispatch({ type: "do", command: { type: "move-point", kind: d.point, id: d.id, x: d.to.x, y: d.to.y } });
  }

  const selectedRun = state.selection?.kind === "run" ? doc.rackRuns.find((r) => r.id === state.selection?.id) : undefined;
  const movingRun = drag?.kind === "move-run" ? doc.rackRuns.find((r) => r.id === drag.id) : undefined;
  const preview = previewCells(doc, drag);
  const hoverText = hover ? describeCell(doc, hover, binsByCell.get(idx(hover))) : "Point at a cell to see what it holds.";
  // Classes, not a style attribute: the pages' CSP allows no inline styles.
  const cursor = drag?.kind === "pan" ? "cursor-grabbing" : state.tool === "select" || !state.canEdit ? "cursor-default" : "cursor-crosshair";
  const paintFill = state.tool === "floor" ? FLOOR_COLOURS.floor : state.tool === "blocked" ? FLOOR_COLOURS.blocked : FLOOR_COLOURS.outside;

  return (
    <div className="space-y-1">
      <div ref={scrollRef} className="max-h-[70vh] min-h-64 overflow-auto rounded-md border-2 border-rack-light bg-paper-sunk">
        <svg
          ref={svgRef}
          width={doc.width * px + RULER_PX}
          height={doc.height * px + RULER_PX}
          viewBox={`${-RULER_PX / px} ${-RULER_PX / px} ${doc.width + RULER_PX / px} ${doc.height + RULER_PX / px}`}
          className={`touch-none ${cursor}`}
          role="application"
          aria-label={`Floor plan drawing, ${doc.width} by ${doc.height} cells. Use the toolbar or keys; the checks and bins lists below say the same in words.`}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerCancel={() => setDrag(null)}
          onPointerLeave={() => setHover(null)}
        >
          <FloorDefs id={id} />
          <GroundLayer doc={doc} id={id} showGrid={px >= 6} />
          {backgroundUrl && doc.background && <image href={backgroundUrl} x={0} y={0} width={doc.width} height={doc.height} preserveAspectRatio="none" opacity={doc.background.opacity} pointerEvents="none" />}
          {preview.cells.length > 0 && (
            <g pointerEvents="none" opacity={0.75}>
              {preview.cells.map((c) => (
                <rect key={c} x={c % doc.width} y={Math.floor(c / doc.width)} width={1} height={1} fill={preview.oneWay ? "rgba(154, 77, 0, 0.35)" : paintFill} stroke={FLOOR_COLOURS.selected} strokeWidth={0.05} />
              ))}
            </g>
          )}
          <RackLayer runs={doc.rackRuns} selectedId={selectedRun?.id} hiddenId={movingRun && drag?.kind === "move-run" && (drag.to.x !== drag.from.x || drag.to.y !== drag.from.y) ? movingRun.id : null} />
          {movingRun && drag?.kind === "move-run" && <RackShape run={{ ...movingRun, x: clamp(movingRun.x + drag.to.x - drag.from.x, 0, doc.width - 1), y: clamp(movingRun.y + drag.to.y - drag.from.y, 0, doc.height - 1) }} selected ghost />}
          {drag?.kind === "rack" && <RackShape run={{ ...(pendingRun ?? ghostRun()), ...drawnRun(drag.from, drag.to), facing: drawnRun(drag.from, drag.to).orientation === "h" ? "S" : "E" }} ghost />}
          {pendingRun && !drag && <RackShape run={pendingRun} ghost selected />}
          <OneWayLayer doc={doc} />
          <PointsLayer doc={doc} selected={state.selection} />
          {drag?.kind === "move-point" && <rect x={drag.to.x} y={drag.to.y} width={1} height={1} fill="none" stroke={FLOOR_COLOURS.selected} strokeWidth={0.14} strokeDasharray="0.2 0.12" />}
          <HighlightLayer cells={problemCells} width={doc.width} />
          {focus && <HighlightLayer cells={focus.cells} width={doc.width} strong />}
          {hover && <rect x={hover.x} y={hover.y} width={1} height={1} fill="none" stroke={FLOOR_COLOURS.face} strokeWidth={0.06} pointerEvents="none" />}
          <Rulers doc={doc} cellPx={px} />
        </svg>
      </div>
      <p className="min-h-tap text-sm" aria-live="polite">
        {hoverText}
      </p>
    </div>
  );
}

function hitTest(doc: EditorDocument, c: Cell): NonNullable<EditorState["selection"]> | null {
  const d = doc.depots.find((p) => p.x === c.x && p.y === c.y);
  if (d) return { kind: "depot", id: d.id };
  const p = doc.dropoffs.find((q) => q.x === c.x && q.y === c.y);
  if (p) return { kind: "dropoff", id: p.id };
  // The run drawn last is on top, so it is the one picked.
  const run = [...doc.rackRuns].reverse().find((r) => rackRunCells(r).some((q) => q.x === c.x && q.y === c.y));
  return run ? { kind: "run", id: run.id } : null;
}

/** A straight run from where the drag began, along whichever axis it moved further. */
export function drawnRun(from: Cell, to: Cell): DrawnRun {
  const h = Math.abs(to.x - from.x) >= Math.abs(to.y - from.y);
  return h ? { x: Math.min(from.x, to.x), y: from.y, orientation: "h", length: Math.abs(to.x - from.x) + 1 } : { x: from.x, y: Math.min(from.y, to.y), orientation: "v", length: Math.abs(to.y - from.y) + 1 };
}

function ghostRun(): RackRun {
  return { id: "new", x: 0, y: 0, orientation: "h", length: 1, facing: "S", aisle: 1, firstBay: 1, bayStep: 1, bayDirection: "forward", levels: 1, pattern: "{bay}-{level}", customCodes: [] };
}

function previewCells(doc: EditorDocument, drag: Drag | null): { cells: number[]; oneWay: boolean } {
  if (!drag) return { cells: [], oneWay: false };
  if (drag.kind === "paint") return { cells: [...drag.cells], oneWay: false };
  if (drag.kind === "one-way") return { cells: [...drag.cells], oneWay: true };
  if (drag.kind === "rect") return { cells: rectCells(doc, drag.from.x, drag.from.y, drag.to.x, drag.to.y), oneWay: false };
  return { cells: [], oneWay: false };
}

function describeCell(doc: EditorDocument, c: Cell, bins: RunBin[] | undefined): string {
  const m = (v: number) => ((v * doc.cellMm) / 1000).toLocaleString(undefined, { maximumFractionDigits: 2 });
  const at = `${m(c.x)} m across, ${m(c.y)} m down`;
  if (bins && bins.length > 0) {
    const b = bins[0] as RunBin;
    return `${at} · rack run ${b.runId}, aisle ${b.aisle}, bay ${b.bay}: ${bins.map((x) => x.code).join(", ")}`;
  }
  const i = c.y * doc.width + c.x;
  const g = doc.ground[i];
  const mark = doc.oneWay.find((w) => w.cell === i);
  const point = [...doc.depots.map((p) => ({ ...p, what: "depot" })), ...doc.dropoffs.map((p) => ({ ...p, what: "drop-off" }))].find((p) => p.x === c.x && p.y === c.y);
  const kind = g === "f" ? "walkable floor" : g === "x" ? "blocked (wall, column or dock)" : "outside the building";
  return `${at} · ${kind}${mark ? `, one-way towards ${mark.dir}` : ""}${point ? ` · ${point.what} “${point.name}”` : ""}`;
}

function clamp(v: number, lo: number, hi: number): number {
  return Math.max(lo, Math.min(hi, v));
}
