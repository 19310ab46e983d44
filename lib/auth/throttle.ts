import "server-only";
import { recentFailures } from "@/db/audit";

export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_ACCOUNT = 10;
// A shared handheld pool sits behind one address, so the per-address cap is looser than per account.
export const MAX_FAILURES_PER_IP = 50;

/** When the next attempt is allowed, or null if it is allowed now. */
export async function throttledUntil(email: string, ip: string, now = new Date()): Promise<Date | null> {
  const since = new Date(now.getTime() - THROTTLE_WINDOW_MS);
  const [byAccount, byIp] = await Promise.all([recentFailures("subject", email, since), recentFailures("ip", ip, since)]);
  const until = (failures: Date[], max: number) => {
    if (failures.length < max) return null;
    // The attempt opens again when enough of the oldest failures have left the window.
    const pivot = failures[failures.length - max];
    return pivot ? new Date(pivot.getTime() + THROTTLE_WINDOW_MS) : null;
  };
  const times = [until(byAccount, MAX_FAILURES_PER_ACCOUNT), until(byIp, MAX_FAILURES_PER_IP)].filter((d): d is Date => d !== null);
  if (times.length === 0) return null;
  return new Date(Math.max(...times.map((d) => d.getTime())));
}

export function formatClock(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", hour12: false, timeZone }).format(at);
}
