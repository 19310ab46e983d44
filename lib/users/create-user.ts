import "server-only";
import { createUser, DuplicateEmailError } from "@/db/users";
import type { Role, UserDTO } from "@/lib/contracts/users";
import { createInvitedUser } from "@/db/tokens";
import { getSite } from "@/db/sites";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import { hashPassword } from "@/lib/auth/password";
import { passwordProblem } from "@/lib/auth/password-strength";
import { newId } from "@/lib/auth/session";
import { fieldsNeedAttention, HttpError } from "@/lib/http/errors";
import { invitationMail, setPasswordLink } from "@/lib/mail/messages";
import { appOrigin } from "@/lib/mail/config";

export type NewUser = { email: string; displayName: string; role: Role; password?: string };

/**
 * An admin adds someone to their site: with a first password, or without one, in which case the person
 * gets an invitation mail and chooses it themselves.
 */
export async function addUser(
  admin: SignedInUser,
  input: NewUser,
  ip: string,
): Promise<{ user: UserDTO; invited: boolean }> {
  const problem =
    input.password === undefined
      ? null
      : passwordProblem(input.password, { email: input.email, name: input.displayName });
  if (problem) throw fieldsNeedAttention([{ path: "password", message: problem }]);
  try {
    const id = newId();
    const person = { id, siteId: admin.siteId, email: input.email, displayName: input.displayName, role: input.role };
    if (input.password === undefined) {
      const site = await getSite(admin.siteId);
      const created = await createInvitedUser(person, (token) =>
        invitationMail({
          to: input.email.toLowerCase(),
          name: input.displayName,
          siteName: site?.name ?? "your site",
          invitedBy: admin.displayName,
          link: setPasswordLink(appOrigin(), token),
        }),
      );
      await audit({
        event: "user.invited",
        actorUserId: admin.id,
        subject: created.id,
        ip,
        detail: { email: created.email, role: created.role },
      });
      return { user: created, invited: true };
    }
    const created = await createUser({ ...person, passwordHash: await hashPassword(input.password) });
    await audit({
      event: "user.created",
      actorUserId: admin.id,
      subject: created.id,
      ip,
      detail: { email: created.email, role: created.role },
    });
    return { user: created, invited: false };
  } catch (e) {
    if (e instanceof DuplicateEmailError)
      throw new HttpError(409, `An account for ${input.email} already exists. Change that account's role instead.`);
    throw e;
  }
}
