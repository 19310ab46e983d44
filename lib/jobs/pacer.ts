/** How often a running job writes its progress to the database at most. */
export const PROGRESS_INTERVAL_MS = 500;

export type Progress = { fraction: number; message?: string };

/**
 * Work reports progress many times a second (a worker sends each whole percent); the database gets
 * at most one write per interval. The latest report is never lost: one that arrives inside the
 * interval is written when the interval ends. A write that finds the job no longer running (`write`
 * answers false: cancelled, possibly by another process) calls `ended`, which stops the work.
 */
export function progressPacer(
  write: (p: Progress) => Promise<boolean>,
  ended: () => void,
  intervalMs = PROGRESS_INTERVAL_MS,
) {
  let last = -Infinity;
  let pending: Progress | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let stopped = false;

  const flush = () => {
    timer = null;
    if (!pending || stopped) return;
    const p = pending;
    pending = null;
    last = Date.now();
    // A failed write (the database busy for a moment) only costs one progress step.
    void write(p).then(
      (running) => running || stopped || ended(),
      () => undefined,
    );
  };

  return {
    report(fraction: number, message?: string): void {
      if (stopped) return;
      pending = { fraction, message: message ?? pending?.message };
      if (timer) return;
      const wait = last + intervalMs - Date.now();
      if (wait <= 0) flush();
      else timer = setTimeout(flush, wait);
    },
    /** No more writes: the job is finishing or has ended. */
    stop(): void {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      pending = null;
    },
  };
}
