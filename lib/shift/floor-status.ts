// Pure rules of the floor page, shared by the server (which answers) and its tests.
import type { FloorStatus } from "@/lib/contracts/shift";

/**
 * Where a batch out on the floor is: picked to the end, waiting for a picker (a half-picked one given
 * or taken back too: what it needs is someone to continue it), being picked, or held and not begun.
 */
export function floorStatusOf(b: { status: string; pickerId: string | null; doneLines: number }): FloorStatus {
  if (b.status === "done") return "done";
  if (!b.pickerId) return "waiting";
  return b.status === "picking" || b.doneLines > 0 ? "in progress" : "taken";
}

/**
 * Actual picking time: first confirmed line to the last (or to now while it runs). A batch is late once
 * that is past its estimate: the supervisor looks at it while it can still be helped.
 */
export function actualTime(
  b: { startedAt: string | null; finishedAt: string | null },
  estimateSeconds: number,
  now: Date,
): { actualSeconds: number | null; late: boolean } {
  if (!b.startedAt) return { actualSeconds: null, late: false };
  const end = b.finishedAt ? new Date(b.finishedAt) : now;
  const actualSeconds = Math.max(0, Math.round((end.getTime() - new Date(b.startedAt).getTime()) / 1000));
  return { actualSeconds, late: actualSeconds > estimateSeconds };
}

/** Idle since the latest of: the last batch they finished, the last one taken away from them, signing in. */
export function idleSince(p: {
  openBatches: number;
  lastFinishedAt: string | null;
  lastLostAt: string | null;
  lastSignInAt: string | null;
}): string | null {
  if (p.openBatches > 0) return null;
  const times = [p.lastFinishedAt, p.lastLostAt, p.lastSignInAt].filter((t): t is string => t !== null);
  return times.length ? times.reduce((a, b) => (new Date(a) > new Date(b) ? a : b)) : null;
}
