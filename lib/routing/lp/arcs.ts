import type { StopSegment } from "../segments";

/**
 * Arcs the LP may leave out, on the local numbering 0 = start/end merged, 1..m = stops[0..m-1].
 * Returns allowed[i * (m + 1) + j] = 1 when arc i → j is kept.
 *
 * Why no optimal walk is lost. Take any shortest walk W from start to end that passes every stop
 * (a stop is "passed" when W stands on its access point), and let σ be the stops in the order W
 * first passes them. Each leg of σ is at most the part of W between the two first passages, so
 * σ is no longer than W: some optimal order picks each stop the first time its walk passes it.
 * Before reading σ off, W is tidied edge by edge; every step keeps W a start → end walk past all
 * stops, never lengthens it, and changes W only inside one edge (start and end are never inside
 * a segment's edge, see buildSegments, so every stay inside an edge enters and leaves through its
 * ends u = from, v = to):
 *  - one-way edge: W can only move forwards inside it, so every stay enters at u, leaves at v and
 *    passes the edge's stops in offset order. The first such stay passes them all, in a row: in σ
 *    stop i + 1 comes straight after stop i. Inner and outer ends of the chain are fixed: into
 *    stop i > 1 only from stop i - 1, out of stop i < q only to stop i + 1.
 *  - two-way edge: replace each stay by the straight one covering the same stretch (u → deepest
 *    point → u, or straight u → v); no longer, same stops passed. If some stay runs end to end, it
 *    passes every stop, so every stay that turns back can be cut out (it is a closed walk from an
 *    end to itself). Otherwise, of two stays turning back at u, the first is stretched to the
 *    deeper depth (+2·(deeper - its depth)) and the second cut out (-2·deeper). What is left: end
 *    to end stays only, or at most one stay turning at u and one at v. The stops a stay passes for
 *    the first time then form a run starting at s_1 (from u) or at s_q (from v), passed one
 *    after another: an inner stop s_i (1 < i < q) is first passed straight after s_(i-1) or
 *    s_(i+1). So into an inner stop only from its neighbours; arcs out of it are left alone (the
 *    stay turning at u may leave from any depth).
 * The steps on different edges never touch each other, so one σ obeys every segment's rule.
 */
export function allowedArcs(stops: readonly number[], segments: readonly StopSegment[] = []): Uint8Array {
  const m = stops.length;
  const k = m + 1;
  const allowed = new Uint8Array(k * k).fill(1);
  for (let i = 0; i < k; i++) allowed[i * k + i] = 0;
  const local = new Map(stops.map((s, i) => [s, i + 1]));
  const onlyFrom = (j: number, from: readonly number[]) => {
    for (let i = 0; i < k; i++) if (!from.includes(i)) allowed[i * k + j] = 0;
  };
  const onlyTo = (i: number, to: number) => {
    for (let j = 0; j < k; j++) if (j !== to) allowed[i * k + j] = 0;
  };
  for (const seg of segments) {
    // Stops of the edge outside this request are simply not stops here; the argument holds for the rest.
    const run = seg.stops.map((s) => local.get(s)).filter((v): v is number => v !== undefined);
    const q = run.length;
    if (q < 2) continue;
    for (let t = 0; t < q; t++) {
      const s = run[t] as number;
      const prev = run[t - 1];
      const next = run[t + 1];
      if (seg.oneWay) {
        if (prev !== undefined) onlyFrom(s, [prev]);
        if (next !== undefined) onlyTo(s, next);
      } else if (prev !== undefined && next !== undefined) {
        onlyFrom(s, [prev, next]);
      }
    }
  }
  return allowed;
}

/** One-way runs of consecutive stops: each is walked as a whole, first to last, in every kept order. */
export function oneWayChains(stops: readonly number[], segments: readonly StopSegment[] = []): number[][] {
  const present = new Set(stops);
  return segments
    .filter((s) => s.oneWay)
    .map((s) => s.stops.filter((x) => present.has(x)))
    .filter((run) => run.length >= 2);
}
