// CPU time of the server processes, read from /proc, so that a run on a busy machine can still say
// how much work one request costs: the web server's main thread (where route handlers run; the wave
// planner works in other threads) and MariaDB.
import { readFileSync } from "node:fs";

// Linux reports utime and stime in clock ticks; USER_HZ is 100 on every common build.
const TICK_MS = 10;

function ticks(path: string): number | null {
  try {
    // The command name in parentheses may hold spaces: count fields after its closing parenthesis.
    const fields = readFileSync(path, "utf8").split(") ")[1]!.split(" ");
    return Number(fields[11]) + Number(fields[12]);
  } catch {
    return null;
  }
}

export type CpuSample = { nextMainMs: number | null; mariadbMs: number | null };

export function cpuSample(nextPid: number | undefined, mariadbPid: number | undefined): CpuSample {
  const main = nextPid ? ticks(`/proc/${nextPid}/task/${nextPid}/stat`) : null;
  const db = mariadbPid ? ticks(`/proc/${mariadbPid}/stat`) : null;
  return { nextMainMs: main === null ? null : main * TICK_MS, mariadbMs: db === null ? null : db * TICK_MS };
}

/** Milliseconds of CPU per request between two samples, as text ("–" when a process was not found). */
export function perRequest(a: CpuSample, b: CpuSample, requests: number): { nextMain: string; mariadb: string } {
  const f = (x: number | null, y: number | null) =>
    x === null || y === null || requests === 0 ? "–" : `${((y - x) / requests).toFixed(2)} ms`;
  return { nextMain: f(a.nextMainMs, b.nextMainMs), mariadb: f(a.mariadbMs, b.mariadbMs) };
}
