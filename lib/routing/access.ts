import { UNREACHABLE } from "./constants";
import type { DistanceMatrix } from "./floyd-warshall";
import { nodePath } from "./floyd-warshall";
import type { AccessPoint, CompactGraph } from "./graph";

/** A node the point can be left through / entered from, with the cost along its own edge. */
interface Port {
  node: number;
  mm: number;
}

function exits(graph: CompactGraph, p: AccessPoint): Port[] {
  if (p.edge < 0) return [{ node: p.node, mm: 0 }];
  const e = graph.edges[p.edge];
  if (!e) throw new RangeError(`no edge ${p.edge}`);
  const ahead = { node: e.to, mm: e.lengthMm - p.offsetMm };
  return e.oneWay ? [ahead] : [ahead, { node: e.from, mm: p.offsetMm }];
}

function entries(graph: CompactGraph, p: AccessPoint): Port[] {
  if (p.edge < 0) return [{ node: p.node, mm: 0 }];
  const e = graph.edges[p.edge];
  if (!e) throw new RangeError(`no edge ${p.edge}`);
  const behind = { node: e.from, mm: p.offsetMm };
  return e.oneWay ? [behind] : [behind, { node: e.to, mm: e.lengthMm - p.offsetMm }];
}

/** Walk along the shared edge without passing a node, or UNREACHABLE. */
function alongEdge(graph: CompactGraph, p: AccessPoint, q: AccessPoint): number {
  if (p.edge < 0 || p.edge !== q.edge) return UNREACHABLE;
  if (q.offsetMm >= p.offsetMm) return q.offsetMm - p.offsetMm;
  return graph.edges[p.edge]?.oneWay ? UNREACHABLE : p.offsetMm - q.offsetMm;
}

/**
 * Shortest walk between two access points in O(1): along their shared edge, or out through one
 * end of p's edge and in through one end of q's (only the ends a one-way edge allows).
 */
export function accessDistance(graph: CompactGraph, dm: DistanceMatrix, p: AccessPoint, q: AccessPoint): number {
  let best = alongEdge(graph, p, q);
  for (const a of exits(graph, p)) {
    for (const b of entries(graph, q)) {
      const mid = dm.dist[a.node * dm.n + b.node] ?? UNREACHABLE;
      if (mid >= UNREACHABLE) continue;
      const s = a.mm + mid + b.mm;
      if (s < best) best = s;
    }
  }
  return best >= UNREACHABLE ? UNREACHABLE : best;
}

export interface RouteSegment {
  edge: number;
  /** Offsets along the edge measured from its `from` end; fromMm > toMm means walking it backwards. */
  fromMm: number;
  toMm: number;
}

export interface Route {
  lengthMm: number;
  /** Nodes passed, in order (empty when the walk stays on one edge). */
  nodes: number[];
  segments: RouteSegment[];
}

function edgeBetween(graph: CompactGraph, a: number, b: number): RouteSegment {
  for (const e of graph.edges) {
    if (e.from === a && e.to === b) return { edge: e.id, fromMm: 0, toMm: e.lengthMm };
    if (!e.oneWay && e.from === b && e.to === a) return { edge: e.id, fromMm: e.lengthMm, toMm: 0 };
  }
  throw new Error(`no edge from node ${a} to node ${b}`);
}

/** The walk behind accessDistance, as nodes and corridor segments (for drawing and directions). */
export function accessRoute(graph: CompactGraph, dm: DistanceMatrix, p: AccessPoint, q: AccessPoint): Route | null {
  const lengthMm = accessDistance(graph, dm, p, q);
  if (lengthMm >= UNREACHABLE) return null;
  if (alongEdge(graph, p, q) === lengthMm) {
    const segments = lengthMm === 0 ? [] : [{ edge: p.edge, fromMm: p.offsetMm, toMm: q.offsetMm }];
    return { lengthMm, nodes: [], segments };
  }
  for (const a of exits(graph, p)) {
    for (const b of entries(graph, q)) {
      const mid = dm.dist[a.node * dm.n + b.node] ?? UNREACHABLE;
      if (mid >= UNREACHABLE || a.mm + mid + b.mm !== lengthMm) continue;
      const nodes = nodePath(dm, a.node, b.node) ?? [];
      const segments: RouteSegment[] = [];
      if (p.edge >= 0) {
        const e = graph.edges[p.edge];
        segments.push({ edge: p.edge, fromMm: p.offsetMm, toMm: e && a.node === e.to ? e.lengthMm : 0 });
      }
      for (let i = 0; i + 1 < nodes.length; i++)
        segments.push(edgeBetween(graph, nodes[i] as number, nodes[i + 1] as number));
      if (q.edge >= 0) {
        const e = graph.edges[q.edge];
        segments.push({ edge: q.edge, fromMm: e && b.node === e.to ? e.lengthMm : 0, toMm: q.offsetMm });
      }
      return { lengthMm, nodes, segments };
    }
  }
  return null;
}
