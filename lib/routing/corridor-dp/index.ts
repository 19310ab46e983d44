import { UnreachableStopError } from "../errors";
import type { AccessPoint, CompactGraph } from "../graph";
import { walkStops } from "./euler-walk";
import { buildInstance, type CorridorInstance } from "./instance";
import { MAX_FRONT_WIDTH, runSweep } from "./sweep-dp";
import { chooseSweep } from "./sweep-order";

export interface CorridorRequest {
  graph: CompactGraph;
  start: AccessPoint;
  end: AccessPoint;
  stops: readonly AccessPoint[];
  /** Most states kept after any one edge before giving up; default 200 000. */
  maxStates?: number;
}

export type CorridorResult =
  | { order: number[] /* indices into stops, visiting order */; lengthMm: number }
  | { skipped: "one-way" | "front-too-wide"; frontWidth?: number };

export const DEFAULT_MAX_STATES = 200_000;

/** Width of the sweep front the DP would use on this graph (before start or end split an edge). */
export function corridorFrontWidth(graph: CompactGraph): number {
  const edges = graph.edges.map((e) => ({ u: e.from, v: e.to }));
  return chooseSweep(
    graph.nodes.length,
    graph.nodes.map((n) => n.x),
    graph.nodes.map((n) => n.y),
    edges,
    edges.map((_, i) => i),
  ).width;
}

/** Edges of the start's component; throws if a stop or the end lies outside it. */
function reachableEdges(inst: CorridorInstance): number[] {
  const adj: number[][] = Array.from({ length: inst.nodeCount }, () => []);
  inst.edges.forEach((e, i) => {
    adj[e.u]?.push(i);
    adj[e.v]?.push(i);
  });
  const seen = new Uint8Array(inst.nodeCount);
  const taken = new Uint8Array(inst.edges.length);
  seen[inst.start] = 1;
  const queue = [inst.start];
  while (queue.length > 0) {
    const x = queue.pop() as number;
    for (const i of adj[x] as number[]) {
      const e = inst.edges[i];
      if (!e) continue;
      taken[i] = 1;
      const y = e.u === x ? e.v : e.u;
      if (!seen[y]) {
        seen[y] = 1;
        queue.push(y);
      }
    }
  }
  const include = inst.edges.flatMap((_, i) => (taken[i] ? [i] : []));
  const bad = inst.places.flatMap((pl, s) =>
    seen["node" in pl ? pl.node : (inst.edges[pl.edge]?.u as number)] ? [] : [s],
  );
  if (bad.length > 0) throw new UnreachableStopError(bad);
  if (!seen[inst.end]) throw new UnreachableStopError([], [], "the end cannot be reached from the start");
  return include;
}

/**
 * Exact shortest pick walk on a two-way corridor graph by a sweep over its edges, in the family of
 * Ratliff & Rosenthal (1983) and Roodbergen & de Koster (2001), generalised from rectangular
 * warehouses to any corridor graph whose sweep front stays narrow.
 */
export function corridorSweep(req: CorridorRequest): CorridorResult {
  const { graph } = req;
  if (graph.edges.some((e) => e.oneWay)) return { skipped: "one-way" };
  const inst = buildInstance(graph, req.start, req.end, req.stops);
  const include = reachableEdges(inst);
  const onlyStart = inst.start === inst.end && inst.places.every((pl) => "node" in pl && pl.node === inst.start);
  if (onlyStart) return { order: req.stops.map((_, i) => i), lengthMm: 0 };

  const plan = chooseSweep(inst.nodeCount, inst.xs, inst.ys, inst.edges, include);
  if (plan.width > MAX_FRONT_WIDTH) return { skipped: "front-too-wide", frontWidth: plan.width };
  const out = runSweep(inst, plan, req.maxStates ?? DEFAULT_MAX_STATES);
  if ("tooManyStates" in out) return { skipped: "front-too-wide", frontWidth: plan.width };
  const walk = walkStops(inst, out.uses);
  if (walk.lengthMm !== out.costMm)
    throw new Error(`corridor walk ${walk.lengthMm} mm differs from its cost ${out.costMm} mm`);
  return { order: walk.order, lengthMm: out.costMm };
}
