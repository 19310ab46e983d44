"use client";

import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState } from "react";
import { GROUND, type EditorDocument, type GroundChar, type RackRun } from "@/lib/floor-plan/document";
import type { EditorState, Intent } from "@/lib/floor-plan/editor-state";
import { documentBins, type RunBin } from "@/lib/floor-plan/bin-codes";
import {
  clamp,
  drawnRun,
  pointerAt,
  pointerCancel,
  pointerDown,
  pointerMove,
  pointerUp,
  previewCells,
  wheelIntent,
  type Cell,
  type Drag,
  type DrawnRun,
  type GestureContext,
  type Step,
} from "@/lib/floor-plan/gestures";
import { paintsWith } from "@/lib/floor-plan/tools";
import {
  FloorDefs,
  GroundLayer,
  HighlightLayer,
  OneWayLayer,
  PointsLayer,
  RackLayer,
  RackShape,
  BackgroundLayer,
} from "@/components/floor/FloorLayers";
import { FLOOR_COLOURS } from "@/components/floor/floor-style";
import { Rulers, RULER_PX } from "./Rulers";

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

const PAINT_FILL: Record<GroundChar, string> = {
  [GROUND.floor]: FLOOR_COLOURS.floor,
  [GROUND.blocked]: FLOOR_COLOURS.blocked,
  [GROUND.outside]: FLOOR_COLOURS.outside,
};

