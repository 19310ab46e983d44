/**
 * Sentinel for "no path". 2^30 - 1 so that UNREACHABLE + UNREACHABLE still fits in an
 * Int32 (hot loops may add two entries before comparing without overflowing).
 */
export const UNREACHABLE = 0x3fffffff;

export function isReachable(d: number): boolean {
  return d < UNREACHABLE;
}

/** Adds distances; any unreachable part (or a sum that would reach the sentinel) gives UNREACHABLE. */
export function addDistances(a: number, b: number): number {
  if (a >= UNREACHABLE || b >= UNREACHABLE) return UNREACHABLE;
  const s = a + b;
  return s >= UNREACHABLE ? UNREACHABLE : s;
}
