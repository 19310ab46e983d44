import "server-only";
import { getDraft, saveDraft } from "@/db/floor-plans";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import type { EditorDocument } from "@/lib/floor-plan/document";
import { HttpError } from "@/lib/http/errors";
import { wentThrough } from "@/lib/http/repeat";

/** Saves the editor's document over the draft it loaded (`version`); someone else's save since is a 409 with theirs. */
export async function saveDraftBy(
  user: SignedInUser,
  id: number,
  version: number,
  document: EditorDocument,
  ip: string,
): Promise<{ version: number }> {
  const saved = await saveDraft(user.siteId, id, version, document, user.id);
  if (!saved) throw new HttpError(404, "No such floor plan at this site.");
  if (!saved.ok) {
    const current = await getDraft(user.siteId, id);
    if (current && wentThrough(current, (c) => JSON.stringify(c.document) === JSON.stringify(document), version))
      return { version: current.version };
    const who = saved.current.updatedByName ? ` by ${saved.current.updatedByName}` : "";
    throw new HttpError(
      409,
      `Someone else saved this draft${who} since you loaded it. Reload their version, or keep editing and copy your changes over.`,
      { current: saved.current },
    );
  }
  await audit({
    event: "floor_plan.saved",
    actorUserId: user.id,
    subject: `floor-plan:${id}`,
    ip,
    detail: { version: saved.version },
  });
  return { version: saved.version };
}