/** The drawing surface: paints, draws and moves on pointer drags, in cells of the document. */
export function EditorCanvas({
  state,
  dispatch,
  problemCells,
  focus,
  backgroundUrl,
  pendingRun,
  onRackDrawn,
  scrollRef,
}: Props) {
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
    box.scrollTo({
      left: RULER_PX + c.x * px - box.clientWidth / 2,
      top: RULER_PX + c.y * px - box.clientHeight / 2,
      behavior: "smooth",
    });
  }, [px, focus?.nonce, scrollRef]);

  // Ctrl/⌘ + wheel zooms; a plain wheel scrolls (pans) the plan as usual. Needs a non-passive listener.
  useEffect(() => {
    const box = scrollRef.current;
    if (!box) return;
    const onWheel = (e: WheelEvent) => {
      const zoom = wheelIntent(e);
      if (!zoom) return;
      e.preventDefault();
      dispatch(zoom);
    };
    box.addEventListener("wheel", onWheel, { passive: false });
    return () => box.removeEventListener("wheel", onWheel);
  }, [dispatch, scrollRef]);

  const gesture: GestureContext = {
    doc,
    tool: state.tool,
    canEdit: state.canEdit,
    paintShape: state.paintShape,
    oneWayDir: state.oneWayDir,
  };
  function at(e: React.PointerEvent) {
    const r = svgRef.current?.getBoundingClientRect();
    return pointerAt(e.clientX, e.clientY, { left: (r?.left ?? 0) + RULER_PX, top: (r?.top ?? 0) + RULER_PX }, px, doc);
  }
  function apply(step: Step) {
    setDrag(step.drag);
    for (const effect of step.effects) {
      if (effect.type === "intent") dispatch(effect.intent);
      else if (effect.type === "scroll") scrollRef.current?.scrollTo({ left: effect.left, top: effect.top });
      else onRackDrawn(effect.run);
    }
  }

  function onPointerDown(e: React.PointerEvent<SVGSVGElement>) {
    const box = scrollRef.current;
    const step = pointerDown(
      gesture,
      drag,
      { ...at(e), button: e.button, shiftKey: e.shiftKey },
      box ? { left: box.scrollLeft, top: box.scrollTop } : null,
    );
    if (!step) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    apply(step);
  }

  function onPointerMove(e: React.PointerEvent<SVGSVGElement>) {
    const p = at(e);
    setHover(p.cell);
    apply(pointerMove(gesture, drag, p));
  }

  const selectedRun =
    state.selection?.kind === "run" ? doc.rackRuns.find((r) => r.id === state.selection?.id) : undefined;
  const movingRun = drag?.kind === "move-run" ? doc.rackRuns.find((r) => r.id === drag.id) : undefined;
  const preview = previewCells(doc, drag);
  const hoverText = hover
    ? describeCell(doc, hover, binsByCell.get(hover.y * doc.width + hover.x))
    : "Point at a cell to see what it holds.";
  // Classes, not a style attribute: the pages' CSP allows no inline styles.
  const cursor =
    drag?.kind === "pan"
      ? "cursor-grabbing"
      : state.tool === "select" || !state.canEdit
        ? "cursor-default"
        : "cursor-crosshair";
  const paintFill = PAINT_FILL[paintsWith(state.tool) ?? GROUND.outside];

  return (
    <div className="space-y-1">
      <div
        ref={scrollRef}
        className="max-h-[70vh] min-h-64 overflow-auto rounded-md border-2 border-rack-light bg-paper-sunk"
      >
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
          onPointerUp={() => apply(pointerUp(gesture, drag))}
          onPointerCancel={() => apply(pointerCancel())}
          onPointerLeave={() => setHover(null)}
        >
          <FloorDefs id={id} />
          <GroundLayer doc={doc} id={id} showGrid={px >= 6} />
          {backgroundUrl && doc.background && <BackgroundLayer href={backgroundUrl} doc={doc} />}
          {preview.cells.length > 0 && (
            <g pointerEvents="none" opacity={0.75}>
              {preview.cells.map((c) => (
                <rect
                  key={c}
                  x={c % doc.width}
                  y={Math.floor(c / doc.width)}
                  width={1}
                  height={1}
                  fill={preview.oneWay ? "rgba(154, 77, 0, 0.35)" : paintFill}
                  stroke={FLOOR_COLOURS.selected}
                  strokeWidth={0.05}
                />
              ))}
            </g>
          )}
          <RackLayer
            runs={doc.rackRuns}
            selectedId={selectedRun?.id}
            hiddenId={
              movingRun && drag?.kind === "move-run" && (drag.to.x !== drag.from.x || drag.to.y !== drag.from.y)
                ? movingRun.id
                : null
            }
          />
          {movingRun && drag?.kind === "move-run" && (
            <RackShape
              run={{
                ...movingRun,
                x: clamp(movingRun.x + drag.to.x - drag.from.x, 0, doc.width - 1),
                y: clamp(movingRun.y + drag.to.y - drag.from.y, 0, doc.height - 1),
              }}
              selected
              ghost
            />
          )}
          {drag?.kind === "rack" && (
            <RackShape
              run={{
                ...(pendingRun ?? ghostRun()),
                ...drawnRun(drag.from, drag.to),
                facing: drawnRun(drag.from, drag.to).orientation === "h" ? "S" : "E",
              }}
              ghost
            />
          )}
          {pendingRun && !drag && <RackShape run={pendingRun} ghost selected />}
          <OneWayLayer doc={doc} />
          <PointsLayer doc={doc} selected={state.selection} />
          {drag?.kind === "move-point" && (
            <rect
              x={drag.to.x}
              y={drag.to.y}
              width={1}
              height={1}
              fill="none"
              stroke={FLOOR_COLOURS.selected}
              strokeWidth={0.14}
              strokeDasharray="0.2 0.12"
            />
          )}
          <HighlightLayer cells={problemCells} width={doc.width} />
          {focus && <HighlightLayer cells={focus.cells} width={doc.width} strong />}
          {hover && (
            <rect
              x={hover.x}
              y={hover.y}
              width={1}
              height={1}
              fill="none"
              stroke={FLOOR_COLOURS.face}
              strokeWidth={0.06}
              pointerEvents="none"
            />
          )}
          <Rulers doc={doc} cellPx={px} />
        </svg>
      </div>
      <p className="min-h-tap text-sm" aria-live="polite">
        {hoverText}
      </p>
    </div>
  );
}

function ghostRun(): RackRun {
  return {
    id: "new",
    x: 0,
    y: 0,
    orientation: "h",
    length: 1,
    facing: "S",
    aisle: 1,
    firstBay: 1,
    bayStep: 1,
    bayDirection: "forward",
    levels: 1,
    pattern: "{bay}-{level}",
    customCodes: [],
  };
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
  const point = [
    ...doc.depots.map((p) => ({ ...p, what: "depot" })),
    ...doc.dropoffs.map((p) => ({ ...p, what: "drop-off" })),
  ].find((p) => p.x === c.x && p.y === c.y);
  const kind = g === "f" ? "walkable floor" : g === "x" ? "blocked (wall, column or dock)" : "outside the building";
  return `${at} · ${kind}${mark ? `, one-way towards ${mark.dir}` : ""}${point ? ` · ${point.what} “${point.name}”` : ""}`;
}
