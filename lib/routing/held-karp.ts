import { UNREACHABLE } from "./constants";
import type { CostMatrix } from "./cost-matrix";
import { arcCost } from "./cost-matrix";

/** Above this many stops the DP table alone passes 1.5 GB; callers must not go further. */
export const HELD_KARP_MAX_STOPS = 24;

/** Bytes the DP table takes for m stops (one Int32 per subset and last stop). */
export function heldKarpBytes(m: number): number {
  return 4 * m * 2 ** m;
}

export interface PathResult {
  /** Stops (matrix indices) in visiting order, start and end excluded. */
  order: number[];
  /** UNREACHABLE when no order visits every stop. */
  length: number;
}

/**
 * Held–Karp bitmask DP for the shortest walk start → every stop once → end on directed costs.
 * dp[mask * m + j] = shortest walk from start through exactly the stops in mask, ending at j.
 * Parents are not stored: the order is recovered by re-checking which predecessor attains each
 * value, which halves peak memory at O(m^2) extra work.
 */
export function heldKarp(
  cm: CostMatrix,
  start: number,
  end: number,
  stops: readonly number[],
  onProgress?: (fraction: number) => void,
): PathResult {
  const m = stops.length;
  if (m > HELD_KARP_MAX_STOPS) throw new RangeError(`Held–Karp is limited to ${HELD_KARP_MAX_STOPS} stops, got ${m}`);
  if (m === 0) return { order: [], length: start === end ? 0 : arcCost(cm, start, end) };

  const fromStart = new Int32Array(m);
  const toEnd = new Int32Array(m);
  // into[j * m + i] = cost i → j, so the inner loop over predecessors reads one row.
  const into = new Int32Array(m * m).fill(UNREACHABLE);
  for (let j = 0; j < m; j++) {
    const sj = stops[j] as number;
    fromStart[j] = arcCost(cm, start, sj);
    toEnd[j] = arcCost(cm, sj, end);
    for (let i = 0; i < m; i++) if (i !== j) into[j * m + i] = arcCost(cm, stops[i] as number, sj);
  }

  const full = (1 << m) - 1;
  // Zero-filled: entries dp[mask][j] with j outside mask are never written and stay 0; the inner
  // loop reads dp[prev][j] once per (mask, j), but pairs it with into[j][j] = UNREACHABLE.
  const dp = new Int32Array(m * (full + 1));
  const members = new Int32Array(m);
  for (let j = 0; j < m; j++) dp[(1 << j) * m + j] = fromStart[j] as number;
  const every = 1 << 16;
  for (let mask = 3; mask <= full; mask++) {
    if ((mask & (mask - 1)) === 0) continue;
    const row = mask * m;
    let p = 0;
    for (let b = mask; b !== 0; b &= b - 1) members[p++] = 31 - Math.clz32(b & -b);
    for (let a = 0; a < p; a++) {
      const j = members[a] as number;
      const base = row - (m << j);
      const col = j * m;
      let best = UNREACHABLE;
      for (let c = 0; c < p; c++) {
        const i = members[c] as number;
        // Both terms are at most UNREACHABLE (2^30 - 1), so s and s - best stay inside Int32;
        // the branch-free min is about twice as fast here as an if (unpredictable branch).
        const s = (dp[base + i] as number) + (into[col + i] as number);
        const diff = s - best;
        best += diff & (diff >> 31);
      }
      dp[row + j] = best;
    }
    if (onProgress && (mask & (every - 1)) === 0) onProgress(mask / full);
  }

  let length = UNREACHABLE;
  let last = -1;
  for (let j = 0; j < m; j++) {
    const s = (dp[full * m + j] as number) + (toEnd[j] as number);
    if (s < length) {
      length = s;
      last = j;
    }
  }
  if (last < 0) return { order: [], length: UNREACHABLE };

  const rev: number[] = [];
  let mask = full;
  let j = last;
  while (true) {
    rev.push(j);
    const prev = mask & ~(1 << j);
    if (prev === 0) break;
    const want = dp[mask * m + j] as number;
    let found = -1;
    for (let i = 0; i < m && found < 0; i++) {
      if ((prev & (1 << i)) !== 0 && (dp[prev * m + i] as number) + (into[j * m + i] as number) === want) found = i;
    }
    mask = prev;
    j = found;
  }
  onProgress?.(1);
  return { order: rev.reverse().map((k) => stops[k] as number), length };
}
