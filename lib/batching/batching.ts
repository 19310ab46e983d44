import { UnknownLocationError, UnreachableStopError } from "@/lib/routing/errors";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { CompactGraph } from "@/lib/routing/graph";
import type { HeuristicOptions } from "@/lib/routing/local-search";
import { planPick } from "@/lib/routing/plan";
import { BatchingCancelled } from "./errors";
import { firstComeBatches } from "./first-come";
import type { PreparedOrder } from "./prepare";
import { prepareOrders } from "./prepare";
import { savingsBatches, type SavingsOptions } from "./savings";
import type { BatchingMethod, BatchingResult, BatchPlan, CartLimits, WaveOrder } from "./types";
import { WalkCosts } from "./walk-costs";

export type BatchingOptions = {
  method: BatchingMethod;
  /** Depot id the carts start from. */
  from: string;
  /** Drop-off id the carts end at. */
  to: string;
  /** Fraction of the wave's orders placed (batched or reported unbatchable), 0..1. */
  onProgress?: (fraction: number) => void;
  /** Asked before each batch; true stops the job with BatchingCancelled. */
  shouldStop?: () => boolean;
  /** Passed to planPick for every batch's final route. */
  route?: { exactLimit?: number; heuristic?: HeuristicOptions };
  savings?: SavingsOptions;
};

function checkLimits(limits: CartLimits): void {
  for (const [name, v] of Object.entries(limits)) {
    if (!(v > 0) || !Number.isFinite(v)) throw new RangeError(`cart limit ${name} must be a positive number, not ${v}`);
  }
  if (!Number.isInteger(limits.totesPerCart)) throw new RangeError("totesPerCart must be a whole number");
}

function nodeOf(graph: CompactGraph, id: string): number | undefined {
  return (graph.depots.find((p) => p.id === id) ?? graph.dropoffs.find((p) => p.id === id))?.node;
}

function plan(
  graph: CompactGraph,
  dm: DistanceMatrix,
  group: readonly PreparedOrder[],
  options: BatchingOptions,
): BatchPlan {
  const route = planPick(
    graph,
    dm,
    { from: options.from, to: options.to, binCodes: binCodesOf(group.map((g) => g.order)) },
    options.route ?? {},
  );
  return {
    orders: group.map((g) => g.order.orderId),
    lineCount: group.reduce((s, g) => s + g.lineCount, 0),
    weightG: group.reduce((s, g) => s + g.weightG, 0),
    route,
  };
}

/** The bin codes planPick is given for a batch: tote by tote, line by line (tests rebuild it the same way). */
export function binCodesOf(orders: readonly WaveOrder[]): string[] {
  return orders.flatMap((o) => o.lines.map((l) => l.binCode));
}

/**
 * Cuts a wave into cart batches and plans each batch's route with planPick (exact up to the exact
 * limit, heuristic above, as its `optimal` flag says). Orders that can never be batched come back in
 * `unbatchable` with a reason; a wrong depot or drop-off id, or invalid limits, throw.
 */
export function batchOrders(
  graph: CompactGraph,
  dm: DistanceMatrix,
  orders: readonly WaveOrder[],
  limits: CartLimits,
  options: BatchingOptions,
): BatchingResult {
  checkLimits(limits);
  const startNode = nodeOf(graph, options.from);
  const endNode = nodeOf(graph, options.to);
  if (startNode === undefined || endNode === undefined) {
    throw new UnknownLocationError([
      ...(startNode === undefined ? [options.from] : []),
      ...(endNode === undefined ? [options.to] : []),
    ]);
  }
  const costs = new WalkCosts(graph, dm, startNode, endNode);
  const total = orders.length;
  const progress = (placed: number) => options.onProgress?.(total === 0 ? 1 : placed / total);

  if (costs.cost(WalkCosts.START, WalkCosts.END) === Infinity && options.from !== options.to) {
    // No walk at all from this depot to this drop-off: a floor-plan problem, reported per order.
    const reason = `No walk leads from depot ${options.from} to drop-off ${options.to} on this layout; fix the floor plan or choose another drop-off.`;
    progress(total);
    return { batches: [], unbatchable: orders.map((o) => ({ orderId: o.orderId, reason })) };
  }

  const { prepared, unbatchable } = prepareOrders(graph, dm, options, costs, orders, limits);
  let placed = unbatchable.length;
  progress(placed);
  const groups =
    options.method === "savings"
      ? savingsBatches(prepared, costs, limits, options.savings)
      : firstComeBatches(prepared, costs, limits);
  const batches: BatchPlan[] = [];
  for (;;) {
    if (options.shouldStop?.()) throw new BatchingCancelled(batches.length);
    const next = groups.next();
    if (next.done) break;
    const group = next.value;
    try {
      batches.push(plan(graph, dm, group, options));
    } catch (e) {
      // Every order walks on its own, yet this mix found no single walk (possible with one-way aisles):
      // plan its orders one cart each rather than lose them.
      if (!(e instanceof UnreachableStopError) || group.length === 1) throw e;
      for (const g of group) batches.push(plan(graph, dm, [g], options));
    }
    placed += group.length;
    progress(placed);
  }
  return { batches, unbatchable };
}
