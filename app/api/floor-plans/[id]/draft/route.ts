import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { getDraft, saveDraft } from "@/db/floor-plans";
import { listLayoutVersions } from "@/db/layout-versions";
import { audit } from "@/db/audit";
import { editorDocumentSchema } from "@/lib/floor-plan/document";

export const dynamic = "force-dynamic";

const Save = z.object({ version: rowVersion(), document: editorDocumentSchema });

export const GET = route({ access: "floorplans.read" }, async ({ user, params }) => {
  const id = intParam(params, "id", "floor plan");
  const draft = await getDraft(user.siteId, id);
  if (!draft) throw new HttpError(404, "No such floor plan at this site.");
  const [latest] = await listLayoutVersions(user.siteId, id);
  return Response.json({ draft, latestVersion: latest ? { id: latest.id, number: latest.number, publishedAt: latest.publishedAt } : null });
});

export const PUT = route({ access: "floorplans.edit", body: Save }, async ({ user, params, body, ip }) => {
  const id = intParam(params, "id", "floor plan");
  const saved = await saveDraft(user.siteId, id, body.version, body.document, user.id);
  if (!saved) throw new HttpError(404, "No such floor plan at this site.");
  if (!saved.ok) {
    // A retry of a save that already went through would land here too; same document → same answer as success.
    const current = await getDraft(user.siteId, id);
    if (current && current.version === body.version + 1 && JSON.stringify(current.document) === JSON.stringify(body.document)) {
      return Response.json({ version: current.version });
    }
    const who = saved.current.updatedByName ? ` by ${saved.current.updatedByName}` : "";
    return Response.json(
      { error: `Someone else saved this draft${who} since you loaded it. Reload their version, or keep editing and copy your changes over.`, current: saved.current },
      { status: 409 },
    );
  }
  await audit({ event: "floor_plan.saved", actorUserId: user.id, subject: `floor-plan:${id}`, ip, detail: { version: saved.version } });
  return Response.json({ version: saved.version });
});
