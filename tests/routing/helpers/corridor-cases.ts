import {
  accessDistance,
  buildGraph,
  emptyDrawing,
  generateWarehouse,
  mulberry32,
  UNREACHABLE,
  floydWarshall,
  heldKarp,
  nodeAccessPoint,
  randomBatch,
  type AccessPoint,
  type CompactGraph,
  type CostMatrix,
  type DistanceMatrix,
} from "../../../lib/routing";
import { accessCostMatrix } from "../../../lib/routing/plan";
import type { GridDrawing } from "../../../lib/routing";

export interface CorridorCase {
  graph: CompactGraph;
  start: AccessPoint;
  end: AccessPoint;
  stops: AccessPoint[];
  /** Matrix over [start, end, ...stops], as planPick builds it. */
  cm: CostMatrix;
}

const built = new Map<GridDrawing, { graph: CompactGraph; dm: DistanceMatrix }>();

export function published(d: GridDrawing): { graph: CompactGraph; dm: DistanceMatrix } {
  let g = built.get(d);
  if (!g) {
    const graph = buildGraph(d);
    g = { graph, dm: floydWarshall(graph) };
    built.set(d, g);
  }
  return g;
}

export function caseOf(
  graph: CompactGraph,
  dm: DistanceMatrix,
  start: AccessPoint,
  end: AccessPoint,
  stops: AccessPoint[],
): CorridorCase {
  return { graph, start, end, stops, cm: accessCostMatrix(graph, dm, [start, end, ...stops]) };
}

/** A seeded batch of `n` stops (fewer if the layout has fewer access points) between two named points (depot ids or drop-off ids). */
export function batchCase(d: GridDrawing, n: number, seed: number, from: string, to: string): CorridorCase {
  const { graph, dm } = published(d);
  const node = (id: string) => ([...graph.depots, ...graph.dropoffs].find((p) => p.id === id) as { node: number }).node;
  const byCode = new Map(graph.bins.map((b) => [b.code, b.accessPoint]));
  const stops = randomBatch(graph, Math.min(n, graph.accessPoints.length), seed).map(
    (c) => graph.accessPoints[byCode.get(c) as number] as AccessPoint,
  );
  return caseOf(graph, dm, nodeAccessPoint(graph, node(from)), nodeAccessPoint(graph, node(to)), stops);
}

/** Held–Karp optimum over the case's matrix (start 0, end 1, stops 2..). */
export function heldKarpLength(c: CorridorCase): number {
  return heldKarp(
    c.cm,
    0,
    1,
    c.stops.map((_, i) => i + 2),
  ).length;
}

/**
 * Seeded irregular two-way drawing: a small grid of floor, racks (one bin per rack cell, facing a
 * random side) and blocked cells, with the depot and drop-off on random floor cells.
 */
export function irregularDrawing(seed: number): GridDrawing {
  const rand = mulberry32(seed);
  const w = 3 + Math.floor(rand() * 7);
  const h = 3 + Math.floor(rand() * 7);
  const d = emptyDrawing(w, h, 700 + 100 * Math.floor(rand() * 6));
  const sides = ["N", "E", "S", "W"] as const;
  for (let c = 0; c < w * h; c++) {
    const r = rand();
    d.cells[c] = r < 0.55 ? "floor" : r < 0.9 ? "rack" : "blocked";
    d.facing[c] = d.cells[c] === "rack" ? sides[Math.floor(rand() * 4)]! : null;
  }
  const floor = d.cells.flatMap((k, c) => (k === "floor" ? [c] : []));
  if (floor.length === 0) {
    d.cells[0] = "floor";
    d.facing[0] = null;
    floor.push(0);
  }
  const at = () => {
    const c = floor[Math.floor(rand() * floor.length)]!;
    return { x: c % w, y: Math.floor(c / w) };
  };
  d.depots = [{ id: "D1", ...at() }];
  d.dropoffs = [{ id: "P1", ...at() }];
  d.bins = d.cells.flatMap((k, c) =>
    k === "rack" ? [{ code: `R${c}`, aisle: 1, bay: c, level: 1, x: c % w, y: Math.floor(c / w) }] : [],
  );
  return d;
}

/** A generated warehouse with a seeded scatter of blocked aisle and cross-aisle cells (all two-way). */
export function blockedWarehouse(seed: number, crossAisles: number): GridDrawing {
  const rand = mulberry32(seed);
  const d = generateWarehouse({ aisles: 3 + (seed % 4), positions: 6 + (seed % 5), levels: 1, crossAisles });
  const special = new Set([...d.depots, ...d.dropoffs].map((p) => p.y * d.width + p.x));
  for (let c = 0; c < d.cells.length; c++)
    if (d.cells[c] === "floor" && !special.has(c) && rand() < 0.05) d.cells[c] = "blocked";
  return d;
}

/** Points of the graph a walk from `from` can reach: nodes and access points. */
export function reachablePoints(graph: CompactGraph, dm: DistanceMatrix, from: AccessPoint): AccessPoint[] {
  const all = [...graph.nodes.map((n) => nodeAccessPoint(graph, n.id)), ...graph.accessPoints];
  return all.filter((p) => accessDistance(graph, dm, from, p) < UNREACHABLE);
}
