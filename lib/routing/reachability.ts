import { canStep, SIDES, SIDE_DX, SIDE_DY, type GridDrawing } from "./drawing";

/**
 * Reachability on the raw cell grid, with the step rule the graph builder uses (canStep), so what these
 * call reachable is what the published graph connects. The engine's checks (diagnostics.ts) and the
 * editor's live checks (lib/floor-plan/reachability.ts) both search with these.
 */

/** Calls `visit` with each cell one step on from cell c at (x, y). */
export type NextCells = (c: number, x: number, y: number, visit: (next: number) => void) => void;

/** Breadth-first search from the floor cells among `seeds`: 1 for each cell reached. `next` only offers floor cells. */
export function searchCells(d: GridDrawing, seeds: number[], next: NextCells): Uint8Array {
  const seen = new Uint8Array(d.width * d.height);
  const queue: number[] = [];
  const visit = (c: number) => {
    if (seen[c]) return;
    seen[c] = 1;
    queue.push(c);
  };
  for (const c of seeds) if (d.cells[c] === "floor") visit(c);
  for (let head = 0; head < queue.length; head++) {
    const c = queue[head] as number;
    const x = c % d.width;
    next(c, x, (c - x) / d.width, visit);
  }
  return seen;
}

/** Floor cells a walker can reach from `starts`, following one-way marks. */
export function reachableFrom(d: GridDrawing, starts: number[]): Uint8Array {
  return searchCells(d, starts, (c, x, y, visit) => {
    for (const dir of SIDES) if (canStep(d, x, y, dir)) visit(c + SIDE_DY[dir] * d.width + SIDE_DX[dir]);
  });
}

/** Floor cells from which a walker can reach one of `targets`, following one-way marks. */
export function reachingTo(d: GridDrawing, targets: number[]): Uint8Array {
  return searchCells(d, targets, (_c, x, y, visit) => {
    for (const dir of SIDES) {
      // A predecessor stands one cell behind and steps towards `dir` into c; canStep refuses one off the grid.
      const px = x - SIDE_DX[dir];
      const py = y - SIDE_DY[dir];
      if (canStep(d, px, py, dir)) visit(py * d.width + px);
    }
  });
}
