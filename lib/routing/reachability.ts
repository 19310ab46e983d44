import { canStep, SIDES, SIDE_DX, SIDE_DY, type GridDrawing } from "./drawing";

/**
 * Reachability on the raw cell grid, with the step rule the graph builder uses (canStep), so what these
 * call reachable is what the published graph connects. The engine's checks (diagnostics.ts) and the
 * editor's live checks (lib/floor-plan/reachability.ts) both search with these.
 */

/** Floor cells a walker can reach from `starts`, following one-way marks. */
export function reachableFrom(d: GridDrawing, starts: number[]): Uint8Array {
  return search(d, starts, false);
}

/** Floor cells from which a walker can reach one of `targets`, following one-way marks. */
export function reachingTo(d: GridDrawing, targets: number[]): Uint8Array {
  return search(d, targets, true);
}

/** The start of a breadth-first search: the floor cells among `cells` marked seen and queued. */
export function searchStart(d: GridDrawing, cells: number[]): { seen: Uint8Array; queue: number[] } {
  const seen = new Uint8Array(d.width * d.height);
  const queue: number[] = [];
  for (const c of cells) {
    if (d.cells[c] === "floor" && !seen[c]) {
      seen[c] = 1;
      queue.push(c);
    }
  }
  return { seen, queue };
}

// One loop for both directions, without a callback per cell: the editor runs it on every edit of
// plans up to 400 × 400 cells.
function search(d: GridDrawing, seeds: number[], backwards: boolean): Uint8Array {
  const { seen, queue } = searchStart(d, seeds);
  const w = d.width;
  for (let head = 0; head < queue.length; head++) {
    const c = queue[head] as number;
    const x = c % w;
    const y = (c - x) / w;
    for (const dir of SIDES) {
      // Backwards, a predecessor stands one cell behind and steps towards `dir` into c; canStep
      // refuses a cell off the grid.
      const sx = backwards ? x - SIDE_DX[dir] : x;
      const sy = backwards ? y - SIDE_DY[dir] : y;
      const nc = backwards ? sy * w + sx : c + SIDE_DY[dir] * w + SIDE_DX[dir];
      if (!seen[nc] && canStep(d, sx, sy, dir)) {
        seen[nc] = 1;
        queue.push(nc);
      }
    }
  }
  return seen;
}
