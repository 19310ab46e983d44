/** The floor-plan editor's drawing: a grid of cells, row-major (index = y * width + x). */

export type CellKind = "floor" | "rack" | "blocked";
/** Compass side; y grows towards S (row index increases southwards). */
export type Side = "N" | "E" | "S" | "W";

export interface CellRef {
  x: number;
  y: number;
}

export interface DrawingPoint extends CellRef {
  /** Stable identifier chosen by the editor, e.g. "D1". */
  id: string;
}

export interface DrawingBin {
  /** Location code, e.g. "A03-012-2"; unique within a drawing. */
  code: string;
  aisle: number;
  bay: number;
  level: number;
  /** The rack cell holding the bin. */
  x: number;
  y: number;
}

export interface GridDrawing {
  width: number;
  height: number;
  /** Side length of one square cell in millimetres. */
  cellMm: number;
  /** width * height entries, row-major. */
  cells: CellKind[];
  /**
   * Side a rack cell opens onto, per cell (row-major, same length as cells). Only read for
   * rack cells; the bins of a rack cell are picked from the floor cell on that side.
   */
  facing: (Side | null)[];
  /**
   * One-way mark per floor cell (row-major), or null. A mark "N" forbids moving south along the
   * N–S axis into or out of that cell; moves across the axis (E–W) stay allowed, so a one-way
   * aisle can still be entered at its junctions.
   */
  oneWay: (Side | null)[];
  depots: DrawingPoint[];
  dropoffs: DrawingPoint[];
  bins: DrawingBin[];
}

export const SIDES: readonly Side[] = ["N", "E", "S", "W"];

export const SIDE_DX: Record<Side, number> = { N: 0, E: 1, S: 0, W: -1 };
export const SIDE_DY: Record<Side, number> = { N: -1, E: 0, S: 1, W: 0 };

export function opposite(s: Side): Side {
  return s === "N" ? "S" : s === "S" ? "N" : s === "E" ? "W" : "E";
}

function sameAxis(a: Side, b: Side): boolean {
  return a === b || a === opposite(b);
}

export function cellIndex(d: Pick<GridDrawing, "width">, x: number, y: number): number {
  return y * d.width + x;
}

export function inGrid(d: Pick<GridDrawing, "width" | "height">, x: number, y: number): boolean {
  return x >= 0 && y >= 0 && x < d.width && y < d.height;
}

export function isFloor(d: GridDrawing, x: number, y: number): boolean {
  return inGrid(d, x, y) && d.cells[cellIndex(d, x, y)] === "floor";
}

function markAllows(mark: Side | null | undefined, dir: Side): boolean {
  return mark == null || !sameAxis(mark, dir) || mark === dir;
}

/** Whether a picker may step from floor cell (x, y) one cell towards `dir`. */
export function canStep(d: GridDrawing, x: number, y: number, dir: Side): boolean {
  const nx = x + SIDE_DX[dir];
  const ny = y + SIDE_DY[dir];
  if (!isFloor(d, x, y) || !isFloor(d, nx, ny)) return false;
  return markAllows(d.oneWay[cellIndex(d, x, y)], dir) && markAllows(d.oneWay[cellIndex(d, nx, ny)], dir);
}

/** Floor cell a bin is picked from, or null when its rack face opens onto no floor. */
export function binAccessCell(d: GridDrawing, bin: Pick<DrawingBin, "x" | "y">): CellRef | null {
  if (!inGrid(d, bin.x, bin.y) || d.cells[cellIndex(d, bin.x, bin.y)] !== "rack") return null;
  const side = d.facing[cellIndex(d, bin.x, bin.y)];
  if (side == null) return null;
  const x = bin.x + SIDE_DX[side];
  const y = bin.y + SIDE_DY[side];
  return isFloor(d, x, y) ? { x, y } : null;
}

/** An empty drawing of the given size: all floor, no marks, no points, no bins. */
export function emptyDrawing(width: number, height: number, cellMm: number): GridDrawing {
  const n = width * height;
  return {
    width,
    height,
    cellMm,
    cells: new Array<CellKind>(n).fill("floor"),
    facing: new Array<Side | null>(n).fill(null),
    oneWay: new Array<Side | null>(n).fill(null),
    depots: [],
    dropoffs: [],
    bins: [],
  };
}
