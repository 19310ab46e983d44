import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getDraft } from "@/db/floor-plans";
import { listLayoutVersions } from "@/db/layout-versions";
import { editorDocumentSchema } from "@/lib/floor-plan/document";
import { saveDraftBy } from "@/lib/drafts/save-draft";

const Params = z.object({ id: idParam("floor plan") });
const Save = z.object({ version: rowVersion(), document: editorDocumentSchema });

export const GET = route({ access: "floorplans.read", params: Params }, async ({ user, params }) => {
  const draft = await getDraft(user.siteId, params.id);
  if (!draft) throw new HttpError(404, "No such floor plan at this site.");
  const [latest] = await listLayoutVersions(user.siteId, params.id);
  return Response.json({
    draft,
    latestVersion: latest ? { id: latest.id, number: latest.number, publishedAt: latest.publishedAt } : null,
  });
});

export const PUT = route(
  { access: "floorplans.edit", params: Params, body: Save },
  async ({ user, params, body, ip }) =>
    Response.json(await saveDraftBy(user, params.id, body.version, body.document, ip)),
);
