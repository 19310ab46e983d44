import { UNREACHABLE } from "./constants";
import type { CostMatrix } from "./cost-matrix";
import { arcCost } from "./cost-matrix";
import { entryIndex, packedEntries, packedTable, relaxMask, type PackedTable } from "./held-karp-table";
import { splitFill } from "./held-karp-split";

/** Above this many stops the DP table alone passes 1.5 GB; callers must not go further. */
export const HELD_KARP_MAX_STOPS = 24;

/** Bytes the DP table takes for m stops (one Int32 per subset and stop inside it). */
export function heldKarpBytes(m: number): number {
  return 4 * packedEntries(m);
}

export interface PathResult {
  /** Stops (matrix indices) in visiting order, start and end excluded. */
  order: number[];
  /** UNREACHABLE when no order visits every stop. */
  length: number;
}

/**
 * Held–Karp bitmask DP for the shortest walk start → every stop once → end on directed costs.
 * dp[mask][j] = shortest walk from start through exactly the stops in mask, ending at j, in a
 * packed table (./held-karp-table). Parents are not stored: the order is recovered by re-checking
 * which predecessor attains each value, which halves peak memory at O(m^2) extra work. Large
 * tables are shared with a second thread when one has been started (./held-karp-split).
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

  const toEnd = new Int32Array(m);
  const into = new Int32Array(m * m).fill(UNREACHABLE);
  for (let j = 0; j < m; j++) {
    const sj = stops[j] as number;
    toEnd[j] = arcCost(cm, sj, end);
    for (let i = 0; i < m; i++) if (i !== j) into[j * m + i] = arcCost(cm, stops[i] as number, sj);
  }
  const fromStart = (j: number) => arcCost(cm, start, stops[j] as number);
  const t = splitFill(m, into, fromStart, onProgress) ?? fill(m, into, fromStart, onProgress);

  const full = (1 << m) - 1;
  let length = UNREACHABLE;
  let last = -1;
  for (let j = 0; j < m; j++) {
    const s = (t.dp[entryIndex(t, full, j)] as number) + (toEnd[j] as number);
    if (s < length) {
      length = s;
      last = j;
    }
  }
  if (last < 0) return { order: [], length: UNREACHABLE };
  onProgress?.(1);
  return { order: recoverOrder(t, full, last).map((k) => stops[k] as number), length };
}

/** One thread, masks in increasing order: every subset one smaller is a smaller mask. */
function fill(
  m: number,
  into: Int32Array,
  fromStart: (j: number) => number,
  onProgress?: (fraction: number) => void,
): PackedTable {
  const t = packedTable(m, into, new Int32Array(packedEntries(m)));
  for (let j = 0; j < m; j++) t.dp[entryIndex(t, 1 << j, j)] = fromStart(j);
  const full = (1 << m) - 1;
  const every = 1 << 16;
  for (let mask = 3; mask <= full; mask++) {
    if ((mask & (mask - 1)) !== 0) relaxMask(t, mask);
    if (onProgress && (mask & (every - 1)) === 0) onProgress(mask / full);
  }
  return t;
}

/** Walks back from (full, last), each step to a predecessor whose value plus the arc gives the entry. */
function recoverOrder(t: PackedTable, full: number, last: number): number[] {
  const { dp, into, m } = t;
  const rev: number[] = [];
  let mask = full;
  let j = last;
  while (true) {
    rev.push(j);
    const prev = mask & ~(1 << j);
    if (prev === 0) break;
    const want = dp[entryIndex(t, mask, j)] as number;
    let found = -1;
    for (let i = 0; i < m && found < 0; i++) {
      if ((prev & (1 << i)) !== 0 && (dp[entryIndex(t, prev, i)] as number) + (into[j * m + i] as number) === want)
        found = i;
    }
    mask = prev;
    j = found;
  }
  return rev.reverse();
}
