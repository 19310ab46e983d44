import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { rowVersion } from "@/lib/http/body-fields";
import { getUser, LastAdminError, updateUser } from "@/db/users";
import { audit } from "@/db/audit";
import { releaseBatchesOf } from "@/db/picking";
import { ROLES } from "@/lib/auth/permissions";

const Change = z
  .object({
    version: rowVersion(),
    role: z.enum(ROLES, { message: "Choose a role: admin, planner or picker." }).optional(),
    disabled: z.boolean().optional(),
    displayName: z.string().trim().min(1).max(120).optional(),
  })
  .refine((c) => c.role !== undefined || c.disabled !== undefined || c.displayName !== undefined, "Say what to change: role, disabled or displayName.");

export const PATCH = route({ access: "users.manage", body: Change }, async ({ user, body, params, ip }) => {
  const id = String(params.id ?? "");
  const target = await getUser(id);
  if (!target || target.siteId !== user.siteId) throw new HttpError(404, "No such user at this site. Reload the list.");
  const updated = await updateUser(id, body.version, body).catch((e: unknown) => {
    if (e instanceof LastAdminError) throw new HttpError(409, "This is the site's last active admin. Make someone else an admin first.");
    throw e;
  });
  if (!updated) throw new HttpError(409, "Someone changed this user while you were looking. Reload the list and try again.");
  if (updated.disabled || (target.role === "picker" && updated.role !== "picker")) await releaseBatchesOf(id);
  await audit({ event: "user.changed", actorUserId: user.id, subject: id, ip, detail: { role: body.role, disabled: body.disabled } });
  return Response.json({ user: updated });
});
