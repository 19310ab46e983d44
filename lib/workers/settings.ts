// Limits of the wave planning worker, from the environment (README, "Settings"). A value that is not a
// positive number is ignored with a warning rather than stopping the server over a typo.

function positive(name: string): number | undefined {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === "") return undefined;
  const n = Number(raw);
  if (Number.isFinite(n) && n > 0) return n;
  console.warn(`${name}=${JSON.stringify(raw)} is not a positive number; using the default`);
  return undefined;
}

/** A 1,000-order wave plans in seconds (npm run bench); ten minutes means something is wrong. */
export const DEFAULT_WAVE_TIME_LIMIT_MS = 10 * 60 * 1000;

/** WAVE_PLAN_TIME_LIMIT_MS: how long one wave plan may run before it is stopped and marked failed. */
export function waveTimeLimitMs(): number {
  return Math.round(positive("WAVE_PLAN_TIME_LIMIT_MS") ?? DEFAULT_WAVE_TIME_LIMIT_MS);
}

/**
 * WAVE_WORKER_MAX_HEAP_MB: the planning worker's heap cap. A plan that needs more ends as a failed job
 * instead of taking the web server's memory with it. Unset: Node's default for a worker.
 */
export function waveWorkerMaxHeapMb(): number | undefined {
  const n = positive("WAVE_WORKER_MAX_HEAP_MB");
  return n === undefined ? undefined : Math.max(1, Math.round(n));
}
