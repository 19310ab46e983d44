"use client";

import { useId } from "react";
import type { EditorDocument } from "@/lib/floor-plan/document";
import {
  FloorDefs,
  GroundLayer,
  HighlightLayer,
  OneWayLayer,
  PointsLayer,
  RackLayer,
  RouteLayer,
  type RouteOverlay,
  BackgroundLayer,
} from "./FloorLayers";

type Props = {
  document: EditorDocument;
  /** A faint image under the drawing, e.g. the scanned plan it was traced from. */
  backgroundUrl?: string | null;
  highlightCells?: number[];
  route?: RouteOverlay;
  onCellHover?: (cell: { x: number; y: number; index: number } | null) => void;
  /** Said to screen readers, e.g. "Floor plan of Bramblegate, layout version 3". */
  label?: string;
  className?: string;
};

/** A read-only drawing of a floor plan that scales to its container's width. */
export function FloorPlanView({
  document: doc,
  backgroundUrl,
  highlightCells,
  route,
  onCellHover,
  label = "Floor plan",
  className,
}: Props) {
  const id = useId().replace(/:/g, "");
  const onMove = onCellHover
    ? (e: React.PointerEvent<SVGSVGElement>) => {
        const r = e.currentTarget.getBoundingClientRect();
        const x = Math.floor(((e.clientX - r.left) / r.width) * doc.width);
        const y = Math.floor(((e.clientY - r.top) / r.height) * doc.height);
        onCellHover(x >= 0 && y >= 0 && x < doc.width && y < doc.height ? { x, y, index: y * doc.width + x } : null);
      }
    : undefined;
  return (
    <svg
      viewBox={`0 0 ${doc.width} ${doc.height}`}
      className={className ?? "h-auto w-full rounded-md border border-rack-light bg-paper-raised"}
      role="img"
      aria-label={`${label}: ${doc.width} × ${doc.height} cells of ${doc.cellMm / 1000} m, ${doc.rackRuns.length} rack runs, ${doc.depots.length} depots, ${doc.dropoffs.length} drop-offs`}
      onPointerMove={onMove}
      onPointerLeave={onCellHover ? () => onCellHover(null) : undefined}
    >
      <FloorDefs id={id} />
      <GroundLayer doc={doc} id={id} showGrid={doc.width <= 120} />
      {backgroundUrl && <BackgroundLayer href={backgroundUrl} doc={doc} />}
      <RackLayer runs={doc.rackRuns} />
      <OneWayLayer doc={doc} />
      <PointsLayer doc={doc} />
      {highlightCells && highlightCells.length > 0 && (
        <HighlightLayer cells={highlightCells} width={doc.width} strong />
      )}
      {route && <RouteLayer route={route} width={doc.width} id={id} />}
    </svg>
  );
}
