import { z } from "zod";
import { route } from "@/lib/http/route";
import { lucia } from "@/lib/auth/lucia";
import { signIn } from "@/lib/auth/sign-in";
import { endSession } from "@/lib/auth/session";
import { audit } from "@/db/audit";
import { ROLE_HOME } from "@/lib/auth/permissions";
import { safeNextPath } from "@/lib/http/next-path";

const SignIn = z.object({
  email: z.string().trim().min(3, "Enter your e-mail address.").max(254).email("Enter a valid e-mail address."),
  password: z.string().min(1, "Enter your password.").max(1024, "That password is too long."),
  next: z.string().max(512).optional(),
});

export const GET = route({ access: "signed-in" }, async ({ user }) => Response.json({ user }));

export const POST = route({ access: "public", body: SignIn }, async ({ body, ip }) => {
  const result = await signIn(body.email, body.password, ip);
  const cookie = lucia().createSessionCookie(result.sessionId);
  const res = Response.json({ home: safeNextPath(body.next) ?? ROLE_HOME[result.role] });
  res.headers.append("Set-Cookie", cookie.serialize());
  return res;
});

export const DELETE = route({ access: "signed-in" }, async ({ user, sessionId, ip }) => {
  if (sessionId) await endSession(sessionId);
  await audit({ event: "sign_out", actorUserId: user.id, subject: user.email, ip });
  const res = Response.json({ signedOut: true });
  res.headers.append("Set-Cookie", lucia().createBlankSessionCookie().serialize());
  return res;
});
