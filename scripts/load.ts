// npm run load (scripts/load.sh starts the services and then this): 50 handhelds confirming picks
// while a planner plans a 1,000-order wave, then the check that the database holds exactly what the
// handhelds were told. Prints a results table; --write also puts it into docs/benchmarks.md. Exits
// non-zero when a target is missed: any error, p95 of confirmations at or over 150 ms, the plan not
// finishing, or the check finding a difference.
import { cpus, loadavg } from "node:os";
import { readFileSync, writeFileSync } from "node:fs";
import { closeDb } from "../db/knex";
import { pickLedger } from "../db/picking-ledger";
import { setMaxOpenBatchesPerPicker } from "../db/sites";
import { mulberry32 } from "../lib/routing/random";
import { api } from "./load/api";
import { drain, runPhase } from "./load/cannon";
import { checkLedger } from "./load/check";
import { cpuSample, perRequest } from "./load/cpu";
import { DEFAULT_MIX, Handheld, type Ledger } from "./load/handheld";
import { planDuringLoad, type PlanOutcome } from "./load/planner";
import { setUpLoad } from "./load/setup";
import { percentile, phaseRows, summarise, TABLE_HEAD, windowRow, type PhaseStats } from "./load/stats";

const HANDHELDS = 50;
const PLAN_ORDERS = 1000;
const P95_TARGET_MS = 150;
const SECTION = "## Load run: 50 handhelds and a 1,000-order wave";

const envNumber = (name: string, fallback: number) => {
  const v = process.env[name];
  if (v === undefined || v === "") return fallback;
  const n = Number(v);
  if (!Number.isFinite(n) || n < 0) throw new Error(`${name}=${v} is not a number of at least 0`);
  return n;
};

const log = (s: string) => console.log(`[load] ${s}`);

function machine(): string {
  const cpu = cpus()[0]?.model ?? "unknown CPU";
  return `${cpus().length} cores (nproc), ${cpu}, Node ${process.version}`;
}

const loads = () =>
  loadavg()
    .map((x) => x.toFixed(2))
    .join(" ");

