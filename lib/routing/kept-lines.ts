import { binAccessCell, canStep, cellIndex, inGrid, isFloor, SIDE_DX, SIDE_DY } from "./drawing";
import type { GridDrawing, Side } from "./drawing";

/** Rows and columns of the drawing the compact graph keeps (1 = kept). */
export interface KeptLines {
  rows: Uint8Array;
  cols: Uint8Array;
}

export function allLines(d: GridDrawing): KeptLines {
  return { rows: new Uint8Array(d.height).fill(1), cols: new Uint8Array(d.width).fill(1) };
}

function sameCell(d: GridDrawing, a: number, b: number): boolean {
  return d.cells[a] === d.cells[b] && (d.cells[a] !== "floor" || (d.oneWay[a] ?? null) === (d.oneWay[b] ?? null));
}

function linked(d: GridDrawing, x: number, y: number, dir: Side): boolean {
  return (
    canStep(d, x, y, dir) ||
    canStep(d, x + SIDE_DX[dir], y + SIDE_DY[dir], dir === "N" ? "S" : dir === "S" ? "N" : dir === "E" ? "W" : "E")
  );
}

/** Marks each line kept that differs from a neighbouring line (or is the grid's edge). */
function changing(count: number, same: (i: number) => boolean): Uint8Array {
  const kept = new Uint8Array(count);
  for (let i = 0; i < count; i++) kept[i] = i === 0 || i === count - 1 || !same(i - 1) || !same(i) ? 1 : 0;
  return kept;
}

/**
 * The lines a shortest walk between the points that matter never needs to leave. A row (column) may
 * be dropped when it and both neighbours are identical cell for cell (kind and one-way mark) and no
 * point that matters needs it. Why that keeps distances exact: on a shortest walk, a straight stretch
 * along a dropped row has turns at both ends; as the rows around it are identical, the stretch slides
 * one row towards the turn it came from without getting longer (a U-turn gets shorter), until it lies
 * on a kept row, which bounds every band of dropped rows. Doing the same for columns leaves a walk
 * that turns only where a kept row meets a kept column. The ends of a walk cannot slide, so depots
 * and drop-offs keep both their lines, and an access cell keeps its row if it can be left or entered
 * sideways and its column if it can be left or entered lengthways.
 */
export function keptLines(d: GridDrawing): KeptLines {
  const w = d.width;
  const rowsSame = (y: number) => {
    for (let x = 0; x < w; x++) if (!sameCell(d, cellIndex(d, x, y), cellIndex(d, x, y + 1))) return false;
    return true;
  };
  const colsSame = (x: number) => {
    for (let y = 0; y < d.height; y++) if (!sameCell(d, cellIndex(d, x, y), cellIndex(d, x + 1, y))) return false;
    return true;
  };
  const rows = changing(d.height, rowsSame);
  const cols = changing(w, colsSame);
  for (const p of [...d.depots, ...d.dropoffs]) {
    if (!inGrid(d, p.x, p.y)) continue;
    rows[p.y] = 1;
    cols[p.x] = 1;
  }
  for (const b of d.bins) {
    const a = binAccessCell(d, b);
    if (!a || !isFloor(d, a.x, a.y)) continue;
    const sideways = linked(d, a.x, a.y, "E") || linked(d, a.x, a.y, "W");
    const lengthways = linked(d, a.x, a.y, "N") || linked(d, a.x, a.y, "S");
    if (sideways || !lengthways) rows[a.y] = 1;
    if (lengthways || !sideways) cols[a.x] = 1;
  }
  return { rows, cols };
}
