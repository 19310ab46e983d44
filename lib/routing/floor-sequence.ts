import { walkLength, type CostMatrix } from "./cost-matrix";
import { corridorSweep } from "./corridor-dp";
import type { AccessPoint, CompactGraph } from "./graph";
import { HELD_KARP_MAX_STOPS, heldKarp } from "./held-karp";
import { buildSegments } from "./segments";
import type { SequenceRequest, SequenceResult } from "./sequence";
import { certifiedSearch, checkedStops, EXACT_LIMIT, provedResult } from "./sequence";

/**
 * Up to this many stops Held–Karp goes first whatever the floor: its table is a few hundred KiB
 * and it answers in about a millisecond, less than the other methods take to set up.
 */
export const HELD_KARP_FIRST = 12;

/**
 * An integer round that has not closed the gap by then rarely does soon after; the route then
 * leaves with the LP's bound instead. Only reached on batches the corridor sweep cannot take.
 */
const INTEGER_TIME_LIMIT_MS = 2_000;

const hasOneWay = new WeakMap<CompactGraph, boolean>();

function oneWayFloor(graph: CompactGraph): boolean {
  let v = hasOneWay.get(graph);
  if (v === undefined) {
    v = graph.edges.some((e) => e.oneWay);
    hasOneWay.set(graph, v);
  }
  return v;
}

/**
 * Orders a batch's stops on its floor, each route leaving with a proof or a stated bound. Matrix
 * index i stands at points[i]. The method is the fastest one that proves the route:
 * - few stops: Held–Karp;
 * - two-way floors: the corridor sweep, whose cost grows with the cross-aisles, not the stops;
 *   where its front is too wide, Held–Karp up to the exact limit;
 * - one-way floors: local search with one-way runs kept whole, proved by the LP with subtour cuts
 *   (integer rounds when the bound falls short), Held–Karp up to the exact limit if that fails;
 * - anything left: local search with the best bound at hand.
 */
export function sequenceOnFloor(
  graph: CompactGraph,
  points: readonly AccessPoint[],
  cm: CostMatrix,
  req: SequenceRequest,
): SequenceResult {
  const stops = checkedStops(cm, req);
  const { start, end } = req;
  const limit = Math.min(req.exactLimit ?? EXACT_LIMIT, HELD_KARP_MAX_STOPS);
  const exact = () => provedResult(heldKarp(cm, start, end, stops, req.onProgress), "held-karp");
  if (stops.length <= Math.min(HELD_KARP_FIRST, limit)) return exact();

  const oneWay = oneWayFloor(graph);
  if (!oneWay) {
    const at = (i: number) => points[i] as AccessPoint;
    const swept = corridorSweep({ graph, start: at(start), end: at(end), stops: stops.map(at) });
    if ("order" in swept) {
      const order = swept.order.map((i) => stops[i] as number);
      return provedResult({ order, length: walkLength(cm, start, order, end) }, "corridor-dp");
    }
    if (stops.length <= limit) return exact();
  }
  const segments = buildSegments(graph, points, stops, [start, end]);
  const found = certifiedSearch(cm, start, end, stops, {
    heuristic: req.heuristic,
    segments,
    integer: oneWay,
    integerTimeLimitMs: INTEGER_TIME_LIMIT_MS,
  });
  return !found.optimal && stops.length <= limit ? exact() : found;
}
