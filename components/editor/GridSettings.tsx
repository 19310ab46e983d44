"use client";

import { useState } from "react";
import { CELL_MM_MAX, CELL_MM_MIN, MAX_SIDE_CELLS, type EditorDocument } from "@/lib/floor-plan/document";
import type { Intent } from "@/lib/floor-plan/editor-state";
import { resizeProblem } from "@/lib/floor-plan/commands";

/** Grid size in cells and the real size of one cell. */
export function GridSettings({ doc, dispatch }: { doc: EditorDocument; dispatch: (i: Intent) => void }) {
  const [width, setWidth] = useState(doc.width);
  const [height, setHeight] = useState(doc.height);
  const [cellMm, setCellMm] = useState(doc.cellMm);
  const problem = width !== doc.width || height !== doc.height ? resizeProblem(doc, width, height) : null;
  const cellOk = Number.isInteger(cellMm) && cellMm >= CELL_MM_MIN && cellMm <= CELL_MM_MAX;
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        const commands = [
          ...(width !== doc.width || height !== doc.height ? [{ type: "resize" as const, width, height }] : []),
          ...(cellMm !== doc.cellMm ? [{ type: "set-cell-size" as const, cellMm }] : []),
        ];
        if (commands.length > 0) dispatch({ type: "do", command: { type: "batch", label: "change grid", commands } });
      }}
    >
      <div className="grid grid-cols-3 gap-2">
        <label>
          <span className="label">Width</span>
          <input
            className="field"
            type="number"
            min={4}
            max={MAX_SIDE_CELLS}
            value={width}
            onChange={(e) => setWidth(Math.trunc(Number(e.target.value)))}
          />
        </label>
        <label>
          <span className="label">Height</span>
          <input
            className="field"
            type="number"
            min={4}
            max={MAX_SIDE_CELLS}
            value={height}
            onChange={(e) => setHeight(Math.trunc(Number(e.target.value)))}
          />
        </label>
        <label>
          <span className="label">Cell (mm)</span>
          <input
            className="field"
            type="number"
            min={CELL_MM_MIN}
            max={CELL_MM_MAX}
            step={50}
            value={cellMm}
            onChange={(e) => setCellMm(Math.trunc(Number(e.target.value)))}
          />
        </label>
      </div>
      <p className="text-sm text-ink-soft">
        {width} × {height} cells = {((width * cellMm) / 1000).toLocaleString()} ×{" "}
        {((height * cellMm) / 1000).toLocaleString()} m. Growing or cropping happens at the right and bottom edges.
      </p>
      {problem && <p className="notice-error text-sm">{problem}</p>}
      {!cellOk && (
        <p className="notice-error text-sm">
          A cell is {CELL_MM_MIN} to {CELL_MM_MAX} mm.
        </p>
      )}
      <button
        type="submit"
        className="btn-quiet"
        disabled={!!problem || !cellOk || (width === doc.width && height === doc.height && cellMm === doc.cellMm)}
      >
        Apply grid size
      </button>
    </form>
  );
}
