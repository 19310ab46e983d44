import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { createUser, DuplicateEmailError, listUsers } from "@/db/users";
import { createInvitedUser } from "@/db/tokens";
import { getSite } from "@/db/sites";
import { audit } from "@/db/audit";
import { ROLES } from "@/lib/auth/permissions";
import { hashPassword, MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { passwordProblem } from "@/lib/auth/password-strength";
import { newId } from "@/lib/auth/session";
import { hasControlCharacters, isValidAddress } from "@/lib/mail/headers";
import { invitationMail, setPasswordLink } from "@/lib/mail/messages";
import { appOrigin } from "@/lib/mail/config";

export const dynamic = "force-dynamic";

const NewUser = z.object({
  email: z
    .string()
    .trim()
    .max(254)
    .email("Enter a valid e-mail address.")
    // The address also goes into mail headers: plain local@domain only.
    .refine((e) => isValidAddress(e.toLowerCase()), "Enter a plain e-mail address like name@example.com."),
  displayName: z
    .string()
    .trim()
    .min(1, "Enter the person's name.")
    .max(120, "Keep the name under 120 characters.")
    // The name goes into the To: header of the invitation; a line break there would add headers.
    .refine((n) => !hasControlCharacters(n), "The name may not contain line breaks or control characters."),
  role: z.enum(ROLES, { message: "Choose a role: admin, planner or picker." }),
  // Without a password the person gets an invitation mail and chooses one themselves.
  password: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters for the first password.`)
    .max(1024, "That password is too long.")
    .optional(),
});

export const GET = route({ access: "users.manage" }, async ({ user }) => Response.json({ users: await listUsers(user.siteId) }));

export const POST = route({ access: "users.manage", body: NewUser }, async ({ user, body, ip }) => {
  const problem = body.password === undefined ? null : passwordProblem(body.password, { email: body.email, name: body.displayName });
  if (problem) throw new HttpError(400, "Some fields need attention.", { issues: [{ path: "password", message: problem }] });
  try {
    const id = newId();
    if (body.password === undefined) {
      const site = await getSite(user.siteId);
      const created = await createInvitedUser({ id, siteId: user.siteId, email: body.email, displayName: body.displayName, role: body.role }, (token) =>
        invitationMail({
          to: body.email.toLowerCase(),
          name: body.displayName,
          siteName: site?.name ?? "your site",
          invitedBy: user.displayName,
          link: setPasswordLink(appOrigin(), token),
        }),
      );
      await audit({ event: "user.invited", actorUserId: user.id, subject: created.id, ip, detail: { email: created.email, role: created.role } });
      return Response.json({ user: created, invited: true }, { status: 201 });
    }
    const created = await createUser({
      id,
      siteId: user.siteId,
      email: body.email,
      displayName: body.displayName,
      role: body.role,
      passwordHash: await hashPassword(body.password),
    });
    await audit({ event: "user.created", actorUserId: user.id, subject: created.id, ip, detail: { email: created.email, role: created.role } });
    return Response.json({ user: created, invited: false }, { status: 201 });
  } catch (e) {
    if (e instanceof DuplicateEmailError) throw new HttpError(409, `An account for ${body.email} already exists. Change that account's role instead.`);
    throw e;
  }
});
