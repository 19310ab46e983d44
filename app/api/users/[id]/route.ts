import { z } from "zod";
import { route } from "@/lib/http/route";
import { rowVersion } from "@/lib/http/body-fields";
import { textParam } from "@/lib/http/params";
import { changeUser } from "@/lib/users/change-user";
import { ROLES } from "@/lib/auth/permissions";

const Change = z
  .object({
    version: rowVersion(),
    role: z.enum(ROLES, { message: "Choose a role: admin, planner or picker." }).optional(),
    disabled: z.boolean().optional(),
    displayName: z.string().trim().min(1).max(120).optional(),
  })
  .refine(
    (c) => c.role !== undefined || c.disabled !== undefined || c.displayName !== undefined,
    "Say what to change: role, disabled or displayName.",
  );

export const PATCH = route(
  { access: "users.manage", params: z.object({ id: textParam() }), body: Change },
  async ({ user, body, params, ip }) =>
    Response.json({ user: await changeUser(user, params.id, body.version, body, ip) }),
);