async function main() {
  const origin = process.env.APP_URL;
  if (!origin) throw new Error("APP_URL is not set: run this through npm run load");
  const seconds = envNumber("LOAD_SECONDS", 60);
  const rate = envNumber("LOAD_RATE", 1);
  const saturationSeconds = envNumber("LOAD_SATURATION_SECONDS", 10);
  const write = process.argv.includes("--write");
  if (seconds < 1 || rate <= 0) throw new Error("LOAD_SECONDS must be at least 1 and LOAD_RATE above 0");

  // Lines each handheld needs: one per paced confirmation (less the resends and refusals, which use
  // none), plus a guess of what an unpaced handheld gets through; a handheld that runs dry idles on
  // "My batches", which the table shows.
  const linesPerHandheld = Math.ceil(rate * seconds * 0.95) + Math.ceil(saturationSeconds * 8) + 5;
  const a = api(origin);
  // Enough 30-line carts per handheld for its lines, past the site's everyday cap.
  await setMaxOpenBatchesPerPicker(Math.ceil(linesPerHandheld / 30) + 2);
  const t0 = performance.now();
  const setup = await setUpLoad(a, { handhelds: HANDHELDS, linesPerHandheld, planOrders: PLAN_ORDERS, log });
  const lines = setup.handhelds.reduce((n, h) => n + h.batches.reduce((m, b) => m + b.lines.length, 0), 0);
  log(
    `set-up took ${((performance.now() - t0) / 1000).toFixed(1)} s: ${HANDHELDS} handhelds hold ${setup.pickBatchIds.length} batches, ${lines} open lines`,
  );

  const ledger: Ledger = new Map();
  const rand = mulberry32(20261207);
  const handhelds = setup.handhelds.map((acct) => new Handheld(acct, rand, DEFAULT_MIX, ledger));

  const loadAtStart = loads();
  log(
    `paced run: ${HANDHELDS} handhelds at ${rate} requests/s each for ${seconds} s, the planner planning ${PLAN_ORDERS} orders at the same time (load average ${loadAtStart})`,
  );
  const pids = [Number(process.env.NEXT_PID) || undefined, Number(process.env.MDB_PID) || undefined] as const;
  const cpuAtStart = cpuSample(...pids);
  const planning = planDuringLoad(a, setup.plannerCookie, setup.planWave, {
    pollEveryMs: 1000,
    giveUpAfterMs: 10 * 60_000,
  });
  const paced = await runPhase(origin, handhelds, { seconds, ratePerHandheld: rate });
  const loadAtEnd = loads();
  const cpuPaced = perRequest(cpuAtStart, cpuSample(...pids), requestsOf(paced.stats));
  const pacedDrain = await drain(origin, handhelds);
  log(`paced run done; ${pacedDrain.sent} confirmations in flight at the end sent again; waiting for the plan`);
  const plan = await planning;
  log(`plan ${plan.status} after ${plan.seconds.toFixed(1)} s: ${plan.message}`);

  let saturation: { stats: PhaseStats; loadAtEnd: string; cpu: ReturnType<typeof perRequest> } | null = null;
  if (saturationSeconds > 0) {
    log(`unpaced run: ${HANDHELDS} handhelds as fast as the server answers for ${saturationSeconds} s`);
    const before = cpuSample(...pids);
    const r = await runPhase(origin, handhelds, { seconds: saturationSeconds });
    saturation = {
      stats: r.stats,
      loadAtEnd: loads(),
      cpu: perRequest(before, cpuSample(...pids), requestsOf(r.stats)),
    };
    const d = await drain(origin, handhelds);
    pacedDrain.bad.push(...d.bad);
    pacedDrain.sent += d.sent;
  }

  log("checking the database against what the handhelds were told");
  const stored = await pickLedger(setup.pickBatchIds);
  const check = checkLedger(ledger.values(), stored);
  const dry = handhelds.filter((h) => h.openLines() === 0).length;

  const confirmations = summarise(paced.stats.confirmations(), paced.stats.seconds, true);
  const misses: string[] = [];
  if (paced.stats.errors() > 0) misses.push(`${paced.stats.errors()} errors in the paced run`);
  if (saturation && saturation.stats.errors() > 0)
    misses.push(`${saturation.stats.errors()} errors in the unpaced run`);
  if (pacedDrain.bad.length) misses.push(`${pacedDrain.bad.length} wrong answers to requests sent again after a run`);
  if (!(confirmations.p95 < P95_TARGET_MS))
    misses.push(`p95 of confirmations ${confirmations.p95.toFixed(0)} ms, target under ${P95_TARGET_MS} ms`);
  if (plan.status !== "done") misses.push(`the wave plan ${plan.status}: ${plan.message}`);
  if (check.problems.length || check.unanswered)
    misses.push(`the check found ${check.problems.length} differences and ${check.unanswered} unanswered keys`);

  const out: string[] = [];
  out.push(SECTION, "");
  out.push(
    `Produced by \`npm run load -- --write\` (scripts/load.sh, scripts/load.ts): a production build (\`next build\`, \`next start\`) on 127.0.0.1 with its own MariaDB, autocannon ${autocannonVersion()} with one connection per handheld, each signed in as its own picker. Machine: ${machine()}; load average ${loadAtStart} at the start of the paced run, ${loadAtEnd} at its end${saturation ? `, ${saturation.loadAtEnd} after the unpaced run` : ""}.`,
    "",
  );
  out.push(
    `Set-up through the API: ${HANDHELDS} picker accounts; ${lines.toLocaleString("en")} open lines in ${setup.pickBatchIds.length} batches taken with "Take the next batch"; ${PLAN_ORDERS.toLocaleString("en")} invented orders (${setup.planWave.lines.toLocaleString("en")} lines) imported for the wave the planner plans ("savings", 6 totes, 30 lines, 150 kg) at the start of the paced run. Each handheld loads a batch's pick view before its first stop, then confirms line after line. Of its confirmations about ${pct(DEFAULT_MIX.repeat)} are sent again with the same key (an answer lost on flaky Wi-Fi), ${pct(DEFAULT_MIX.wrongScan)} of lines get a wrong scan first (refused with 422), ${pct(DEFAULT_MIX.doubleTap)} get a second tap with a new key (refused with 409), ${pct(DEFAULT_MIX.short)} are short picks. Errors are 5xx, timeouts, socket errors and any answer other than the expected one (a refusal where a success was due, a resent key answered differently).`,
    "",
  );
  out.push(
    `### Paced: ${rate} request${rate === 1 ? "" : "s"}/s per handheld for ${paced.stats.seconds} s, with the wave plan running`,
    "",
  );
  out.push(
    `A person confirms a line every 10–30 s; ${rate} per second per handheld is ${Math.round(rate * 10)}–${Math.round(rate * 30)} times that pace, ${(rate * HANDHELDS).toFixed(0)} requests/s offered in all. Each handheld sends at most one request per ${Math.round(1000 / rate)} ms window and waits for its answer, as a handheld does; the handhelds' windows are spread evenly, not in lockstep.`,
    "",
  );
  out.push(...TABLE_HEAD, ...phaseRows(paced.stats));
  out.push(
    windowRow(
      "all confirmations while the plan ran",
      paced.stats,
      plan.startedAt,
      Math.min(plan.finishedAt, paced.stats.endedAt),
    ),
  );
  out.push(windowRow("all confirmations after the plan finished", paced.stats, plan.finishedAt, paced.stats.endedAt));
  out.push(`| planner: POST plan | 1 | | ${plan.startMs.toFixed(0)} ms | | | | | | |`);
  if (plan.pollMs.length) {
    const s = [...plan.pollMs].sort((x, y) => x - y);
    out.push(
      `| planner: GET job (every 1 s) | ${s.length} | | ${percentile(s, 50).toFixed(1)} ms | ${percentile(s, 95).toFixed(1)} ms | ${percentile(s, 99).toFixed(1)} ms | ${s.at(-1)!.toFixed(1)} ms | ${s.length} | 0 | 0 |`,
    );
  }
  out.push("");
  out.push(
    `Timeouts ${paced.stats.timeouts}, socket errors ${paced.stats.socketErrors}. CPU per handheld request: web server main thread ${cpuPaced.nextMain}, MariaDB ${cpuPaced.mariadb} (the planner's worker threads not counted). Wave plan of ${PLAN_ORDERS.toLocaleString("en")} orders: **${plan.status}** in ${plan.seconds.toFixed(1)} s (${plan.message}).`,
    "",
  );
  if (saturation) {
    out.push(`### Unpaced: as fast as the server answers, ${saturation.stats.seconds} s, after the plan`, "");
    out.push(
      "Each handheld sends its next request as soon as the last is answered: the most this machine confirms.",
      "",
    );
    out.push(...TABLE_HEAD, ...phaseRows(saturation.stats), "");
    out.push(
      `Timeouts ${saturation.stats.timeouts}, socket errors ${saturation.stats.socketErrors}. CPU per request: web server main thread ${saturation.cpu.nextMain}, MariaDB ${saturation.cpu.mariadb}. ${dry} of ${HANDHELDS} handhelds ran out of lines by the end.`,
      "",
    );
  }
  out.push("### The check in the database", "");
  out.push(
    `${check.acknowledged.toLocaleString("en")} acknowledged confirmation keys, ${check.refused.toLocaleString("en")} refused, ${check.unanswered} never answered; ${pacedDrain.sent} requests in flight when a run stopped were sent again afterwards. ${check.problems.length === 0 && check.unanswered === 0 ? "**Passed**: every acknowledged key is stored once, as a success for its line, with that line holding its quantity; no refused key changed a line; every line picked or short has exactly one stored success; the units picked add up to the units acknowledged." : `**Failed**: ${check.problems.join("; ")}`}`,
    "",
  );
  out.push(
    "What shapes these figures: a confirmation is one transaction that locks only its batch row and its line (an earlier locking read over the line, its order line and its item locked the item row, so pickers of one SKU on different batches queued behind each other), and a pick view counts only its own batch (it used to count every batch of the wave). What is left is the web server's main thread: the CPU per request above is mostly the framework and the database round trips, about ten per confirmation; the unpaced table shows that ceiling.",
    "",
  );
  out.push(
    misses.length
      ? `Targets missed: ${misses.join("; ")}.`
      : `Targets met: zero errors, p95 of confirmations under ${P95_TARGET_MS} ms, the wave plan finished, the check passed.`,
    "",
  );

  console.log("\n" + out.join("\n"));
  for (const p of [...paced.stats.problems, ...(saturation?.stats.problems ?? []), ...pacedDrain.bad].slice(0, 20))
    console.log(`[load] problem: ${p}`);
  if (write) {
    writeSection("docs/benchmarks.md", out.join("\n"));
    log("wrote the results into docs/benchmarks.md");
  }
  if (misses.length) {
    log(`target missed: ${misses.join("; ")}`);
    process.exitCode = 1;
  }
}

/** Every handheld request a phase got an answer to. */
const requestsOf = (p: PhaseStats) => [...p.kinds.values()].reduce((n, k) => n + k.latencies.length, 0);

const pct = (x: number) => `${Math.round(x * 100)} %`;

function autocannonVersion(): string {
  return (JSON.parse(readFileSync("node_modules/autocannon/package.json", "utf8")) as { version: string }).version;
}

/** Replaces this run's section of the benchmarks page (or appends it), keeping every other section. */
function writeSection(path: string, section: string) {
  const text = readFileSync(path, "utf8");
  const start = text.indexOf(SECTION);
  if (start < 0) {
    writeFileSync(path, text.trimEnd() + "\n\n" + section.trimEnd() + "\n");
    return;
  }
  const rest = text.slice(start + SECTION.length);
  const next = rest.search(/\n## /);
  const after = next < 0 ? "" : rest.slice(next + 1);
  writeFileSync(path, text.slice(0, start) + section.trimEnd() + "\n" + (after ? "\n" + after : ""));
}

main()
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
