import "server-only";
import { countAttempt, keepAttempt, uncountAttempt, type Count } from "@/db/throttle";
import { formatTime } from "@/lib/format/dates";

export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_ACCOUNT = 10;
// A shared handheld pool sits behind one address, so the per-address cap is looser than per account.
export const MAX_FAILURES_PER_IP = 50;

/** One cap: at most `max` attempts counted for `subject` (an e-mail address, a client address) per window. */
export type Limit = { scope: string; subject: string; max: number };

/**
 * An attempt that may go ahead, to be kept (it counts for the rest of the window) or released (it
 * does not count after all); or a refusal. A refusal is `busy` when the cap is full only of attempts
 * still being checked, which settle within moments: a shift's handhelds signing in at once behind one
 * address should be told to try again in a few seconds, not in a quarter of an hour.
 */
export type Taken =
  | { ok: true; keep: () => Promise<void>; release: () => Promise<void> }
  | { ok: false; busy: false; until: Date }
  | { ok: false; busy: true };

/** How long a busy refusal asks a person to wait: attempts in flight settle well within it. */
export const BUSY_RETRY_MS = 5_000;

/**
 * Counts an attempt against every limit before any work is done for it, so the limit holds however
 * many attempts arrive at once. Refused (and not counted) when any limit is full; `until` is when the
 * window that refused it ends. Limits are taken in order and the first refusal stops there, so
 * attempts an account's cap turns away do not eat into the address's allowance.
 */
export async function takeAttempt(limits: Limit[], windowMs: number, now = new Date()): Promise<Taken> {
  const taken: Array<Limit & Count> = [];
  const release = async () => {
    await Promise.all(taken.map((t) => uncountAttempt(t.scope, t.subject, t.windowStart)));
  };
  const keep = async () => {
    await Promise.all(taken.map((t) => keepAttempt(t.scope, t.subject, t.windowStart)));
  };
  for (const limit of limits) {
    const count = await countAttempt(limit.scope, limit.subject, windowMs, now);
    taken.push({ ...limit, ...count });
    if (count.n > limit.max) {
      await release();
      return count.kept < limit.max
        ? { ok: false, busy: true }
        : { ok: false, busy: false, until: new Date(count.windowStart.getTime() + windowMs) };
    }
  }
  return { ok: true, keep, release };
}

/** The sign-in caps for this account and client address. */
export const signInLimits = (email: string, ip: string): Limit[] => [
  { scope: "sign_in:account", subject: email, max: MAX_FAILURES_PER_ACCOUNT },
  { scope: "sign_in:address", subject: ip, max: MAX_FAILURES_PER_IP },
];

/** "09:05" in a zone, on the 24-hour clock: through the one formatter. */
export function formatClock(at: Date, timeZone: string): string {
  return formatTime(at, { timeZone, dateOrder: "dmy", clock: "24h" });
}

/**
 * When to come back, in the same words for every account, real or not: a site's own time zone
 * would tell a stranger that the address belongs to someone.
 */
export function tryAgainAt(until: Date, now = new Date()): string {
  const minutes = Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 60_000));
  return `Try again at ${formatClock(until, "UTC")} UTC (in ${minutes} minute${minutes === 1 ? "" : "s"})`;
}
