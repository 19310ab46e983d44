import { canStep, SIDES, SIDE_DX, SIDE_DY, type GridDrawing } from "@/lib/routing/drawing";

/**
 * Cell-grid searches behind the live checks. They walk the same step rule as the routing engine
 * (canStep), so what they call reachable is what the published graph will connect.
 */

/** Floor cells a walker can reach from `starts`, following one-way marks. */
export function reachableFrom(d: GridDrawing, starts: number[]): Uint8Array {
  const seen = new Uint8Array(d.width * d.height);
  const queue = seedQueue(d, starts, seen);
  for (let head = 0; head < queue.length; head++) {
    const c = queue[head] as number;
    const x = c % d.width;
    const y = (c - x) / d.width;
    for (const dir of SIDES) {
      const nc = c + SIDE_DY[dir] * d.width + SIDE_DX[dir];
      if (!seen[nc] && canStep(d, x, y, dir)) {
        seen[nc] = 1;
        queue.push(nc);
      }
    }
  }
  return seen;
}

/** Floor cells from which a walker can reach one of `targets`, following one-way marks. */
export function reachingTo(d: GridDrawing, targets: number[]): Uint8Array {
  const seen = new Uint8Array(d.width * d.height);
  const queue = seedQueue(d, targets, seen);
  for (let head = 0; head < queue.length; head++) {
    const c = queue[head] as number;
    const x = c % d.width;
    const y = (c - x) / d.width;
    for (const dir of SIDES) {
      // A predecessor stands one cell behind and steps towards `dir` into c.
      const px = x - SIDE_DX[dir];
      const py = y - SIDE_DY[dir];
      const pc = py * d.width + px;
      if (px >= 0 && py >= 0 && px < d.width && py < d.height && !seen[pc] && canStep(d, px, py, dir)) {
        seen[pc] = 1;
        queue.push(pc);
      }
    }
  }
  return seen;
}

/** Floor cells connected to `starts` when one-way marks are ignored. */
export function connectedTo(d: GridDrawing, starts: number[]): Uint8Array {
  const seen = new Uint8Array(d.width * d.height);
  const queue = seedQueue(d, starts, seen);
  for (let head = 0; head < queue.length; head++) {
    const c = queue[head] as number;
    for (const nc of floorNeighbours(d, c)) {
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

function seedQueue(d: GridDrawing, cells: number[], seen: Uint8Array): number[] {
  const queue: number[] = [];
  for (const c of cells) {
    if (d.cells[c] === "floor" && !seen[c]) {
      seen[c] = 1;
      queue.push(c);
    }
  }
  return queue;
}
