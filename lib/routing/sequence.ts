import { UNREACHABLE } from "./constants";
import type { RouteMethod } from "./certificate";
import { isProved } from "./certificate";
import type { CostMatrix } from "./cost-matrix";
import { arcCost, assertNoOverflow } from "./cost-matrix";
import { degreeBound } from "./degree-bound";
import { UnreachableStopError } from "./errors";
import { chainedLocalSearch } from "./chains";
import type { PathResult } from "./held-karp";
import { HELD_KARP_MAX_STOPS, heldKarp } from "./held-karp";
import type { HeuristicOptions } from "./local-search";
import { highsSolver } from "./lp/highs";
import { lpRoute } from "./lp/solve";
import type { StopSegment } from "./segments";

/**
 * Largest batch sequenced exactly by default. Chosen from docs/benchmarks.md: 20 stops take well
 * under a second and 40 MiB of DP table on the 2-core bench machine; 21 doubles both, 22 quadruples.
 */
export const EXACT_LIMIT = 20;

export interface SequenceRequest {
  start: number;
  end: number;
  /** Distinct matrix indices to visit (duplicates are collapsed, first occurrence kept). */
  stops: readonly number[];
  /** Override the exact limit (capped at HELD_KARP_MAX_STOPS), e.g. for checks on published instances. */
  exactLimit?: number;
  heuristic?: HeuristicOptions;
  onProgress?: (fraction: number) => void;
}

export interface SequenceResult {
  order: number[];
  length: number;
  /** Never above the shortest possible length; equal to length when the order is proved shortest. */
  lowerBound: number;
  /** true exactly when lowerBound reaches length. */
  optimal: boolean;
  method: RouteMethod;
}

function reachable(cm: CostMatrix, from: number, pts: readonly number[], reverse: boolean): Set<number> {
  const seen = new Set<number>([from]);
  const queue = [from];
  while (queue.length > 0) {
    const a = queue.pop() as number;
    for (const b of pts) {
      if (seen.has(b)) continue;
      if ((reverse ? arcCost(cm, b, a) : arcCost(cm, a, b)) < UNREACHABLE) {
        seen.add(b);
        queue.push(b);
      }
    }
  }
  return seen;
}

/** Stops no walk start → … → end can include, found before any search so the error can name them. */
function unreachableStops(cm: CostMatrix, start: number, end: number, stops: readonly number[]): number[] {
  const forward = reachable(cm, start, stops, false);
  const backward = reachable(cm, end, stops, true);
  return stops.filter((s) => !forward.has(s) || !backward.has(s));
}

/**
 * The checks every sequencing call makes before any search: points inside the matrix, every stop
 * reachable, the end reachable, sums that fit Int32. Returns the distinct stops in first-seen order.
 */
export function checkedStops(cm: CostMatrix, req: Pick<SequenceRequest, "start" | "end" | "stops">): number[] {
  const stops = [...new Set(req.stops)];
  for (const p of [req.start, req.end, ...stops]) {
    if (!Number.isInteger(p) || p < 0 || p >= cm.n)
      throw new RangeError(`point ${p} is outside the ${cm.n}-point matrix`);
  }
  const bad = unreachableStops(cm, req.start, req.end, stops);
  if (bad.length > 0) throw new UnreachableStopError(bad);
  if (stops.length === 0 && arcCost(cm, req.start, req.end) >= UNREACHABLE && req.start !== req.end) {
    throw new UnreachableStopError([req.end], [], "the end cannot be reached from the start");
  }
  assertNoOverflow(cm, [req.start, req.end, ...stops]);
  return stops;
}

/** A walk found by a method that proves it: its length is its own bound. */
export function provedResult(r: PathResult, method: RouteMethod): SequenceResult {
  if (r.length >= UNREACHABLE) throw noSingleWalk(r.order);
  return { order: r.order, length: r.length, lowerBound: r.length, optimal: true, method };
}

function noSingleWalk(stops: readonly number[]): UnreachableStopError {
  // Every stop is reachable on its own, yet no single walk covers them all (e.g. two one-way dead ends).
  return new UnreachableStopError([...stops], [], "no single walk from the start to the end visits all of them");
}

export interface CertifyOptions {
  heuristic?: HeuristicOptions;
  /** Stops sharing corridor edges: one-way runs are kept whole in the search and prune the LP's arcs. */
  segments?: readonly StopSegment[];
  /** Let the LP go on to integer rounds when its bound alone does not prove the order. */
  integer?: boolean;
  /** Wall-clock cap on those integer rounds; without it they run until proved or out of rounds. */
  integerTimeLimitMs?: number;
}

/**
 * Local search for an order, then the best bound at hand: the LP with subtour cuts when HiGHS is
 * loaded (which may also find a shorter order and prove it), the degree bound otherwise. Either
 * way the route leaves with a proof or a stated bound.
 */
export function certifiedSearch(
  cm: CostMatrix,
  start: number,
  end: number,
  stops: readonly number[],
  options: CertifyOptions = {},
): SequenceResult {
  const segments = options.segments ?? [];
  const found = chainedLocalSearch(cm, start, end, stops, segments, options.heuristic);
  if (found.length >= UNREACHABLE) throw noSingleWalk(stops);
  let best: SequenceResult = {
    order: found.order,
    length: found.length,
    lowerBound: Math.min(found.length, degreeBound(cm, start, end, stops)),
    optimal: false,
    method: "local-search",
  };
  if (highsSolver()) {
    const lp = lpRoute(
      cm,
      { start, end, stops, segments },
      {
        upperOrder: found.order,
        upperLength: found.length,
        integer: options.integer ?? true,
        integerTimeLimitMs: options.integerTimeLimitMs,
      },
    );
    if (lp.order && lp.length !== undefined && lp.length <= found.length) {
      const method: RouteMethod = lp.proved ? "lp-cuts" : "local-search";
      best = { order: lp.order, length: lp.length, lowerBound: lp.lowerBound, optimal: false, method };
    }
    best.lowerBound = Math.min(best.length, Math.max(best.lowerBound, lp.lowerBound));
  }
  best.optimal = isProved({ lengthMm: best.length, lowerBoundMm: best.lowerBound });
  return best;
}

/** Orders the stops from start to end: Held–Karp up to the limit, certified local search above it. */
export function sequenceStops(cm: CostMatrix, req: SequenceRequest): SequenceResult {
  const stops = checkedStops(cm, req);
  const limit = Math.min(req.exactLimit ?? EXACT_LIMIT, HELD_KARP_MAX_STOPS);
  if (stops.length <= limit) return provedResult(heldKarp(cm, req.start, req.end, stops, req.onProgress), "held-karp");
  return certifiedSearch(cm, req.start, req.end, stops, { heuristic: req.heuristic });
}
