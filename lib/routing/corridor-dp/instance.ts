import type { AccessPoint, CompactGraph } from "../graph";

/** A corridor run between two sweep nodes, with the distinct stop offsets (from `u`) strictly inside it. */
export interface SweepEdge {
  u: number;
  v: number;
  lengthMm: number;
  stops: number[];
}

/** Where a stop sits once start and end have been made nodes: on a node, or inside an edge. */
export type StopPlace = { node: number } | { edge: number; offsetMm: number };

/**
 * The graph the sweep runs on: the corridor graph with a start or end that lies part-way along an
 * edge turned into a node of its own, so every point with a degree rule is a node.
 */
export interface CorridorInstance {
  nodeCount: number;
  xs: number[];
  ys: number[];
  edges: SweepEdge[];
  start: number;
  end: number;
  /** 1 where the walk must pass: start, end, stops on nodes. */
  required: Uint8Array;
  /** Degree parity the finished walk leaves at each node: odd only at start and end when they differ. */
  oddTarget: Uint8Array;
  places: StopPlace[];
}

type Place = { node: number } | { edge: number; offsetMm: number };

function placeOf(graph: CompactGraph, p: AccessPoint): Place {
  if (p.edge < 0) return { node: p.node };
  const e = graph.edges[p.edge];
  if (!e) throw new RangeError(`no edge ${p.edge}`);
  if (p.offsetMm <= 0) return { node: e.from };
  if (p.offsetMm >= e.lengthMm) return { node: e.to };
  return { edge: p.edge, offsetMm: p.offsetMm };
}

export function buildInstance(
  graph: CompactGraph,
  start: AccessPoint,
  end: AccessPoint,
  stops: readonly AccessPoint[],
): CorridorInstance {
  const xs = graph.nodes.map((n) => n.x);
  const ys = graph.nodes.map((n) => n.y);
  // Offsets where an original edge is cut because start or end lies there, with the node made for each.
  const cuts = new Map<number, Map<number, number>>();
  const endpointNode = (p: AccessPoint): number => {
    const pl = placeOf(graph, p);
    if ("node" in pl) return pl.node;
    let byOffset = cuts.get(pl.edge);
    if (!byOffset) cuts.set(pl.edge, (byOffset = new Map()));
    let node = byOffset.get(pl.offsetMm);
    if (node === undefined) {
      node = xs.length;
      xs.push(p.x);
      ys.push(p.y);
      byOffset.set(pl.offsetMm, node);
    }
    return node;
  };
  const s = endpointNode(start);
  const t = endpointNode(end);

  // Each original edge becomes one or more sweep edges; remember which piece starts where.
  const edges: SweepEdge[] = [];
  const pieces: { first: number; bounds: number[] }[] = [];
  graph.edges.forEach((e) => {
    const cut = cuts.get(e.id);
    const offsets = cut ? [...cut.keys()].sort((a, b) => a - b) : [];
    const bounds = [0, ...offsets, e.lengthMm];
    const ends = [e.from, ...offsets.map((o) => cut?.get(o) as number), e.to];
    pieces.push({ first: edges.length, bounds });
    for (let i = 0; i + 1 < ends.length; i++) {
      edges.push({
        u: ends[i] as number,
        v: ends[i + 1] as number,
        lengthMm: (bounds[i + 1] as number) - (bounds[i] as number),
        stops: [],
      });
    }
  });

  const nodeCount = xs.length;
  const required = new Uint8Array(nodeCount);
  required[s] = 1;
  required[t] = 1;
  const places: StopPlace[] = stops.map((p) => {
    const pl = placeOf(graph, p);
    if ("node" in pl) {
      required[pl.node] = 1;
      return pl;
    }
    const piece = pieces[pl.edge] as { first: number; bounds: number[] };
    const cut = cuts.get(pl.edge);
    const atCut = cut?.get(pl.offsetMm);
    if (atCut !== undefined) {
      required[atCut] = 1;
      return { node: atCut };
    }
    let i = 0;
    while ((piece.bounds[i + 1] as number) < pl.offsetMm) i++;
    const edge = piece.first + i;
    const offsetMm = pl.offsetMm - (piece.bounds[i] as number);
    const list = (edges[edge] as SweepEdge).stops;
    if (!list.includes(offsetMm)) list.push(offsetMm);
    return { edge, offsetMm };
  });
  for (const e of edges) e.stops.sort((a, b) => a - b);

  const oddTarget = new Uint8Array(nodeCount);
  if (s !== t) {
    oddTarget[s] = 1;
    oddTarget[t] = 1;
  }
  return { nodeCount, xs, ys, edges, start: s, end: t, required, oddTarget, places };
}
