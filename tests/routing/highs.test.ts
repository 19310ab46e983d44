import loadHighs from "highs";
import { beforeAll, describe, expect, it } from "vitest";
import { heldKarp } from "../../lib/routing";
import { randomInstance } from "./helpers/instances";
import { mtzLp } from "./helpers/mtz";

type Highs = Awaited<ReturnType<typeof loadHighs>>;
let highs: Highs;
beforeAll(async () => {
  highs = await loadHighs();
});

// Outside check: HiGHS (npm "highs", the HiGHS MILP solver compiled to WebAssembly) solving an
// MTZ integer program must agree with the DP on the optimum.
describe("Held–Karp equals the HiGHS MILP optimum", () => {
  const cases: { m: number; seed: number; symmetric: boolean; closed: boolean }[] = [];
  for (let k = 0; k < 10; k++)
    cases.push({ m: 6 + (k % 5), seed: 500 + k, symmetric: k % 2 === 0, closed: k % 3 === 0 });
  it.each(cases)("$m stops, seed $seed, symmetric $symmetric, closed $closed", ({ m, seed, symmetric, closed }) => {
    const cm = randomInstance(m + 2, seed, symmetric);
    const start = 0;
    const end = closed ? 0 : 1;
    const stops = Array.from({ length: m }, (_, i) => i + 2);
    const sol = highs.solve(mtzLp(cm, start, end, stops), { output_flag: false, mip_rel_gap: 0 });
    expect(sol.Status).toBe("Optimal");
    expect(heldKarp(cm, start, end, stops).length).toBe(Math.round(sol.ObjectiveValue));
  });
});
