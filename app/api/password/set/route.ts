import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { hashPassword, MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { setPasswordWithToken } from "@/db/tokens";
import { audit } from "@/db/audit";
import { LINK_DEAD } from "@/lib/mail/answers";

export const dynamic = "force-dynamic";

const Body = z.object({
  token: z.string().max(200),
  password: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
    .max(1024, "That password is too long."),
});

// Unknown, used and expired links (and disabled accounts) all get the same answer: no oracle.
export const POST = route({ access: "public", body: Body }, async ({ body, ip }) => {
  const done = await setPasswordWithToken(body.token, await hashPassword(body.password));
  if (!done) {
    await audit({ event: "password.set_refused", ip });
    throw new HttpError(400, LINK_DEAD);
  }
  await audit({ event: "password.set", actorUserId: done.userId, subject: done.email, ip, detail: { via: done.purpose } });
  return Response.json({ ok: true, message: "Your password is set. Sign in with it now.", email: done.email });
});
