import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { createUser, DuplicateEmailError, listUsers } from "@/db/users";
import { audit } from "@/db/audit";
import { ROLES } from "@/lib/auth/permissions";
import { hashPassword, MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { newId } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

const NewUser = z.object({
  email: z.string().trim().max(254).email("Enter a valid e-mail address."),
  displayName: z.string().trim().min(1, "Enter the person's name.").max(120, "Keep the name under 120 characters."),
  role: z.enum(ROLES, { message: "Choose a role: admin, planner or picker." }),
  password: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters for the first password.`)
    .max(1024, "That password is too long."),
});

export const GET = route({ access: "users.manage" }, async ({ user }) => Response.json({ users: await listUsers(user.siteId) }));

export const POST = route({ access: "users.manage", body: NewUser }, async ({ user, body, ip }) => {
  try {
    const created = await createUser({
      id: newId(),
      siteId: user.siteId,
      email: body.email,
      displayName: body.displayName,
      role: body.role,
      passwordHash: await hashPassword(body.password),
    });
    await audit({ event: "user.created", actorUserId: user.id, subject: created.id, ip, detail: { email: created.email, role: created.role } });
    return Response.json({ user: created }, { status: 201 });
  } catch (e) {
    if (e instanceof DuplicateEmailError) throw new HttpError(409, `An account for ${body.email} already exists. Change that account's role instead.`);
    throw e;
  }
});
