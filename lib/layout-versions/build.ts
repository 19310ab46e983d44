import type { EditorDocument } from "@/lib/floor-plan/document";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { documentBins } from "@/lib/floor-plan/bin-codes";
import { buildGraph } from "@/lib/routing/build-graph";
import { floydWarshall, type DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { CompactGraph } from "@/lib/routing/graph";
import { MAX_JUNCTIONS } from "@/lib/routing/limits";
import { HttpError } from "@/lib/http/errors";

export type BuiltLayout = { graph: CompactGraph; matrix: DistanceMatrix };
type AllPairs = (
  graph: CompactGraph,
  onProgress: (fraction: number) => void,
) => DistanceMatrix | Promise<DistanceMatrix>;

/**
 * Drawing → compact graph → all-pairs walking distances: the whole computation of a publish. The web
 * server passes a worker-pool runner for Floyd–Warshall; the seed runs it in place.
 */
export async function buildLayout(
  document: EditorDocument,
  onProgress: (fraction: number, stage: string) => void = () => {},
  allPairs: AllPairs = floydWarshall,
): Promise<BuiltLayout> {
  onProgress(0, "Building the corridor graph");
  const graph = buildGraph(toGridDrawing(document));
  // The editor's checks refuse such a plan already; this keeps any other caller from an hour-long, many-GB run.
  if (graph.nodes.length > MAX_JUNCTIONS)
    throw new HttpError(
      422,
      `This floor plan has ${graph.nodes.length.toLocaleString("en-US")} junctions; Trailbin can publish at most ${MAX_JUNCTIONS.toLocaleString("en-US")}. Run the editor's checks to see what to change.`,
    );
  const stage = `Walking distances between ${graph.nodes.length} junctions (Floyd–Warshall)`;
  onProgress(0.1, stage);
  const matrix = await allPairs(graph, (f) => onProgress(0.1 + 0.9 * f, stage));
  return { graph, matrix };
}

export function rackRunOfBins(document: EditorDocument): Map<string, string> {
  return new Map(documentBins(document).map((b) => [b.code, b.runId]));
}
