/**
 * When a wave's batches are done with P pickers, and how many pickers it takes to make a cut-off.
 *
 * Batches go to pickers by longest processing time first (LPT, Graham 1969): sort the batches'
 * estimated seconds from longest to shortest and give each to the picker with the least work so far.
 * That is what a supervisor handing out carts tends to do, and its finish is within 4/3 − 1/(3P) of
 * the best possible split (Graham's bound), so "needs 4 pickers" is never far from the truth.
 * Pure: no clock, no database; the caller passes the start and the cut-off.
 */

export type Schedule = {
  /** Seconds from the start until the last picker is done (0 with no batches). */
  makespanSeconds: number;
  /** Each picker's total seconds, in picker order. */
  loads: number[];
  /** For each batch (input order), the picker (0-based) it goes to. */
  assignment: number[];
};

export function lptSchedule(batchSeconds: readonly number[], pickers: number): Schedule {
  if (!Number.isInteger(pickers) || pickers < 1) throw new RangeError("at least one picker");
  if (batchSeconds.some((s) => !(s >= 0))) throw new RangeError("batch times must not be negative");
  const loads = new Array<number>(pickers).fill(0);
  const assignment = new Array<number>(batchSeconds.length).fill(0);
  const order = batchSeconds.map((s, i) => [s, i] as const).sort((a, b) => b[0] - a[0] || a[1] - b[1]);
  for (const [s, i] of order) {
    let least = 0;
    for (let p = 1; p < pickers; p++) if (loads[p]! < loads[least]!) least = p;
    loads[least]! += s;
    assignment[i] = least;
  }
  return { makespanSeconds: Math.max(0, ...loads), loads, assignment };
}

export type PickersNeeded =
  | { kind: "met"; pickers: number; makespanSeconds: number }
  /** Even one batch per picker ends after the cut-off: the longest batch alone is too long. */
  | { kind: "cannot"; longestSeconds: number }
  | { kind: "nothing-to-pick" };

/**
 * The fewest pickers whose LPT finish is at most `availableSeconds` (cut-off minus start). Tries every
 * P from 1 up to one picker per batch, so an LPT result that is not monotone in P cannot mislead it.
 */
export function pickersNeeded(batchSeconds: readonly number[], availableSeconds: number): PickersNeeded {
  if (batchSeconds.length === 0) return { kind: "nothing-to-pick" };
  const longest = Math.max(...batchSeconds);
  if (longest > availableSeconds) return { kind: "cannot", longestSeconds: longest };
  for (let p = 1; p <= batchSeconds.length; p++) {
    const s = lptSchedule(batchSeconds, p);
    if (s.makespanSeconds <= availableSeconds) return { kind: "met", pickers: p, makespanSeconds: s.makespanSeconds };
  }
  // With one batch each the finish is the longest batch, which fits: unreachable.
  return { kind: "cannot", longestSeconds: longest };
}

export type ShiftFinish = {
  pickers: number;
  /** When the last batch is done, as epoch milliseconds. */
  finishMs: number;
  makespanSeconds: number;
  cutoffMs: number | null;
  /** Whether the finish is at or before the earliest cut-off (null without a cut-off). */
  meetsCutoff: boolean | null;
  needed: PickersNeeded | null;
};

/** The wave's finish for `pickers` on shift from `startMs`, and what its earliest cut-off needs. */
export function shiftFinish(
  batchSeconds: readonly number[],
  pickers: number,
  startMs: number,
  cutoffMs: number | null,
): ShiftFinish {
  const s = lptSchedule(batchSeconds, pickers);
  const finishMs = startMs + s.makespanSeconds * 1000;
  return {
    pickers,
    finishMs,
    makespanSeconds: s.makespanSeconds,
    cutoffMs,
    meetsCutoff: cutoffMs === null ? null : finishMs <= cutoffMs,
    needed: cutoffMs === null ? null : pickersNeeded(batchSeconds, (cutoffMs - startMs) / 1000),
  };
}
