import { SIDES, SIDE_DX, SIDE_DY, type GridDrawing } from "@/lib/routing/drawing";
import { searchStart } from "@/lib/routing/reachability";

/**
 * Cell-grid searches behind the live checks. Walking with the one-way marks they use the routing
 * engine's own searches, so the editor and the engine's validator never disagree on what is reachable.
 */
export { reachableFrom, reachingTo } from "@/lib/routing/reachability";

/** Floor cells connected to `starts` when one-way marks are ignored. */
export function connectedTo(d: GridDrawing, starts: number[]): Uint8Array {
  const { seen, queue } = searchStart(d, starts);
  for (let head = 0; head < queue.length; head++) {
    for (const nc of floorNeighbours(d, queue[head] as number)) {
      if (!seen[nc]) {
        seen[nc] = 1;
        queue.push(nc);
      }
    }
  }
  return seen;
}

/** Splits the marked floor cells into groups that touch side by side (one-way marks ignored). */
export function groupsOf(d: GridDrawing, marked: (c: number) => boolean): number[][] {
  const n = d.width * d.height;
  const done = new Uint8Array(n);
  const groups: number[][] = [];
  for (let c0 = 0; c0 < n; c0++) {
    if (done[c0] || d.cells[c0] !== "floor" || !marked(c0)) continue;
    done[c0] = 1;
    const group = [c0];
    for (let head = 0; head < group.length; head++) {
      for (const nc of floorNeighbours(d, group[head] as number)) {
        if (!done[nc] && marked(nc)) {
          done[nc] = 1;
          group.push(nc);
        }
      }
    }
    groups.push(group.sort((a, b) => a - b));
  }
  return groups;
}

function floorNeighbours(d: GridDrawing, c: number): number[] {
  const x = c % d.width;
  const y = (c - x) / d.width;
  const out: number[] = [];
  for (const dir of SIDES) {
    const nx = x + SIDE_DX[dir];
    const ny = y + SIDE_DY[dir];
    if (nx < 0 || ny < 0 || nx >= d.width || ny >= d.height) continue;
    const nc = ny * d.width + nx;
    if (d.cells[nc] === "floor") out.push(nc);
  }
  return out;
}
