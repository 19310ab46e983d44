import "server-only";
import { getLayoutVersionById } from "@/db/layout-versions";
import { HttpError } from "@/lib/http/errors";
import { accessRoute } from "@/lib/routing/access";
import { findBin } from "@/lib/routing/graph";
import { layoutGraph } from "./graph-cache";
import { routeCells } from "./route-cells";

export type DistanceAnswer = { from: string; to: string; distanceMm: number; cells: number[] };

/** Walking distance between two bins of a published layout, from its stored matrix. */
export async function layoutDistance(
  siteId: number,
  layoutVersionId: number,
  from: string,
  to: string,
): Promise<DistanceAnswer> {
  const version = await getLayoutVersionById(siteId, layoutVersionId);
  if (!version) throw new HttpError(404, "No such layout version at this site.");
  const { graph, matrix } = await layoutGraph(layoutVersionId);
  const a = findBin(graph, from);
  const b = findBin(graph, to);
  const missing = [!a && from, !b && to].filter(Boolean);
  if (missing.length)
    throw new HttpError(
      404,
      `Layout version ${version.number} has no bin ${missing.join(" or ")}. Check the location code.`,
    );
  const route = accessRoute(graph, matrix, graph.accessPoints[a!.accessPoint]!, graph.accessPoints[b!.accessPoint]!);
  if (!route)
    throw new HttpError(422, `There is no walkable way from ${from} to ${to} in this layout (one-way aisles?).`);
  return { from, to, distanceMm: route.lengthMm, cells: routeCells(graph, route) };
}
