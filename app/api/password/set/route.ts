import { z } from "zod";
import { route } from "@/lib/http/route";
import { fieldsNeedAttention, HttpError } from "@/lib/http/errors";
import { hashPassword, MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { passwordProblem } from "@/lib/auth/password-strength";
import { peekToken, setPasswordWithToken } from "@/db/tokens";
import { findUserForSignIn } from "@/db/users";
import { audit } from "@/db/audit";
import { LINK_DEAD } from "@/lib/mail/answers";

const Body = z.object({
  token: z.string().max(200),
  password: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
    .max(1024, "That password is too long."),
});

// Unknown, used and expired links (and disabled accounts) all get the same answer: no oracle.
export const POST = route({ access: "public", body: Body }, async ({ body, ip }) => {
  // A live link is checked for whom it is, so the password can be weighed against their address and
  // name; a dead one falls through to the one answer below, whatever the password.
  const found = await peekToken(body.token);
  if (found) {
    const person = await findUserForSignIn(found.email);
    const problem = passwordProblem(body.password, { email: found.email, name: person?.displayName });
    if (problem) throw fieldsNeedAttention([{ path: "password", message: problem }]);
  }
  const done = await setPasswordWithToken(body.token, await hashPassword(body.password));
  if (!done) {
    await audit({ event: "password.set_refused", ip });
    throw new HttpError(400, LINK_DEAD);
  }
  await audit({
    event: "password.set",
    actorUserId: done.userId,
    subject: done.email,
    ip,
    detail: { via: done.purpose },
  });
  return Response.json({ ok: true, message: "Your password is set. Sign in with it now.", email: done.email });
});
