import { memo } from "react";
import type { Side } from "@/lib/routing/drawing";
import type { EditorDocument, EditorPoint, RackRun } from "@/lib/floor-plan/document";
import { FLOOR_COLOURS as C } from "./floor-style";

/*
 * SVG layers of a floor plan, drawn in cell units (one cell = 1 × 1). Shared by the read-only view
 * and the editor canvas. Runs of equal ground in a row become one rect, so a 200 × 150 plan stays
 * a few thousand elements, not 30 000.
 */

export function FloorDefs({ id }: { id: string }) {
  return (
    <defs>
      {/* Blocked cells are hatched as well as dark, so they read without colour. */}
      <pattern id={`${id}-hatch`} width="0.5" height="0.5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="0.5" height="0.5" fill={C.blocked} />
        <line x1="0" y1="0" x2="0" y2="0.5" stroke="#6b7884" strokeWidth="0.12" />
      </pattern>
      <pattern id={`${id}-grid`} width="1" height="1" patternUnits="userSpaceOnUse">
        <path d="M 1 0 L 0 0 0 1" fill="none" stroke={C.grid} strokeWidth="0.04" />
      </pattern>
      <marker
        id={`${id}-arrow`}
        viewBox="0 0 10 10"
        refX="5"
        refY="5"
        markerWidth="4"
        markerHeight="4"
        orient="auto-start-reverse"
      >
        <path d="M 0 0 L 10 5 L 0 10 z" fill={C.route} />
      </marker>
    </defs>
  );
}

export const GroundLayer = memo(function GroundLayer({
  doc,
  id,
  showGrid,
}: {
  doc: EditorDocument;
  id: string;
  showGrid: boolean;
}) {
  const rects: React.ReactElement[] = [];
  for (let y = 0; y < doc.height; y++) {
    let x = 0;
    while (x < doc.width) {
      const g = doc.ground[y * doc.width + x];
      let end = x + 1;
      while (end < doc.width && doc.ground[y * doc.width + end] === g) end++;
      const fill = g === "f" ? C.floor : g === "x" ? `url(#${id}-hatch)` : C.outside;
      rects.push(<rect key={`${y}:${x}`} x={x} y={y} width={end - x} height={1.02} fill={fill} />);
      x = end;
    }
  }
  return (
    <g aria-hidden="true">
      {rects}
      {showGrid && <rect x={0} y={0} width={doc.width} height={doc.height} fill={`url(#${id}-grid)`} />}
    </g>
  );
});

const FACE_EDGE: Record<Side, (w: number, h: number) => [number, number, number, number]> = {
  N: (w) => [0, 0.06, w, 0.06],
  S: (w, h) => [0, h - 0.06, w, h - 0.06],
  W: (_w, h) => [0.06, 0, 0.06, h],
  E: (w, h) => [w - 0.06, 0, w - 0.06, h],
};

export function RackShape({ run, selected, ghost }: { run: RackRun; selected?: boolean; ghost?: boolean }) {
  const w = run.orientation === "h" ? run.length : 1;
  const h = run.orientation === "v" ? run.length : 1;
  const dividers: string[] = [];
  for (let i = 1; i < run.length; i++)
    dividers.push(run.orientation === "h" ? `M ${i} 0.15 V ${h - 0.15}` : `M 0.15 ${i} H ${w - 0.15}`);
  const [x1, y1, x2, y2] = FACE_EDGE[run.facing](w, h);
  return (
    <g transform={`translate(${run.x} ${run.y})`} opacity={ghost ? 0.55 : 1}>
      <rect
        x={0.04}
        y={0.04}
        width={w - 0.08}
        height={h - 0.08}
        fill={C.rack}
        stroke={selected ? C.selected : C.rackEdge}
        strokeWidth={selected ? 0.16 : 0.06}
        strokeDasharray={ghost ? "0.3 0.2" : undefined}
      />
      <path d={dividers.join(" ")} stroke={C.rackEdge} strokeWidth={0.04} />
      {/* The thick edge is the side bins are picked from. */}
      <line x1={x1} y1={y1} x2={x2} y2={y2} stroke={C.face} strokeWidth={0.14} />
    </g>
  );
}

export const RackLayer = memo(function RackLayer({
  runs,
  selectedId,
  hiddenId,
}: {
  runs: RackRun[];
  selectedId?: string | null;
  hiddenId?: string | null;
}) {
  return (
    <g>
      {runs.map((run) =>
        run.id === hiddenId ? null : <RackShape key={run.id} run={run} selected={run.id === selectedId} />,
      )}
    </g>
  );
});

const ARROW_ROTATION: Record<Side, number> = { N: 0, E: 90, S: 180, W: 270 };

