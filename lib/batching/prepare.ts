import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import { UnreachableStopError } from "@/lib/routing/errors";
import type { CompactGraph, GraphBin } from "@/lib/routing/graph";
import { planPick } from "@/lib/routing/plan";
import type { CartLimits, UnbatchableOrder, WaveLine, WaveOrder } from "./types";
import { compareUrgency, cutoffMs } from "./urgency";
import { InsertionRoute, type WalkCosts } from "./walk-costs";

/** An order that passed the checks, with what batching needs precomputed. */
export type PreparedOrder = {
  order: WaveOrder;
  cutoffMs: number;
  lineCount: number;
  weightG: number;
  /** Distinct WalkCosts points of its lines, ascending. */
  points: number[];
  /** Position in the first-come queue (0 = most urgent). */
  rank: number;
  /**
   * The cheap insertion route cannot walk this order's stops although a full search can (possible
   * only with one-way aisles in an awkward order): it then rides alone in its own batch.
   */
  alone: boolean;
};

function grams(g: number): string {
  return g >= 1000 ? `${(g / 1000).toFixed(1)} kg` : `${Math.round(g)} g`;
}

/** Lines named in a reason before "and N more", so one reason stays readable. */
const NAMED_LINES = 5;

/**
 * Names each line's SKU with the bins it was looked for in. A line whose item has no bin on the
 * layout version carries binCode "" and the item master's bins in itemBins.
 */
function offLayoutReason(name: string, off: readonly WaveLine[]): string {
  const where = (l: WaveLine) => {
    const codes = l.binCode ? [l.binCode] : (l.itemBins ?? []);
    if (codes.length === 0) return `${l.sku} has no pick bin in the item master`;
    return `${l.sku} is in ${codes.join(" or ")}`;
  };
  const named = off.slice(0, NAMED_LINES).map(where);
  const more =
    off.length > NAMED_LINES
      ? `, and ${off.length - NAMED_LINES} more line${off.length - NAMED_LINES === 1 ? "" : "s"}`
      : "";
  const binCount = off.reduce((n, l) => n + (l.binCode ? 1 : (l.itemBins?.length ?? 0)), 0);
  const those = binCount === 1 ? "that bin" : "those bins";
  const notOn =
    binCount > 0 ? `; ${those} ${binCount === 1 ? "is" : "are"} not on the published layout version of this wave` : "";
  return `${name} cannot be picked on this layout version: ${named.join("; ")}${more}${notOn}. Correct the item master's bins${binCount > 0 ? ` or publish a floor plan with ${those}` : ""}, then plan again.`;
}

/** Why this order can never be batched on this layout with these limits, or null. */
function problem(order: WaveOrder, limits: CartLimits, bins: Map<string, GraphBin>, weightG: number): string | null {
  const name = `Order ${order.orderNumber}`;
  if (order.lines.length === 0) return `${name} has no lines; add its lines or cancel it.`;
  if (Number.isNaN(cutoffMs(order)))
    return `${name} has a cut-off "${order.cutoffAt}" that is not a date and time; correct it and plan again.`;
  if (!Number.isFinite(order.priority)) return `${name} has no valid priority; set it to 1, 2 or 3.`;
  const badQty = order.lines.find((l) => !(l.quantity > 0) || !Number.isFinite(l.quantity));
  if (badQty)
    return `${name}: line ${badQty.lineId} (${badQty.sku}) has quantity ${badQty.quantity}; quantities must be positive.`;
  const badWeight = order.lines.find((l) => !(l.unitWeightG >= 0) || !Number.isFinite(l.unitWeightG));
  if (badWeight)
    return `${name}: ${badWeight.sku} has no valid unit weight in the item master; correct it and plan again.`;
  const off = order.lines.filter((l) => !bins.has(l.binCode));
  if (off.length > 0) return offLayoutReason(name, off);
  if (order.lines.length > limits.maxLines) {
    return `${name} has ${order.lines.length} lines but a cart takes at most ${limits.maxLines}; split the order or raise the cart's line limit.`;
  }
  if (weightG > limits.maxWeightG) {
    return `${name} weighs ${grams(weightG)} but a cart takes at most ${grams(limits.maxWeightG)}; split the order or raise the cart's weight limit.`;
  }
  return null;
}

/**
 * Checks every order, registers the access points of the good ones with `costs`, and returns the
 * good ones in first-come order. Every other order comes back with a reason, never dropped.
 */
export function prepareOrders(
  graph: CompactGraph,
  dm: DistanceMatrix,
  ends: { from: string; to: string },
  costs: WalkCosts,
  orders: readonly WaveOrder[],
  limits: CartLimits,
): { prepared: PreparedOrder[]; unbatchable: UnbatchableOrder[] } {
  const bins = new Map(graph.bins.map((b) => [b.code, b]));
  const unbatchable: UnbatchableOrder[] = [];
  const seen = new Set<number>();
  const good: Omit<PreparedOrder, "rank" | "points" | "alone">[] = [];
  for (const order of orders) {
    if (seen.has(order.orderId)) {
      unbatchable.push({
        orderId: order.orderId,
        reason: `Order ${order.orderNumber} appears more than once in the wave (id ${order.orderId}); only its first copy was batched.`,
      });
      continue;
    }
    seen.add(order.orderId);
    const weightG = order.lines.reduce((s, l) => s + l.quantity * l.unitWeightG, 0);
    const reason = problem(order, limits, bins, weightG);
    if (reason) unbatchable.push({ orderId: order.orderId, reason });
    else good.push({ order, cutoffMs: cutoffMs(order), lineCount: order.lines.length, weightG });
  }
  good.sort(compareUrgency);
  const withPoints = good.map((g, rank) => {
    const aps = new Set(g.order.lines.map((l) => (bins.get(l.binCode) as GraphBin).accessPoint));
    return { ...g, rank, alone: false, points: [...aps].map((ap) => costs.pointOf(ap)).sort((a, b) => a - b) };
  });
  const prepared: PreparedOrder[] = [];
  for (const p of withPoints) {
    if (new InsertionRoute(costs).addedLength(p.points) < Infinity) {
      prepared.push(p);
      continue;
    }
    // Insertion found no walk; the exact planner decides whether one exists at all.
    try {
      planPick(graph, dm, { ...ends, binCodes: p.order.lines.map((l) => l.binCode) });
      prepared.push({ ...p, alone: true });
    } catch (e) {
      if (!(e instanceof UnreachableStopError)) throw e;
      const where = e.codes.length > 0 ? ` (${e.codes.join(", ")})` : "";
      unbatchable.push({
        orderId: p.order.orderId,
        reason: `Order ${p.order.orderNumber} has bins${where} that no walk from the depot to the drop-off can reach; check one-way aisles and blocked floor on the floor plan, or move the items.`,
      });
    }
  }
  return { prepared, unbatchable };
}
