// Held–Karp against its C reference: npx tsx scripts/bench/held-karp.ts [--reps N]
// Same instances (scripts/bench/held-karp.c describes the generator), same packed DP; prints the
// fastest of N runs per row (default 3) in ms, the TS/C ratio, the table size and the machine load.
// Wall-clock on a shared machine: read the load figures beside the times. The one-thread rows also
// give CPU ms (process CPU time around the solve), which other processes on the machine disturb less.
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { heldKarp, heldKarpBytes, mulberry32, type CostMatrix } from "../../lib/routing";
import { setSplitHelper, splitHelper } from "../../lib/routing/held-karp-split";
import { startHeldKarpHelper, stopHeldKarpHelper } from "../../lib/workers/held-karp-threads";

const SIZES = [18, 20, 22];
const repsArg = process.argv.indexOf("--reps");
const REPS = repsArg > 0 ? Number(process.argv[repsArg + 1]) : 3;

/** The C program's instance: n = m + 2, cost 1 + floor(r · 99999) from mulberry32(seed), row by row. */
function instance(m: number, seed: number): CostMatrix {
  const n = m + 2;
  const rand = mulberry32(seed);
  const cost = new Int32Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) cost[i * n + j] = i === j ? 0 : 1 + Math.floor(rand() * 99999);
  return { n, cost };
}
const stopsOf = (m: number) => Array.from({ length: m }, (_, i) => i + 2);

function buildC(dir: string): string | null {
  const exe = path.join(dir, "held-karp");
  try {
    execFileSync("gcc", ["-O2", "-o", exe, path.join(import.meta.dirname, "held-karp.c"), "-lm"], { stdio: "pipe" });
    return exe;
  } catch (e) {
    console.log(`C reference skipped: gcc -O2 failed or is missing (${(e as Error).message.split("\n")[0]})`);
    return null;
  }
}

interface Run {
  ms: number;
  cpuMs: number;
  length: number;
}

function runC(exe: string, m: number): Run {
  const out = execFileSync(exe, [String(m), String(m)], { encoding: "utf8" })
    .trim()
    .split(" ")
    .map(Number);
  const [length, ms, cpuMs] = out as [number, number, number];
  return { ms, cpuMs, length };
}

function runTs(m: number): Run {
  const cm = instance(m, m);
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const r = heldKarp(cm, 0, 1, stopsOf(m));
  const ms = performance.now() - t0;
  const cpu = process.cpuUsage(c0);
  return { ms, cpuMs: (cpu.user + cpu.system) / 1000, length: r.length };
}

const load = () =>
  os
    .loadavg()
    .map((x) => x.toFixed(2))
    .join(" ");
const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x.toFixed(1));

async function main() {
  const dir = mkdtempSync(path.join(os.tmpdir(), "held-karp-"));
  const exe = buildC(dir);
  const helperUp = await startHeldKarpHelper();
  const helper = splitHelper();
  if (!helperUp) console.log(`two threads skipped: ${os.availableParallelism()} core(s) or the helper did not load`);
  // Warm both threads' compiled code before timing.
  runTs(18);
  setSplitHelper(null);
  runTs(16);
  console.log(`fastest of ${REPS}; load average (1, 5, 15 min) before: ${load()}`);
  console.log(
    "stops | table | TS 1 thread (CPU) | TS 2 threads | C -O2 (CPU) | TS 1 / C (CPU) | TS 2 / C | load (1 min)",
  );
  for (const m of SIZES) {
    const best = { one: Infinity, oneCpu: Infinity, two: Infinity, c: Infinity, cCpu: Infinity };
    const lengths = new Set<number>();
    for (let rep = 0; rep < REPS; rep++) {
      setSplitHelper(null);
      const one = runTs(m);
      best.one = Math.min(best.one, one.ms);
      best.oneCpu = Math.min(best.oneCpu, one.cpuMs);
      lengths.add(one.length);
      if (helperUp) {
        setSplitHelper(helper);
        const two = runTs(m);
        best.two = Math.min(best.two, two.ms);
        lengths.add(two.length);
      }
      if (exe) {
        const c = runC(exe, m);
        best.c = Math.min(best.c, c.ms);
        best.cCpu = Math.min(best.cCpu, c.cpuMs);
        lengths.add(c.length);
      }
    }
    if (lengths.size !== 1) throw new Error(`${m} stops: the runs disagree on the length (${[...lengths].join(", ")})`);
    const cell = (x: number) => (Number.isFinite(x) ? `${fmt(x)} ms` : "—");
    const ratio = (x: number, c = best.c) =>
      Number.isFinite(x) && Number.isFinite(c) ? `${(x / c).toFixed(2)}×` : "—";
    console.log(
      [
        m,
        `${(heldKarpBytes(m) / 2 ** 20).toFixed(0)} MiB`,
        `${cell(best.one)} (${cell(best.oneCpu)})`,
        cell(best.two),
        `${cell(best.c)} (${cell(best.cCpu)})`,
        `${ratio(best.one)} (${ratio(best.oneCpu, best.cCpu)})`,
        ratio(best.two),
        os.loadavg()[0]?.toFixed(2),
      ].join(" | "),
    );
  }
  console.log(`peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MiB; load average after: ${load()}`);
  await stopHeldKarpHelper();
  rmSync(dir, { recursive: true, force: true });
}

void main();
