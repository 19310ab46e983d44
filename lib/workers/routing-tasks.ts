import type { CostMatrix } from "../routing/cost-matrix";
import { CostOverflowError, UnreachableStopError } from "../routing/errors";
import type { DistanceMatrix } from "../routing/floyd-warshall";
import { floydWarshall } from "../routing/floyd-warshall";
import type { CompactGraph } from "../routing/graph";
import type { SequenceRequest, SequenceResult } from "../routing/sequence";
import { sequenceStops } from "../routing/sequence";

/** Work the routing pool can run off the main thread. Plain data so it survives postMessage. */
export type RoutingTask =
  | { kind: "sequence"; matrix: CostMatrix; request: Omit<SequenceRequest, "onProgress"> }
  | { kind: "floyd-warshall"; graph: CompactGraph };

export type TaskResult<T extends RoutingTask> = T extends { kind: "sequence" } ? SequenceResult : DistanceMatrix;

export interface SerializedError {
  name: string;
  message: string;
  stops?: number[];
  codes?: string[];
}

export type WorkerMessage =
  | { type: "progress"; taskId: number; fraction: number }
  | { type: "done"; taskId: number; result: SequenceResult | DistanceMatrix }
  | { type: "error"; taskId: number; error: SerializedError };

export function runTask(task: RoutingTask, onProgress: (fraction: number) => void): SequenceResult | DistanceMatrix {
  if (task.kind === "sequence") return sequenceStops(task.matrix, { ...task.request, onProgress });
  return floydWarshall(task.graph, onProgress);
}

export function serializeError(e: unknown): SerializedError {
  if (e instanceof UnreachableStopError) return { name: e.name, message: e.message, stops: e.stops, codes: e.codes };
  if (e instanceof Error) return { name: e.name, message: e.message };
  return { name: "Error", message: String(e) };
}

/** Rebuilds the engine's typed errors on the calling side so callers can use instanceof. */
export function deserializeError(s: SerializedError): Error {
  if (s.name === "UnreachableStopError")
    return new UnreachableStopError(s.stops ?? [], s.codes ?? [], s.message.replace(/^[^:]*: /, ""));
  if (s.name === "CostOverflowError") {
    const e = new CostOverflowError(0);
    e.message = s.message;
    return e;
  }
  const e = s.name === "RangeError" ? new RangeError(s.message) : new Error(s.message);
  e.name = s.name;
  return e;
}
