import { accessDistance } from "./access";
import type { RouteMethod } from "./certificate";
import type { LocatedStop } from "./baseline";
import { baselineOrder } from "./baseline";
import type { CostMatrix } from "./cost-matrix";
import { walkLength } from "./cost-matrix";
import { UnknownLocationError, UnreachableStopError } from "./errors";
import type { DistanceMatrix } from "./floyd-warshall";
import type { AccessPoint, CompactGraph } from "./graph";
import { nodeAccessPoint } from "./graph";
import type { SequenceRequest } from "./sequence";
import { sequenceOnFloor } from "./floor-sequence";

export interface PickRequest {
  /** Depot id from the drawing. */
  from: string;
  /** Drop-off id from the drawing (may be a depot id too). */
  to: string;
  /** Location codes of the batch's order lines; repeats and shared access points collapse. */
  binCodes: readonly string[];
}

export interface PickStop {
  accessPoint: AccessPoint;
  /** Codes picked here, in request order. */
  codes: string[];
}

export interface PickPlan {
  stops: PickStop[];
  lengthMm: number;
  /** Never above the shortest possible walk; equals lengthMm when the route is proved shortest. */
  lowerBoundMm: number;
  optimal: boolean;
  method: RouteMethod;
  baselineMm: number;
  /** baselineMm - lengthMm; never negative when optimal. */
  savingMm: number;
}

/** Cost matrix over [start, end, ...stops] from O(1) access-point distances. */
export function accessCostMatrix(graph: CompactGraph, dm: DistanceMatrix, points: readonly AccessPoint[]): CostMatrix {
  const n = points.length;
  const cost = new Int32Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      if (a !== b) cost[a * n + b] = accessDistance(graph, dm, points[a] as AccessPoint, points[b] as AccessPoint);
    }
  }
  return { n, cost };
}

function namedNode(graph: CompactGraph, id: string): number | undefined {
  return (graph.depots.find((p) => p.id === id) ?? graph.dropoffs.find((p) => p.id === id))?.node;
}

/** Plans one batch: collapse lines to stops, sequence them, and measure the site's baseline walk. */
export function planPick(
  graph: CompactGraph,
  dm: DistanceMatrix,
  req: PickRequest,
  options: Pick<SequenceRequest, "exactLimit" | "heuristic" | "onProgress"> = {},
): PickPlan {
  const startNode = namedNode(graph, req.from);
  const endNode = namedNode(graph, req.to);
  const byCode = new Map(graph.bins.map((b) => [b.code, b]));
  const missing = [
    ...(startNode === undefined ? [req.from] : []),
    ...(endNode === undefined ? [req.to] : []),
    ...req.binCodes.filter((c) => !byCode.has(c)),
  ];
  if (missing.length > 0 || startNode === undefined || endNode === undefined) throw new UnknownLocationError(missing);

  const apIds: number[] = [];
  const codesAt = new Map<number, string[]>();
  const lines: LocatedStop[] = [];
  for (const code of req.binCodes) {
    const bin = byCode.get(code);
    if (!bin) continue;
    if (!codesAt.has(bin.accessPoint)) {
      codesAt.set(bin.accessPoint, []);
      apIds.push(bin.accessPoint);
    }
    const list = codesAt.get(bin.accessPoint) as string[];
    if (!list.includes(code)) list.push(code);
    lines.push({ stop: 2 + apIds.indexOf(bin.accessPoint), code, aisle: bin.aisle, bay: bin.bay, level: bin.level });
  }
  const points = [
    nodeAccessPoint(graph, startNode),
    nodeAccessPoint(graph, endNode),
    ...apIds.map((id) => graph.accessPoints[id] as AccessPoint),
  ];
  const cm = accessCostMatrix(graph, dm, points);
  const stopIdx = apIds.map((_, i) => i + 2);

  let r;
  try {
    r = sequenceOnFloor(graph, points, cm, { start: 0, end: 1, stops: stopIdx, ...options });
  } catch (e) {
    if (e instanceof UnreachableStopError) {
      const codes = e.stops.flatMap((s) => (s >= 2 ? (codesAt.get(apIds[s - 2] as number) ?? []) : [req.to]));
      throw new UnreachableStopError(e.stops, codes);
    }
    throw e;
  }
  const baselineMm = walkLength(cm, 0, baselineOrder(lines), 1);
  return {
    stops: r.order.map((s) => {
      const ap = apIds[s - 2] as number;
      return { accessPoint: points[s] as AccessPoint, codes: codesAt.get(ap) ?? [] };
    }),
    lengthMm: r.length,
    lowerBoundMm: r.lowerBound,
    optimal: r.optimal,
    method: r.method,
    baselineMm,
    savingMm: baselineMm - r.length,
  };
}
