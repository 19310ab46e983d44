import "server-only";
import { audit } from "@/db/audit";
import { findUserForSignIn, normaliseEmail, recordSignIn } from "@/db/users";
import { dummyPasswordHash, verifyPassword } from "./password";
import { BUSY_RETRY_MS, signInLimits, takeAttempt, THROTTLE_WINDOW_MS, tryAgainAt } from "./throttle";
import { startSession } from "./session";
import type { Role } from "./permissions";
import { HttpError } from "@/lib/http/errors";

export type SignedIn = { sessionId: string; role: Role };

const WRONG = "That e-mail address and password do not match an active account. Check both and try again.";
const BUSY =
  "Many sign-ins are being checked for this account or from this place right now. Try again in a few seconds.";

/**
 * Every attempt is counted before its password is checked and taken back only when it was right, so
 * attempts sent in parallel cannot all pass under the cap. Real and unknown accounts go the same way
 * until the password check, which costs the same for both (a dummy hash for an unknown one). A refusal
 * is a 401, or a 429 saying when to try again (`retryAt`).
 */
export async function signIn(emailInput: string, password: string, ip: string, now = new Date()): Promise<SignedIn> {
  const email = normaliseEmail(emailInput);
  const attempt = await takeAttempt(signInLimits(email, ip), THROTTLE_WINDOW_MS, now);
  if (!attempt.ok && attempt.busy) {
    await audit({ event: "sign_in.throttled", subject: email, ip, detail: { busy: true } });
    throw new HttpError(429, BUSY, { retryAt: new Date(now.getTime() + BUSY_RETRY_MS).toISOString() });
  }
  if (!attempt.ok) {
    await audit({ event: "sign_in.throttled", subject: email, ip, detail: { until: attempt.until.toISOString() } });
    throw new HttpError(
      429,
      `Too many failed sign-ins. ${tryAgainAt(attempt.until, now)}, or ask your site's layout admin to check your account.`,
      {
        retryAt: attempt.until.toISOString(),
      },
    );
  }
  const user = await findUserForSignIn(email);
  const passwordOk = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), password);
  if (!user || !user.passwordHash || !passwordOk || user.disabled) {
    await attempt.keep();
    await audit({
      event: "sign_in.failure",
      subject: email,
      ip,
      detail: { reason: !user ? "unknown account" : user.disabled ? "disabled" : "wrong password" },
    });
    throw new HttpError(401, WRONG);
  }
  await attempt.release();
  const session = await startSession(user.id, now);
  await recordSignIn(user.id, now);
  await audit({ event: "sign_in.success", actorUserId: user.id, subject: email, ip });
  return { sessionId: session.id, role: user.role };
}
