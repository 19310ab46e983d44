import "server-only";
import type { Limit } from "@/lib/auth/throttle";

// Counted like sign-in attempts (lib/auth/throttle.ts), before the answer: each accepted request is one.
export const RESET_WINDOW_MS = 15 * 60 * 1000;
export const MAX_RESETS_PER_ACCOUNT = 5;
// A shared handheld pool sits behind one address, so the per-address cap is looser.
export const MAX_RESETS_PER_IP = 30;

/** The reset-mail caps for this e-mail address (an account or not: both are counted alike) and client address. */
export const resetLimits = (email: string, ip: string): Limit[] => [
  { scope: "reset:account", subject: email, max: MAX_RESETS_PER_ACCOUNT },
  { scope: "reset:address", subject: ip, max: MAX_RESETS_PER_IP },
];
