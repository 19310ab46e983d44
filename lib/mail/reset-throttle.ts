import "server-only";
import { recentResetRequests } from "@/db/tokens";

// Counted like sign-in failures (lib/auth/throttle.ts), from the audit log: each request is one entry.
export const RESET_WINDOW_MS = 15 * 60 * 1000;
export const MAX_RESETS_PER_ACCOUNT = 5;
// A shared handheld pool sits behind one address, so the per-address cap is looser.
export const MAX_RESETS_PER_IP = 30;

export async function resetThrottledUntil(email: string, ip: string, now = new Date()): Promise<Date | null> {
  const since = new Date(now.getTime() - RESET_WINDOW_MS);
  const [byAccount, byIp] = await Promise.all([recentResetRequests("subject", email, since), recentResetRequests("ip", ip, since)]);
  const until = (times: Date[], max: number) => {
    if (times.length < max) return null;
    const pivot = times[times.length - max];
    return pivot ? new Date(pivot.getTime() + RESET_WINDOW_MS) : null;
  };
  const times = [until(byAccount, MAX_RESETS_PER_ACCOUNT), until(byIp, MAX_RESETS_PER_IP)].filter((d): d is Date => d !== null);
  return times.length ? new Date(Math.max(...times.map((d) => d.getTime()))) : null;
}