export const OneWayLayer = memo(function OneWayLayer({ doc }: { doc: EditorDocument }) {
  return (
    <g aria-hidden="true">
      {doc.oneWay.map((m) => {
        const x = m.cell % doc.width;
        const y = (m.cell - x) / doc.width;
        return (
          <path
            key={m.cell}
            d="M 0 -0.36 L 0.3 0.04 L 0.1 0.04 L 0.1 0.34 L -0.1 0.34 L -0.1 0.04 L -0.3 0.04 Z"
            fill={C.oneWay}
            transform={`translate(${x + 0.5} ${y + 0.5}) rotate(${ARROW_ROTATION[m.dir]})`}
          />
        );
      })}
    </g>
  );
});

/** Depots are squares marked D, drop-offs diamonds marked P: told apart by shape and letter, not colour. */
export function PointMark({
  point,
  kind,
  selected,
}: {
  point: EditorPoint;
  kind: "depot" | "dropoff";
  selected?: boolean;
}) {
  const cx = point.x + 0.5;
  const cy = point.y + 0.5;
  return (
    <g>
      <title>{`${kind === "depot" ? "Depot" : "Drop-off"} ${point.name}`}</title>
      {kind === "depot" ? (
        <rect
          x={point.x + 0.08}
          y={point.y + 0.08}
          width={0.84}
          height={0.84}
          rx={0.08}
          fill={C.point}
          stroke={selected ? C.face : "none"}
          strokeWidth={0.12}
        />
      ) : (
        <path
          d={`M ${cx} ${cy - 0.5} L ${cx + 0.5} ${cy} L ${cx} ${cy + 0.5} L ${cx - 0.5} ${cy} Z`}
          fill={C.point}
          stroke={selected ? C.face : "none"}
          strokeWidth={0.12}
        />
      )}
      <text x={cx} y={cy + 0.22} textAnchor="middle" fontSize={0.62} fontWeight={700} fill={C.pointText}>
        {kind === "depot" ? "D" : "P"}
      </text>
    </g>
  );
}

export function PointsLayer({
  doc,
  selected,
}: {
  doc: EditorDocument;
  selected?: { kind: string; id: string } | null;
}) {
  return (
    <g>
      {doc.depots.map((p) => (
        <PointMark
          key={`d-${p.id}`}
          point={p}
          kind="depot"
          selected={selected?.kind === "depot" && selected.id === p.id}
        />
      ))}
      {doc.dropoffs.map((p) => (
        <PointMark
          key={`p-${p.id}`}
          point={p}
          kind="dropoff"
          selected={selected?.kind === "dropoff" && selected.id === p.id}
        />
      ))}
    </g>
  );
}

export function HighlightLayer({
  cells,
  width,
  strong,
}: {
  cells: readonly number[];
  width: number;
  strong?: boolean;
}) {
  return (
    <g pointerEvents="none">
      {cells.map((c) => {
        const x = c % width;
        return (
          <rect
            key={c}
            x={x + 0.05}
            y={(c - x) / width + 0.05}
            width={0.9}
            height={0.9}
            fill={C.highlightFill}
            stroke={C.highlight}
            strokeWidth={strong ? 0.14 : 0.07}
            strokeDasharray={strong ? undefined : "0.25 0.15"}
          />
        );
      })}
    </g>
  );
}

export interface RouteOverlay {
  /** Walked cell path, row-major indices. */
  cells: number[];
  stops: { x: number; y: number; label: string }[];
}

export function RouteLayer({ route, width, id }: { route: RouteOverlay; width: number; id: string }) {
  const pts = route.cells.map((c) => {
    const x = c % width;
    return `${x + 0.5},${(c - x) / width + 0.5}`;
  });
  // One arrow every few cells, so the direction shows without cluttering short legs.
  const arrows = pts.filter((_p, i) => i > 0 && i % 4 === 0);
  return (
    <g pointerEvents="none">
      <polyline
        points={pts.join(" ")}
        fill="none"
        stroke={C.route}
        strokeWidth={0.22}
        strokeLinejoin="round"
        strokeLinecap="round"
        opacity={0.85}
        markerEnd={`url(#${id}-arrow)`}
      />
      <polyline
        points={arrows.length > 1 ? arrows.join(" ") : ""}
        fill="none"
        stroke="none"
        strokeWidth={0.22}
        markerMid={`url(#${id}-arrow)`}
      />
      {route.stops.map((s, i) => (
        <g key={`${s.label}-${i}`}>
          <circle cx={s.x + 0.5} cy={s.y + 0.5} r={0.48} fill={C.floor} stroke={C.route} strokeWidth={0.12} />
          <text
            x={s.x + 0.5}
            y={s.y + 0.68}
            textAnchor="middle"
            fontSize={s.label.length > 2 ? 0.36 : 0.5}
            fontWeight={700}
            fill={C.face}
          >
            {s.label}
          </text>
        </g>
      ))}
    </g>
  );
}

/** The scanned plan under the grid, stretched to the floor's size. */
export function BackgroundLayer({ href, doc }: { href: string; doc: EditorDocument }) {
  return (
    <image
      href={href}
      x={0}
      y={0}
      width={doc.width}
      height={doc.height}
      preserveAspectRatio="none"
      opacity={doc.background?.opacity ?? 0.3}
      pointerEvents="none"
    />
  );
}
