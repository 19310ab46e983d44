import { UNREACHABLE } from "./constants";
import type { RouteMethod } from "./certificate";
import { isProved } from "./certificate";
import type { CostMatrix } from "./cost-matrix";
import { arcCost, assertNoOverflow } from "./cost-matrix";
import { degreeBound } from "./degree-bound";
import { UnreachableStopError } from "./errors";
import { HELD_KARP_MAX_STOPS, heldKarp } from "./held-karp";
import type { HeuristicOptions } from "./local-search";
import { localSearch } from "./local-search";

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

/** Orders the stops from start to end: exact up to the limit, local search above it. */
export function sequenceStops(cm: CostMatrix, req: SequenceRequest): SequenceResult {
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

  const limit = Math.min(req.exactLimit ?? EXACT_LIMIT, HELD_KARP_MAX_STOPS);
  const exact = stops.length <= limit;
  const r = exact
    ? heldKarp(cm, req.start, req.end, stops, req.onProgress)
    : localSearch(cm, req.start, req.end, stops, req.heuristic);
  if (r.length >= UNREACHABLE) {
    // Every stop is reachable on its own, yet no single walk covers them all (e.g. two one-way dead ends).
    throw new UnreachableStopError(stops, [], "no single walk from the start to the end visits all of them");
  }
  const lowerBound = exact ? r.length : Math.min(r.length, degreeBound(cm, req.start, req.end, stops));
  return {
    order: r.order,
    length: r.length,
    lowerBound,
    optimal: isProved({ lengthMm: r.length, lowerBoundMm: lowerBound }),
    method: exact ? "held-karp" : "local-search",
  };
}
