import type { TourLp } from "./model";

/**
 * A lower bound that does not trust the solver's optimality: for any row prices y (free on the
 * degree equalities, clamped to ≥ 0 on the ≥ cuts), every tour x in [0,1]^arcs satisfying the rows
 * has c·x = y·Ax + (c - yA)·x ≥ y·b + Σ min(0, c_a - (yA)_a). The sum runs over every arc a tour
 * may use, LP column or not, so whatever HiGHS returns the figure is valid; good duals only make
 * it tight. The reduced costs come back too, for pricing and for fixing arcs.
 */
export function dualBound(
  lp: TourLp,
  masks: readonly Uint8Array[],
  rowDual: ArrayLike<number>,
): { value: number; slack: number; reduced: Float64Array } {
  const { k, arcs } = lp;
  const reduced = Float64Array.from(lp.cost);
  let value = 0;
  let magnitude = 0;
  const yOut = new Float64Array(k);
  const yIn = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    yOut[i] = rowDual[i] as number;
    yIn[i] = rowDual[k + i] as number;
    value += (yOut[i] as number) + (yIn[i] as number);
    magnitude += Math.abs(yOut[i] as number) + Math.abs(yIn[i] as number);
  }
  arcs.forEach((arc, a) => {
    reduced[a] = (reduced[a] as number) - (yOut[arc.from] as number) - (yIn[arc.to] as number);
  });
  masks.forEach((mask, c) => {
    const y = rowDual[2 * k + c] as number;
    // A cut row may only be priced non-negatively.
    if (!(y > 0)) return;
    value += y;
    magnitude += y;
    arcs.forEach((arc, a) => {
      if (!mask[arc.from] && mask[arc.to]) reduced[a] = (reduced[a] as number) - y;
    });
  });
  for (const rc of reduced) {
    if (rc < 0) value += rc;
    magnitude += Math.abs(rc);
  }
  // Room for the rounding of these double sums: far above their error, far below one millimetre.
  const slack = 1e-9 * magnitude + 1e-6;
  return { value, slack, reduced };
}
