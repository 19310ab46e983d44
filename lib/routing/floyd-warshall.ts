import { UNREACHABLE } from "./constants";
import type { CompactGraph } from "./graph";

export interface DistanceMatrix {
  /** Node count; matrices are n*n, row-major (from * n + to). */
  n: number;
  /** Shortest distance in mm, UNREACHABLE when there is no path. */
  dist: Int32Array;
  /** First node after `from` on a shortest path to `to`; -1 when unreachable; `to` when from == to. */
  next: Int32Array;
}

export type ProgressCallback = (fractionDone: number) => void;

/** Floyd–Warshall over the graph's nodes, with a next-hop matrix for path reconstruction. */
export function floydWarshall(graph: CompactGraph, onProgress?: ProgressCallback): DistanceMatrix {
  const n = graph.nodes.length;
  const dist = new Int32Array(n * n).fill(UNREACHABLE);
  const next = new Int32Array(n * n).fill(-1);
  for (let i = 0; i < n; i++) {
    dist[i * n + i] = 0;
    next[i * n + i] = i;
  }
  const arc = (a: number, b: number, w: number) => {
    if (w < (dist[a * n + b] as number)) {
      dist[a * n + b] = w;
      next[a * n + b] = b;
    }
  };
  let total = 0;
  for (const e of graph.edges) {
    total += e.lengthMm;
    arc(e.from, e.to, e.lengthMm);
    if (!e.oneWay) arc(e.to, e.from, e.lengthMm);
  }
  // A shortest path uses each edge at most once, so this bounds every finite distance.
  if (total >= UNREACHABLE)
    throw new RangeError(`total corridor length ${total} mm does not fit the Int32 distance range`);

  const step = Math.max(1, Math.floor(n / 100));
  for (let k = 0; k < n; k++) {
    const rowK = k * n;
    for (let i = 0; i < n; i++) {
      const rowI = i * n;
      const dik = dist[rowI + k] as number;
      if (dik >= UNREACHABLE) continue;
      const hop = next[rowI + k] as number;
      for (let j = 0; j < n; j++) {
        // dik and dist[k][j] are both below 2^30, so the sum cannot overflow.
        const s = dik + (dist[rowK + j] as number);
        if (s < (dist[rowI + j] as number)) {
          dist[rowI + j] = s;
          next[rowI + j] = hop;
        }
      }
    }
    if (onProgress && (k % step === step - 1 || k === n - 1)) onProgress((k + 1) / n);
  }
  return { n, dist, next };
}

export function nodeDistance(dm: DistanceMatrix, from: number, to: number): number {
  return dm.dist[from * dm.n + to] ?? UNREACHABLE;
}

/** Nodes of a shortest path from `from` to `to`, both included; null when unreachable. */
export function nodePath(dm: DistanceMatrix, from: number, to: number): number[] | null {
  if ((dm.next[from * dm.n + to] ?? -1) < 0) return null;
  const path = [from];
  let u = from;
  while (u !== to) {
    u = dm.next[u * dm.n + to] as number;
    path.push(u);
  }
  return path;
}
