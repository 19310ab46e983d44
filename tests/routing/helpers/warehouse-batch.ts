import {
  accessCostMatrix,
  buildGraph,
  floydWarshall,
  generateWarehouse,
  nodeAccessPoint,
  randomBatch,
  type AccessPoint,
  type CompactGraph,
  type CostMatrix,
  type DistanceMatrix,
  type GridDrawing,
} from "../../../lib/routing";
import { buildSegments, type StopSegment } from "../../../lib/routing/segments";

export interface WarehouseLayout {
  graph: CompactGraph;
  dm: DistanceMatrix;
}

export function layoutOf(drawing: GridDrawing): WarehouseLayout {
  const graph = buildGraph(drawing);
  return { graph, dm: floydWarshall(graph) };
}

export function warehouseLayout(spec: {
  aisles: number;
  positions: number;
  crossAisles: number;
  oneWay: boolean;
}): WarehouseLayout {
  return layoutOf(
    generateWarehouse({
      aisles: spec.aisles,
      positions: spec.positions,
      levels: 1,
      crossAisles: spec.crossAisles,
      oneWayAisles: spec.oneWay,
    }),
  );
}

export interface WarehouseBatch {
  cm: CostMatrix;
  start: number;
  end: number;
  stops: number[];
  /** Access point of each matrix index. */
  points: AccessPoint[];
  segments: StopSegment[];
}

/** A seeded batch on the layout: matrix [depot, drop-off, ...stops], as planPick builds it. */
export function warehouseBatch(layout: WarehouseLayout, m: number, seed: number, closed: boolean): WarehouseBatch {
  const { graph, dm } = layout;
  const codes = randomBatch(graph, m, seed);
  const byCode = new Map(graph.bins.map((b) => [b.code, b]));
  const depot = graph.depots[0]!.node;
  const drop = closed ? depot : graph.dropoffs[0]!.node;
  const points: AccessPoint[] = [
    nodeAccessPoint(graph, depot),
    nodeAccessPoint(graph, drop),
    ...codes.map((c) => graph.accessPoints[byCode.get(c)!.accessPoint]!),
  ];
  const cm = accessCostMatrix(graph, dm, points);
  const stops = codes.map((_, i) => i + 2);
  return { cm, start: 0, end: 1, stops, points, segments: buildSegments(graph, points, stops, [0, 1]) };
}
