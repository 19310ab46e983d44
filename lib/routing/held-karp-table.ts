import { UNREACHABLE } from "./constants";

/**
 * The packed Held–Karp table: the row of subset `mask` holds one entry per stop inside it, in
 * increasing stop order, so the table has m·2^(m-1) entries instead of m·2^m. A row starts at the
 * total popcount of every smaller mask; stop j sits at popcount(mask & ((1 << j) - 1)) in it.
 */
export interface PackedTable {
  m: number;
  dp: Int32Array;
  /** into[j * m + i] = cost i → j. */
  into: Int32Array;
  /** Masks split as hi·2^lowBits + lo; the offset tables below have 2^lowBits or 2^(m - lowBits) entries, not 2^m. */
  lowBits: number;
  hiBase: Int32Array;
  hiCount: Int32Array;
  hiPrefix: Int32Array;
  loBase: Int32Array;
  loCount: Int32Array;
  /**
   * intoLo[loBase[lo] * m + j * popcount(lo) + c] = cost from the c-th stop of lo to j, and intoHi
   * likewise for the high half: for any subset, the arcs into j from its stops, in row order, are
   * one run in each, so the inner loop reads two arrays straight through and gathers nothing.
   */
  intoLo: Int32Array;
  intoHi: Int32Array;
}

/** Entries in the packed table for m stops. */
export function packedEntries(m: number): number {
  return m === 0 ? 0 : m * 2 ** (m - 1);
}

/**
 * Offsets for the masks split as hi·2^L + lo: every mask below it sums to
 * 2^L·F(hi) + hi·L·2^(L-1) + lo·popcount(hi) + F(lo), with F(x) the popcount total below x.
 * The small tables stay in cache, where a flat 2^m table (16 MiB at 22 stops) would not.
 */
export function packedTable(m: number, into: Int32Array, dp: Int32Array): PackedTable {
  const lowBits = Math.max(1, Math.ceil(m / 2));
  const size = 1 << lowBits;
  const hiSize = 1 << Math.max(0, m - lowBits);
  const counts = (n: number) => Int32Array.from({ length: n }, (_, x) => popcount(x));
  const prefix = (count: Int32Array) => {
    const f = new Int32Array(count.length + 1);
    for (let x = 0; x < count.length; x++) f[x + 1] = (f[x] as number) + (count[x] as number);
    return f;
  };
  const loCount = counts(size);
  const hiCount = counts(hiSize);
  const loBase = prefix(loCount);
  const hiPrefix = prefix(hiCount);
  const hiBase = new Int32Array(hiSize);
  for (let h = 0; h < hiSize; h++) hiBase[h] = size * (hiPrefix[h] as number) + h * lowBits * (size >> 1);
  const half = (n: number, count: Int32Array, base: Int32Array, first: number) => {
    const out = new Int32Array((base[n] as number) * m);
    for (let x = 0; x < n; x++) {
      let at = (base[x] as number) * m;
      for (let j = 0; j < m; j++)
        for (let b = x; b !== 0; b &= b - 1) out[at++] = into[j * m + first + 31 - Math.clz32(b & -b)] as number;
    }
    return out;
  };
  const intoLo = half(size, loCount, loBase, 0);
  const intoHi = half(hiSize, hiCount, hiPrefix, lowBits);
  return { m, dp, into, lowBits, hiBase, hiCount, hiPrefix, loBase, loCount, intoLo, intoHi };
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

/** Fills the row of `mask` (two or more stops) from the rows of its subsets one stop smaller. */
export function relaxMask(t: PackedTable, mask: number): void {
  const { dp, m, lowBits, hiBase, hiCount, hiPrefix, loBase, loCount, intoLo, intoHi } = t;
  const hi = mask >>> lowBits;
  const lo = mask & ((1 << lowBits) - 1);
  let out = (hiBase[hi] as number) + (hiCount[hi] as number) * lo + (loBase[lo] as number);
  for (let b = mask; b !== 0; b &= b - 1) {
    const j = 31 - Math.clz32(b & -b);
    // The row of mask without j: its low-half stops come first, then its high-half stops.
    const prev = mask ^ (1 << j);
    const ph = prev >>> lowBits;
    const pl = prev & ((1 << lowBits) - 1);
    const nLo = loCount[pl] as number;
    const nHi = hiCount[ph] as number;
    const base = (hiBase[ph] as number) + nHi * pl + (loBase[pl] as number);
    const fromLo = (loBase[pl] as number) * m + j * nLo;
    const fromHi = (hiPrefix[ph] as number) * m + j * nHi;
    let best = UNREACHABLE;
    for (let c = 0; c < nLo; c++) {
      // Both terms are at most UNREACHABLE (2^30 - 1), so s and s - best stay inside Int32;
      // the branch-free min is about twice as fast here as an if (unpredictable branch).
      const s = (dp[base + c] as number) + (intoLo[fromLo + c] as number);
      const diff = s - best;
      best += diff & (diff >> 31);
    }
    const baseHi = base + nLo;
    for (let c = 0; c < nHi; c++) {
      const s = (dp[baseHi + c] as number) + (intoHi[fromHi + c] as number);
      const diff = s - best;
      best += diff & (diff >> 31);
    }
    dp[out++] = best;
  }
}

/** The next larger mask with the same popcount (Gosper's hack); m ≤ 24 keeps it inside Int32. */
export function nextCombination(x: number): number {
  const c = x & -x;
  const r = x + c;
  return (((r ^ x) >>> 2) / c) | r;
}
