import { after } from "next/server";
import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { findUserForSignIn, normaliseEmail } from "@/db/users";
import { issueResetToken } from "@/db/tokens";
import { audit } from "@/db/audit";
import { BUSY_RETRY_MS, takeAttempt } from "@/lib/auth/throttle";
import { RESET_WINDOW_MS, resetLimits } from "@/lib/mail/reset-throttle";
import { resetMail, setPasswordLink } from "@/lib/mail/messages";
import { appOrigin } from "@/lib/mail/config";
import { RESET_ANSWER } from "@/lib/mail/answers";

const Body = z.object({ email: z.string().trim().max(254).email("Enter a valid e-mail address.") });

async function mailResetLink(email: string): Promise<void> {
  try {
    const user = await findUserForSignIn(email);
    if (!user || user.disabled) return;
    await issueResetToken(user.id, (token) =>
      resetMail({ to: user.email, name: user.displayName, link: setPasswordLink(appOrigin(), token) }),
    );
  } catch (e) {
    console.error("could not queue a password reset mail:", (e as Error).message);
  }
}

// The same answer, in the same time, whether or not the account exists, so the form cannot be used to
// find accounts: both are counted alike before the answer, and the account is looked up and mailed
// only after the answer has gone.
export const POST = route({ access: "public", body: Body }, async ({ body, ip }) => {
  const email = normaliseEmail(body.email);
  const attempt = await takeAttempt(resetLimits(email, ip), RESET_WINDOW_MS);
  if (!attempt.ok) {
    await audit({ event: "password.reset_throttled", subject: email, ip });
    if (attempt.busy) {
      throw new HttpError(429, "Many reset requests are arriving at once. Try again in a few seconds.", {
        retryAt: new Date(Date.now() + BUSY_RETRY_MS).toISOString(),
      });
    }
    throw new HttpError(
      429,
      "Too many reset requests for now. Wait a few minutes and try again, or ask your site's layout admin.",
      {
        retryAt: attempt.until.toISOString(),
      },
    );
  }
  await attempt.keep();
  await audit({ event: "password.reset_requested", subject: email, ip });
  after(() => mailResetLink(email));
  return Response.json({ ok: true, message: RESET_ANSWER });
});
