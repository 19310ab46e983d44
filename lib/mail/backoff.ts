// When a failed send is tried again: 10 s, 20 s, 40 s … capped at 5 minutes; after MAX_ATTEMPTS the
// message is marked failed with its last error (shown on /admin/mail) instead of being tried forever.
export const MAX_ATTEMPTS = 8;
export const FIRST_RETRY_MS = 10_000;
export const MAX_RETRY_MS = 5 * 60_000;

/** Delay before the next try after `attempts` failed tries (attempts ≥ 1). */
export function retryDelayMs(attempts: number): number {
  const n = Math.max(1, Math.floor(attempts));
  return Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** (n - 1));
}

/** Where a row goes after its `attempts`-th failed try: another try at a time, or given up. */
export function afterFailure(
  attempts: number,
  now: Date,
): { status: "pending"; nextAttemptAt: Date } | { status: "failed" } {
  if (attempts >= MAX_ATTEMPTS) return { status: "failed" };
  return { status: "pending", nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) };
}
