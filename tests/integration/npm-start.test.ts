import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { rmSync } from "node:fs";
import path from "node:path";
import { DEMO_ACCOUNTS } from "@/db/seeds/demo/accounts";
import {
  freePort,
  npmStart,
  portAnswers,
  processesOf,
  startFileExists,
  START_DIR,
  stillRunning,
  until,
  type NpmStart,
  type Ports,
  type Proc,
} from "../support/npm-start";

// `npm start` for real, stopped the ways a person or a service manager stops it. npm itself passes
// only some signals on, and only to its direct child, so each way must end with the web server, the
// mail sink and MariaDB stopped cleanly, no process left, no lock held: the next start must work.
// And while it runs, a MariaDB that dies is started again and the same app recovers by itself.

let ports: Ports;
let running: NpmStart | null = null;
const seen: Proc[] = [];
let starts = 0;

beforeAll(async () => {
  rmSync(START_DIR, { recursive: true, force: true });
  const app = Number(process.env.TEST_SECOND_APP_PORT) || (await freePort());
  ports = { app, db: await freePort(), mail: await freePort() };
});

afterAll(async () => {
  // A failed test may have left some of it running: end exactly what we saw, nothing else.
  for (const p of stillRunning(seen)) {
    try {
      process.kill(p.pid, "SIGKILL");
    } catch {
      // already gone
    }
  }
  await until("what was killed to end", 10_000, () => stillRunning(seen).length === 0).catch(() => undefined);
  // The logs stay for a person to read; the database files (about 180 MB) do not.
  rmSync(path.join(START_DIR, "mysql"), { recursive: true, force: true });
});

/** The running npm start, or a new one (the first one initialises MariaDB and seeds the demo). */
async function started(): Promise<NpmStart> {
  if (!running) {
    const first = starts++ === 0;
    running = await npmStart(ports, `run${starts}`, first ? 280_000 : 150_000);
  }
  seen.push(...processesOf(running));
  return running;
}

async function expectAllStopped(s: NpmStart, procs: Proc[]) {
  await until(
    "npm to exit",
    90_000,
    async () =>
      (await Promise.race([s.exited.then(() => true), new Promise((r) => setTimeout(() => r(false), 200))])) as boolean,
  );
  // The script stops everything before it exits, but a signal npm does not pass on (HUP) ends npm
  // at once and the script notices a moment later: give it the time a clean MariaDB shutdown takes.
  await until("every process of npm start to end", 60_000, () => stillRunning(procs).length === 0).catch(
    () => undefined,
  );
  expect(stillRunning(procs).map((p) => `${p.pid} ${p.cmd}`)).toEqual([]);
  expect(await portAnswers(ports.app)).toBe(false);
  expect(await portAnswers(ports.mail)).toBe(false);
  expect(await portAnswers(ports.db)).toBe(false);
  expect(startFileExists("start.pid")).toBe(false);
  expect(s.log()).toMatch(/stopping MariaDB[\s\S]*Stopped\./);
  running = null;
}

async function stopAndCheck(signal: NodeJS.Signals, target: "npm" | "script") {
  const s = await started();
  const procs = processesOf(s);
  seen.push(...procs);
  const names = procs.map((p) => p.cmd).join("\n");
  // All of it is there before the signal, so "none left" afterwards means something.
  expect(names).toMatch(/mariadbd .*--datadir=/);
  expect(names).toMatch(/scripts\/mail-sink\.ts/);
  expect(names).toMatch(/scripts\/start\.sh/);
  expect(stillRunning(procs).length).toBeGreaterThanOrEqual(5);
  process.kill(target === "npm" ? s.npmPid : s.pidFile("start"), signal);
  await expectAllStopped(s, procs);
}

describe("npm start stopped by a signal", () => {
  it("TERM to npm's pid stops the app, the mail sink and MariaDB, leaves nothing, and the next npm start works", async () => {
    await stopAndCheck("SIGTERM", "npm");
    // No stale lock or pid file: a second start comes up instead of saying "already running".
    const again = await started();
    expect(await again.health()).toBe(200);
    expect(again.log()).not.toMatch(/already running/);
  }, 500_000);

  it("HUP to npm's pid (which npm does not pass on) stops all of it too", async () => {
    await stopAndCheck("SIGHUP", "npm");
  }, 300_000);

  it("INT to npm's pid stops all of it", async () => {
    await stopAndCheck("SIGINT", "npm");
  }, 300_000);

  // INT to the script is what npm passes on, above.
  it.each([["SIGTERM"], ["SIGHUP"]] as const)(
    "%s to the start script's pid stops all of it",
    async (signal) => {
      await stopAndCheck(signal, "script");
    },
    300_000,
  );
});

describe("MariaDB dies under npm start", () => {
  it("is started again with a message, and the same app answers 200 again without a restart", async () => {
    const s = await started();
    const appPid = s.pidFile("next");
    const dbPid = s.pidFile("mysqld");
    const planner = DEMO_ACCOUNTS.find((a) => a.role === "planner")!;
    const signIn = () =>
      fetch(`${s.url}/api/session`, {
        method: "POST",
        headers: { "Content-Type": "application/json", Origin: s.url },
        body: JSON.stringify({ email: planner.email, password: planner.password }),
      });
    const statuses: number[] = [];
    // The script's watch held back (stopped) while MariaDB is dead, so the outage lasts as long as
    // the checks of what people see meanwhile take, however fast the restart would be.
    const script = s.pidFile("start");
    process.kill(script, "SIGSTOP");
    try {
      process.kill(dbPid, "SIGKILL");
      // The app notices (503, with plain words) and then, without being restarted, answers again.
      await until("health to say the database is unavailable", 30_000, async () => {
        const status = await s.health();
        statuses.push(status);
        return status === 503;
      });
      const down = await signIn();
      expect(down.status).toBe(503);
      expect(down.headers.get("retry-after")).toMatch(/^\d+$/);
      const text = await down.text();
      expect(JSON.parse(text).error).toMatch(/database.*nothing was saved.*Try again/);
      expect(text).not.toMatch(/ECONN|127\.0\.0\.1|SQL|    at /);
    } finally {
      process.kill(script, "SIGCONT");
    }
    await until("a log line about restarting MariaDB", 30_000, () =>
      /MariaDB \(pid \d+\) stopped unexpectedly.*restarting it/.test(s.log()),
    );
    await until("health to answer 200 again", 90_000, async () => (await s.health()) === 200);
    await until("the log to say MariaDB is back", 10_000, () => /MariaDB is back/.test(s.log()));
    expect(statuses.filter((x) => x !== 200 && x !== 503)).toEqual([]);
    expect(s.pidFile("mysqld")).not.toBe(dbPid);
    expect(s.pidFile("next")).toBe(appPid);
    expect(stillRunning(processesOf(s).filter((p) => p.pid === appPid))).toHaveLength(1);

    // Signing in goes through the session pool as well as knex's: both reconnect by themselves.
    expect((await signIn()).status).toBe(200);

    // And stopping it afterwards stops the MariaDB it started again, too.
    await stopAndCheck("SIGTERM", "npm");
  }, 400_000);
});
