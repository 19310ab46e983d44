import { UNREACHABLE, arcCost, type CostMatrix } from "../../../lib/routing";

/**
 * The Held–Karp DP as it stood before packed rows: one full row of m entries per subset, plain
 * comparisons, no tricks. Kept only as an independent reference for the packed table.
 */
export function unpackedHeldKarpLength(cm: CostMatrix, start: number, end: number, stops: readonly number[]): number {
  const m = stops.length;
  if (m === 0) return start === end ? 0 : arcCost(cm, start, end);
  const full = (1 << m) - 1;
  const dp = new Int32Array(m * (full + 1)).fill(UNREACHABLE);
  const at = (k: number) => stops[k] as number;
  const arc = new Int32Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) arc[i * m + j] = arcCost(cm, at(i), at(j));
  for (let j = 0; j < m; j++) dp[(1 << j) * m + j] = arcCost(cm, start, at(j));
  for (let mask = 1; mask <= full; mask++) {
    for (let j = 0; j < m; j++) {
      if ((mask & (1 << j)) === 0 || mask === 1 << j) continue;
      const prev = mask & ~(1 << j);
      let best = UNREACHABLE;
      for (let i = 0; i < m; i++) {
        if ((prev & (1 << i)) === 0) continue;
        const a = dp[prev * m + i] as number;
        const c = arc[i * m + j] as number;
        if (a < UNREACHABLE && c < UNREACHABLE && a + c < best) best = a + c;
      }
      dp[mask * m + j] = best;
    }
  }
  let length = UNREACHABLE;
  for (let j = 0; j < m; j++) {
    const a = dp[full * m + j] as number;
    const c = arcCost(cm, at(j), end);
    if (a < UNREACHABLE && c < UNREACHABLE && a + c < length) length = a + c;
  }
  return length;
}
