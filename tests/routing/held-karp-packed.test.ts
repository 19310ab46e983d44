import os from "node:os";
import { afterAll, describe, expect, it } from "vitest";
import { heldKarp, heldKarpBytes, mulberry32, UNREACHABLE, walkLength, type CostMatrix } from "../../lib/routing";
import { heldKarpSplits, setSplitHelper } from "../../lib/routing/held-karp-split";
import { startHeldKarpHelper, stopHeldKarpHelper } from "../../lib/workers/held-karp-threads";
import { permutations, randomInstance } from "./helpers/instances";
import { unpackedHeldKarpLength } from "./helpers/unpacked-held-karp";

afterAll(() => stopHeldKarpHelper());

/** randomInstance with about `share` of the arcs between distinct points removed. */
function withMissingArcs(cm: CostMatrix, seed: number, share: number): CostMatrix {
  const rand = mulberry32(seed);
  const cost = cm.cost.slice();
  for (let i = 0; i < cm.n; i++)
    for (let j = 0; j < cm.n; j++) if (i !== j && rand() < share) cost[i * cm.n + j] = UNREACHABLE;
  return { n: cm.n, cost };
}

const stopsFrom = (first: number, m: number) => Array.from({ length: m }, (_, i) => first + i);

/** The returned order really is a visiting order of the stops, of the returned length. */
function expectConsistent(cm: CostMatrix, start: number, end: number, stops: number[]) {
  const r = heldKarp(cm, start, end, stops);
  if (r.length < UNREACHABLE) {
    expect(walkLength(cm, start, r.order, end)).toBe(r.length);
    expect([...r.order].sort((a, b) => a - b)).toEqual(stops);
  } else expect(r.order).toEqual([]);
  return r;
}

describe("packed Held–Karp table", () => {
  it("takes m·2^(m-1) Int32 entries: 176 MiB at 22 stops", () => {
    expect(heldKarpBytes(22) / 2 ** 20).toBe(176);
    expect(heldKarpBytes(1)).toBe(4);
  });

  // Source: exhaustive enumeration of every visiting order (tests/routing/helpers/instances.ts).
  it("equals brute force on small asymmetric instances with missing arcs, start = end and start ≠ end", () => {
    for (let seed = 1; seed <= 60; seed++) {
      const m = 1 + (seed % 7);
      const cm = withMissingArcs(randomInstance(m + 2, 300 + seed, false), seed, seed % 3 === 0 ? 0.5 : 0.2);
      for (const end of [0, 1]) {
        const stops = stopsFrom(2, m);
        let best = UNREACHABLE;
        for (const p of permutations(stops)) best = Math.min(best, walkLength(cm, 0, p, end));
        expect(expectConsistent(cm, 0, end, stops).length).toBe(best);
      }
    }
  });

  // Source: the unpacked DP kept in tests/routing/helpers/unpacked-held-karp.ts.
  it("equals the unpacked DP on random 10–16-stop asymmetric instances with missing arcs", () => {
    let unreachableSeen = 0;
    for (let seed = 1; seed <= 9; seed++) {
      const m = 10 + (seed % 7);
      const share = [0, 0.3, 0.7][seed % 3] as number;
      const cm = withMissingArcs(randomInstance(m + 2, 700 + seed, false), 50 + seed, share);
      for (const end of [0, 1]) {
        const stops = stopsFrom(2, m);
        const want = unpackedHeldKarpLength(cm, 0, end, stops);
        if (want >= UNREACHABLE) unreachableSeen++;
        expect(expectConsistent(cm, 0, end, stops).length).toBe(want);
      }
    }
    // The sparse instances must include some with no walk at all, or that branch went unchecked.
    expect(unreachableSeen).toBeGreaterThan(0);
  });
});

describe("Held–Karp split over two threads", () => {
  const cm = withMissingArcs(randomInstance(20, 1818, false), 18, 0.3);
  const stops = stopsFrom(2, 18);

  // Source: the one-thread fill (no helper registered).
  it("with a helper that never answers, the caller fills the helper's rows itself and writes it off", () => {
    const oneThread = heldKarp(cm, 0, 1, stops);
    let lost = false;
    setSplitHelper({ ready: () => !lost, post: () => {}, lost: () => (lost = true) });
    try {
      expect(heldKarpSplits(18)).toBe(true);
      expect(heldKarp(cm, 0, 1, stops)).toEqual(oneThread);
      expect(lost).toBe(true);
      expect(heldKarpSplits(18)).toBe(false);
    } finally {
      setSplitHelper(null);
    }
  });

  it.skipIf(os.availableParallelism() < 2)("on two threads equals the one-thread fill at 18 stops", async () => {
    const oneThread = heldKarp(cm, 0, 0, stops);
    expect(await startHeldKarpHelper()).toBe(true);
    expect(heldKarpSplits(18)).toBe(true);
    expect(heldKarp(cm, 0, 0, stops)).toEqual(oneThread);
    // Still ready afterwards: the helper met every barrier.
    expect(heldKarpSplits(18)).toBe(true);
  });
});
