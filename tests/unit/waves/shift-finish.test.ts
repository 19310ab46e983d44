import { describe, expect, it } from "vitest";
import { lptSchedule, pickersNeeded, shiftFinish } from "@/lib/batching/shift-finish";

describe("longest batch first onto the least-loaded picker (LPT)", () => {
  it("hands out batches as worked by hand", () => {
    // 30, 20, 20, 10 to two pickers: 30→A; 20→B; B (20) has less than A (30): 20→B = 40; 10→A = 40.
    const s = lptSchedule([10, 20, 30, 20], 2);
    expect(s.loads).toEqual([40, 40]);
    expect(s.makespanSeconds).toBe(40);
    expect(s.assignment).toEqual([0, 1, 0, 1]);
  });

  it("reaches Graham's bound on its classic worst case", () => {
    // 3, 3, 2, 2, 2 on two pickers: LPT gives 3+2+2 = 7 and 3+2 = 5; the best split is 3+3 | 2+2+2 = 6.
    // 7 / 6 = 4/3 − 1/(3·2).
    expect(lptSchedule([3, 3, 2, 2, 2], 2).makespanSeconds).toBe(7);
  });

  it("finishes at once with no batches and refuses no pickers", () => {
    expect(lptSchedule([], 3).makespanSeconds).toBe(0);
    expect(() => lptSchedule([1], 0)).toThrow(RangeError);
    expect(() => lptSchedule([-1], 1)).toThrow(RangeError);
  });
});

describe("pickers needed for the earliest cut-off", () => {
  it("finds the fewest pickers, worked by hand", () => {
    // Four 10-minute batches and 21 min 40 s left: one picker needs 40 min, two need 20 min.
    expect(pickersNeeded([600, 600, 600, 600], 1300)).toEqual({ kind: "met", pickers: 2, makespanSeconds: 1200 });
    expect(pickersNeeded([600, 600, 600, 600], 2400)).toEqual({ kind: "met", pickers: 1, makespanSeconds: 2400 });
    // Exactly one batch each, when only that fits.
    expect(pickersNeeded([600, 600, 600], 600)).toEqual({ kind: "met", pickers: 3, makespanSeconds: 600 });
  });

  it("says it cannot be met when the longest batch alone ends after the cut-off", () => {
    expect(pickersNeeded([2000, 100], 1500)).toEqual({ kind: "cannot", longestSeconds: 2000 });
    expect(pickersNeeded([100], -60)).toEqual({ kind: "cannot", longestSeconds: 100 });
    expect(pickersNeeded([], 100)).toEqual({ kind: "nothing-to-pick" });
  });

  it("gives the finish time from the start, and whether the cut-off is made", () => {
    const start = Date.parse("2026-12-03T08:00:00Z");
    const cutoff = Date.parse("2026-12-03T08:30:00Z");
    const f = shiftFinish([600, 600, 600, 600], 1, start, cutoff);
    expect(new Date(f.finishMs).toISOString()).toBe("2026-12-03T08:40:00.000Z");
    expect(f.meetsCutoff).toBe(false);
    expect(f.needed).toEqual({ kind: "met", pickers: 2, makespanSeconds: 1200 });
    const none = shiftFinish([600], 2, start, null);
    expect(none.meetsCutoff).toBeNull();
    expect(none.needed).toBeNull();
  });
});

// Brute force on tiny cases: every way to give n batches to P pickers, for the best possible finish.
function optimum(jobs: number[], p: number): number {
  let best = Infinity;
  const loads = new Array<number>(p).fill(0);
  const go = (i: number) => {
    if (i === jobs.length) return void (best = Math.min(best, Math.max(...loads)));
    for (let k = 0; k < p; k++) {
      loads[k]! += jobs[i]!;
      go(i + 1);
      loads[k]! -= jobs[i]!;
    }
  };
  go(0);
  return best;
}

function rng(seed: number) {
  return () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648;
  };
}

describe("LPT against brute force", () => {
  it("is never better than the optimum and never worse than 4/3 − 1/(3P) of it (Graham's bound)", () => {
    const r = rng(20261205);
    let atBound = 0;
    for (let t = 0; t < 400; t++) {
      const n = 1 + Math.floor(r() * 7);
      const p = 1 + Math.floor(r() * 3);
      const jobs = Array.from({ length: n }, () => 1 + Math.floor(r() * 9));
      const opt = optimum(jobs, p);
      const s = lptSchedule(jobs, p);
      expect(s.loads.reduce((a, b) => a + b, 0)).toBe(jobs.reduce((a, b) => a + b, 0));
      jobs.forEach((j, i) => expect(s.assignment[i]).toBeLessThan(p));
      expect(s.makespanSeconds).toBeGreaterThanOrEqual(opt);
      expect(s.makespanSeconds).toBeLessThanOrEqual((4 / 3 - 1 / (3 * p)) * opt + 1e-9);
      if (s.makespanSeconds > opt) atBound++;
    }
    // The cases are not all trivial: LPT misses the optimum in some of them.
    expect(atBound).toBeGreaterThan(0);
  });

  it("needs no more pickers than the optimum would, rounded up by the bound", () => {
    const r = rng(7);
    for (let t = 0; t < 200; t++) {
      const jobs = Array.from({ length: 1 + Math.floor(r() * 6) }, () => 1 + Math.floor(r() * 9));
      const available = 1 + Math.floor(r() * 20);
      const got = pickersNeeded(jobs, available);
      if (Math.max(...jobs) > available) {
        expect(got.kind).toBe("cannot");
        continue;
      }
      expect(got.kind).toBe("met");
      if (got.kind !== "met") continue;
      // Its schedule fits, and with one picker fewer the LPT schedule does not.
      expect(lptSchedule(jobs, got.pickers).makespanSeconds).toBeLessThanOrEqual(available);
      if (got.pickers > 1) expect(lptSchedule(jobs, got.pickers - 1).makespanSeconds).toBeGreaterThan(available);
      // No split at all fits with fewer pickers than the optimum needs.
      let fewestByBruteForce = 1;
      while (optimum(jobs, fewestByBruteForce) > available) fewestByBruteForce++;
      expect(got.pickers).toBeGreaterThanOrEqual(fewestByBruteForce);
    }
  });
});
