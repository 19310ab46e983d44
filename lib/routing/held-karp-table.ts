import { UNREACHABLE } from "./constants";

/**
 * The packed Held–Karp table: the row of subset `mask` holds one entry per stop inside it, in
 * increasing stop order, so the table has m·2^(m-1) entries instead of m·2^m. A row starts at the
 * total popcount of every smaller mask; stop j sits at popcount(mask & ((1 << j) - 1)) in it.
 */
export interface PackedTable {
  m: number;
  dp: Int32Array;
  /** into[j * m + i] = cost i → j, so the inner loop over predecessors reads one row. */
  into: Int32Array;
  /** Two-level offset table (see rowOffset): 2^lowBits entries each instead of 2^m. */
  lowBits: number;
  hiBase: Int32Array;
  hiCount: Int32Array;
  loBase: Int32Array;
}

/** Entries in the packed table for m stops. */
export function packedEntries(m: number): number {
  return m === 0 ? 0 : m * 2 ** (m - 1);
}

/**
 * Offsets for the masks split as hi·2^L + lo: every mask below it sums to
 * 2^L·F(hi) + hi·L·2^(L-1) + lo·popcount(hi) + F(lo), with F(x) the popcount total below x.
 * Three small tables stay in cache, where a flat 2^m table (16 MiB at 22 stops) would not.
 */
export function packedTable(m: number, into: Int32Array, dp: Int32Array): PackedTable {
  const lowBits = Math.max(1, Math.ceil(m / 2));
  const size = 1 << lowBits;
  const hiSize = 1 << Math.max(0, m - lowBits);
  const prefix = (n: number) => {
    const f = new Int32Array(n);
    for (let x = 1; x < n; x++) f[x] = (f[x - 1] as number) + popcount(x - 1);
    return f;
  };
  const loBase = prefix(size);
  const hiF = prefix(hiSize);
  const hiBase = new Int32Array(hiSize);
  const hiCount = new Int32Array(hiSize);
  for (let h = 0; h < hiSize; h++) {
    hiBase[h] = size * (hiF[h] as number) + h * lowBits * (size >> 1);
    hiCount[h] = popcount(h);
  }
  return { m, dp, into, lowBits, hiBase, hiCount, loBase };
}

export function popcount(x: number): number {
  let v = x - ((x >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

export function rowOffset(t: PackedTable, mask: number): number {
  const hi = mask >>> t.lowBits;
  const lo = mask & ((1 << t.lowBits) - 1);
  return (t.hiBase[hi] as number) + (t.hiCount[hi] as number) * lo + (t.loBase[lo] as number);
}

/** Where dp[mask][j] sits; j must be in mask. */
export function entryIndex(t: PackedTable, mask: number, j: number): number {
  return rowOffset(t, mask) + popcount(mask & ((1 << j) - 1));
}

/**
 * Fills the row of `mask` (two or more stops) from the rows of its subsets one stop smaller.
 * `members` is scratch of length m.
 */
export function relaxMask(t: PackedTable, mask: number, members: Int32Array): void {
  const { dp, into, m } = t;
  let p = 0;
  for (let b = mask; b !== 0; b &= b - 1) members[p++] = 31 - Math.clz32(b & -b);
  const row = rowOffset(t, mask);
  for (let a = 0; a < p; a++) {
    const j = members[a] as number;
    const col = j * m;
    // The row of mask without j lacks j itself, so members after a sit one place earlier in it.
    const base = rowOffset(t, mask ^ (1 << j));
    let best = UNREACHABLE;
    for (let c = 0; c < a; c++) {
      // Both terms are at most UNREACHABLE (2^30 - 1), so s and s - best stay inside Int32;
      // the branch-free min is about twice as fast here as an if (unpredictable branch).
      const s = (dp[base + c] as number) + (into[col + (members[c] as number)] as number);
      const diff = s - best;
      best += diff & (diff >> 31);
    }
    for (let c = a + 1; c < p; c++) {
      const s = (dp[base + c - 1] as number) + (into[col + (members[c] as number)] as number);
      const diff = s - best;
      best += diff & (diff >> 31);
    }
    dp[row + a] = best;
  }
}

/** The next larger mask with the same popcount (Gosper's hack); m ≤ 24 keeps it inside Int32. */
export function nextCombination(x: number): number {
  const c = x & -x;
  const r = x + c;
  return (((r ^ x) >>> 2) / c) | r;
}
