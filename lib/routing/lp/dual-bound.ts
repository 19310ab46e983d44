import type { TourLp } from "./model";

/**
 * A lower bound that does not trust the solver's optimality: for any row prices y (free on the
 * degree equalities, clamped to ≥ 0 on the ≥ cuts), every tour x in [0,1]^n satisfying the rows has
 * c·x = y·Ax + (c - yA)·x ≥ y·b + Σ min(0, c_j - (yA)_j). So whatever HiGHS returns, the figure
 * is valid; good duals only make it tight. Reduced costs come back too, for fixing arcs.
 */
export function dualBound(
  lp: TourLp,
  rowDual: ArrayLike<number>,
): { value: number; slack: number; reduced: Float64Array } {
  const reduced = Float64Array.from(lp.cost);
  let value = 0;
  let magnitude = 0;
  lp.rowCols.forEach((cols, r) => {
    let y = rowDual[r] as number;
    // Only the degree rows are equalities; a cut row may only be priced non-negatively.
    const equality = lp.rowLower[r] === lp.rowUpper[r];
    if (!equality && y < 0) y = 0;
    if (y === 0 || !Number.isFinite(y)) return;
    value += y * (lp.rowLower[r] as number);
    magnitude += Math.abs(y);
    for (const c of cols) reduced[c] = (reduced[c] as number) - y;
  });
  for (const rc of reduced) {
    if (rc < 0) value += rc;
    magnitude += Math.abs(rc);
  }
  // Room for the rounding of these double sums: far above their error, far below one millimetre.
  const slack = 1e-9 * magnitude + 1e-6;
  return { value, slack, reduced };
}
