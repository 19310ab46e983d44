import "server-only";
import type { EditorDocument } from "@/lib/floor-plan/document";
import { routingPool } from "@/lib/workers/pools";
import { buildLayout, type BuiltLayout } from "./build";

/** buildLayout with Floyd–Warshall, the O(V³) part, in the worker pool, off the server's event loop. */
export function computeLayout(
  document: EditorDocument,
  onProgress: (fraction: number, stage: string) => void,
  signal?: AbortSignal,
): Promise<BuiltLayout> {
  return buildLayout(document, onProgress, (graph, progress) =>
    routingPool().run({ kind: "floyd-warshall", graph }, { onProgress: progress, signal }),
  );
}
