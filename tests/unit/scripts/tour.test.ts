import path from "node:path";
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

// scripts/tour.ts as outside tools call it (README: npx tsx scripts/tour.ts FILE): one JSON line on
// stdout. Checked against the published burma14 optimum, 3323 (TSPLIB, Reinelt 1991).
const root = path.resolve(import.meta.dirname, "../../..");
const BURMA14 = path.join(root, "tests/fixtures/tsplib/burma14.tsp");
const OPTIMUM = 3323;

function tour(...args: string[]): Record<string, unknown> {
  const r = spawnSync(path.join(root, "node_modules/.bin/tsx"), ["scripts/tour.ts", ...args], {
    cwd: root,
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(`tour.ts exited ${r.status}: ${r.stderr}`);
  const lines = r.stdout.trim().split("\n");
  expect(lines).toHaveLength(1);
  return JSON.parse(lines[0] as string) as Record<string, unknown>;
}

describe("scripts/tour.ts", () => {
  it("prints the tour's length, method and a lower bound that meets it when proved", () => {
    const out = tour(BURMA14);
    expect(Object.keys(out)).toEqual(["name", "n", "length", "optimal", "method", "lowerBound", "ms"]);
    expect(out).toMatchObject({ name: "burma14", n: 14, length: OPTIMUM, optimal: true, lowerBound: OPTIMUM });
    expect(out.method).toBe("held-karp");
  });

  it("with the exact solver held off, still prints a bound that never passes the published optimum", () => {
    const out = tour(BURMA14, "--exact-limit", "5");
    expect(out.method).not.toBe("held-karp");
    expect(out.length).toBeGreaterThanOrEqual(OPTIMUM);
    expect(out.lowerBound).toBeLessThanOrEqual(OPTIMUM);
    expect(out.optimal).toBe((out.lowerBound as number) >= (out.length as number));
  });
});
