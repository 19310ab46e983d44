import "server-only";
import { audit } from "@/db/audit";
import { findUserForSignIn, normaliseEmail, recordSignIn } from "@/db/users";
import { getSite } from "@/db/sites";
import { dummyPasswordHash, verifyPassword } from "./password";
import { formatClock, throttledUntil } from "./throttle";
import { startSession } from "./session";
import type { Role } from "./permissions";

export type SignInResult =
  | { ok: true; sessionId: string; role: Role }
  | { ok: false; status: 401 | 429; message: string; retryAt?: string };

const WRONG = "That e-mail address and password do not match an active account. Check both and try again.";

export async function signIn(emailInput: string, password: string, ip: string, now = new Date()): Promise<SignInResult> {
  const email = normaliseEmail(emailInput);
  const until = await throttledUntil(email, ip, now);
  if (until) {
    const user = await findUserForSignIn(email);
    const site = user ? await getSite(user.siteId) : null;
    const zone = site?.timezone ?? "UTC";
    await audit({ event: "sign_in.throttled", subject: email, ip, detail: { until: until.toISOString() } });
    return {
      ok: false,
      status: 429,
      retryAt: until.toISOString(),
      message: `Too many failed sign-ins. Try again at ${formatClock(until, zone)}${zone === "UTC" ? " UTC" : ""}, or ask an admin to check your account.`,
    };
  }
  const user = await findUserForSignIn(email);
  const passwordOk = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), password);
  if (!user || !user.passwordHash || !passwordOk || user.disabled) {
    await audit({ event: "sign_in.failure", subject: email, ip, detail: { reason: !user ? "unknown account" : user.disabled ? "disabled" : "wrong password" } });
    return { ok: false, status: 401, message: WRONG };
  }
  const session = await startSession(user.id, now);
  await recordSignIn(user.id, now);
  await audit({ event: "sign_in.success", actorUserId: user.id, subject: email, ip });
  return { ok: true, sessionId: session.id, role: user.role };
}
