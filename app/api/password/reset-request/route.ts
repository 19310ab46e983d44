import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { findUserForSignIn, normaliseEmail } from "@/db/users";
import { issueResetToken } from "@/db/tokens";
import { audit } from "@/db/audit";
import { resetThrottledUntil } from "@/lib/mail/reset-throttle";
import { resetMail, setPasswordLink } from "@/lib/mail/messages";
import { appOrigin } from "@/lib/mail/config";
import { RESET_ANSWER } from "@/lib/mail/answers";

export const dynamic = "force-dynamic";

const Body = z.object({ email: z.string().trim().max(254).email("Enter a valid e-mail address.") });

// The same answer whether or not the account exists, so the form cannot be used to find accounts.
export const POST = route({ access: "public", body: Body }, async ({ body, ip }) => {
  const email = normaliseEmail(body.email);
  const until = await resetThrottledUntil(email, ip);
  if (until) {
    await audit({ event: "password.reset_throttled", subject: email, ip });
    throw new HttpError(429, "Too many reset requests for now. Wait a few minutes and try again, or ask your site's layout admin.", {
      retryAt: until.toISOString(),
    });
  }
  await audit({ event: "password.reset_requested", subject: email, ip });
  const user = await findUserForSignIn(email);
  if (user && !user.disabled) {
    await issueResetToken(user.id, (token) => resetMail({ to: user.email, name: user.displayName, link: setPasswordLink(appOrigin(), token) }));
  }
  return Response.json({ ok: true, message: RESET_ANSWER });
});
