import "server-only";
import { getUser, LastAdminError, updateUser, type UserChange } from "@/db/users";
import type { UserDTO } from "@/lib/contracts/users";
import { releaseBatchesOf } from "@/db/picking";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";

/**
 * An admin changes someone's role, name or access. A person who stops picking (disabled, or no longer
 * a picker) hands their unfinished batches back, so no batch stays on a handheld nobody uses.
 */
export async function changeUser(
  admin: SignedInUser,
  id: string,
  version: number,
  change: UserChange,
  ip: string,
): Promise<UserDTO> {
  const target = await getUser(id);
  if (!target || target.siteId !== admin.siteId)
    throw new HttpError(404, "No such user at this site. Reload the list.");
  const updated = await updateUser(id, version, change).catch((e: unknown) => {
    if (e instanceof LastAdminError)
      throw new HttpError(409, "This is the site's last active admin. Make someone else an admin first.");
    throw e;
  });
  if (!updated)
    throw new HttpError(409, "Someone changed this user while you were looking. Reload the list and try again.");
  if (updated.disabled || (target.role === "picker" && updated.role !== "picker")) await releaseBatchesOf(id);
  await audit({
    event: "user.changed",
    actorUserId: admin.id,
    subject: id,
    ip,
    detail: { role: change.role, disabled: change.disabled },
  });
  return updated;
}
