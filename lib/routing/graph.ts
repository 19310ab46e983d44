/** The compact corridor graph published from a drawing. Plain data: JSON- and worker-safe. */

export type NodeKind = "junction" | "depot" | "dropoff";

export interface GraphNode {
  id: number;
  x: number;
  y: number;
  kind: NodeKind;
  /** Depot or drop-off id from the drawing; absent for junctions. */
  label?: string;
}

export interface GraphEdge {
  id: number;
  from: number;
  to: number;
  lengthMm: number;
  /** One-way edges may only be walked from `from` to `to`. */
  oneWay: boolean;
  /** Cell indices (row-major) walked from `from` to `to`, both end cells included. */
  cells: number[];
}

/**
 * Where a picker stands to pick: either on a node or part-way along an edge, `offsetMm` from
 * the edge's `from` end (0 < offsetMm < lengthMm).
 */
export interface AccessPoint {
  id: number;
  x: number;
  y: number;
  node: number;
  edge: number;
  offsetMm: number;
}

export interface GraphBin {
  code: string;
  aisle: number;
  bay: number;
  level: number;
  /** Index into CompactGraph.accessPoints. */
  accessPoint: number;
}

export interface UnattachedBin {
  code: string;
  reason: "not-a-rack-cell" | "no-facing-side" | "face-reaches-no-floor";
}

export interface NamedNode {
  id: string;
  node: number;
}

export interface CompactGraph {
  width: number;
  height: number;
  cellMm: number;
  nodes: GraphNode[];
  edges: GraphEdge[];
  accessPoints: AccessPoint[];
  bins: GraphBin[];
  depots: NamedNode[];
  dropoffs: NamedNode[];
  /** Bins left out of the graph and why; diagnostics lists them too. */
  unattachedBins: UnattachedBin[];
  /** Depot or drop-off ids whose cell is not floor (so they are not in the graph). */
  misplacedPoints: string[];
}

/** An access point standing exactly on node `node`. */
export function nodeAccessPoint(graph: CompactGraph, node: number): AccessPoint {
  const n = graph.nodes[node];
  if (!n) throw new RangeError(`no node ${node}`);
  return { id: -1, x: n.x, y: n.y, node, edge: -1, offsetMm: 0 };
}

export function findBin(graph: CompactGraph, code: string): GraphBin | undefined {
  return graph.bins.find((b) => b.code === code);
}
