import { spawn, type ChildProcess } from "node:child_process";
import { closeSync, existsSync, mkdirSync, openSync, readdirSync, readFileSync } from "node:fs";
import net, { type AddressInfo } from "node:net";
import path from "node:path";

// A real `npm start` of this checkout, run the way a service manager runs it: its own session, a
// plain environment, its own ports and data folder (TRAILBIN_DATA_DIR), serving the build npm test
// made (TRAILBIN_PREBUILT) so that nothing is built twice and the demo's .data/demo is never touched.

export const ROOT = process.cwd();
export const START_DIR = path.join(ROOT, ".data/test/npm-start");

/** A process as seen in /proc at one moment; the start time tells it from a later one with its pid. */
export type Proc = { pid: number; ppid: number; start: string; state: string; cmd: string };

function readProc(pid: number): Proc | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // The command name sits in parentheses and may hold spaces; the fields after it are fixed.
    const rest = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    const cmd = readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").join(" ").trim();
    return { pid, state: rest[0]!, ppid: Number(rest[1]), start: rest[19]!, cmd };
  } catch {
    return null;
  }
}

function allProcs(): Proc[] {
  return readdirSync("/proc")
    .filter((d) => /^\d+$/.test(d))
    .map((d) => readProc(Number(d)))
    .filter((p): p is Proc => p !== null);
}

/** The processes `roots` name (pids) and all their descendants, as they are now. */
export function processTree(roots: number[]): Proc[] {
  const procs = allProcs();
  const keep = new Map<number, Proc>();
  for (const p of procs) if (roots.includes(p.pid)) keep.set(p.pid, p);
  for (let grew = true; grew;) {
    grew = false;
    for (const p of procs) {
      if (!keep.has(p.pid) && keep.has(p.ppid)) {
        keep.set(p.pid, p);
        grew = true;
      }
    }
  }
  return [...keep.values()];
}

/** Those of `procs` still running (the same process, not a zombie waiting to be reaped). */
export function stillRunning(procs: Proc[]): Proc[] {
  return procs.filter((p) => {
    const now = readProc(p.pid);
    return now !== null && now.start === p.start && now.state !== "Z";
  });
}

export async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

export function portAnswers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect({ host: "127.0.0.1", port });
    s.once("connect", () => {
      s.destroy();
      resolve(true);
    });
    s.once("error", () => resolve(false));
  });
}

export async function until<T>(
  what: string,
  timeoutMs: number,
  probe: () => Promise<T | undefined | false> | T | undefined | false,
): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await Promise.resolve(probe()).catch(() => undefined);
    if (v) return v;
    if (Date.now() > end) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export type Ports = { app: number; db: number; mail: number };

export type NpmStart = {
  npm: ChildProcess;
  npmPid: number;
  exited: Promise<number | string | null>;
  logFile: string;
  log: () => string;
  url: string;
  /** pid named in one of start.sh's pid files (start.pid: the script; next, mail-sink, mysqld). */
  pidFile: (name: "start" | "next" | "mail-sink" | "mysqld") => number;
  health: () => Promise<number>;
};

/** Starts `npm start` and waits until its /api/health answers 200. */
export async function npmStart(ports: Ports, name: string, timeoutMs: number): Promise<NpmStart> {
  mkdirSync(START_DIR, { recursive: true });
  const logFile = path.join(START_DIR, `npm-start-${name}.log`);
  const fd = openSync(logFile, "w");
  let npm: ChildProcess;
  try {
    npm = spawn("npm", ["start"], {
      cwd: ROOT,
      detached: true,
      stdio: ["ignore", fd, fd],
      env: {
        // What a service manager would set; none of the test run's own settings (DB_*, NODE_ENV=test).
        NODE_ENV: "production",
        PATH: process.env.PATH,
        HOME: process.env.HOME,
        ...(process.env.CI ? { CI: process.env.CI } : {}),
        ...(process.env.TMPDIR ? { TMPDIR: process.env.TMPDIR } : {}),
        PORT: String(ports.app),
        DB_PORT: String(ports.db),
        MAIL_SINK_PORT: String(ports.mail),
        TRAILBIN_DATA_DIR: START_DIR,
        TRAILBIN_PREBUILT: process.env.NEXT_DIST_DIR ?? ".next-test",
      },
    });
  } finally {
    closeSync(fd);
  }
  let code: number | string | null | undefined;
  const exited = new Promise<number | string | null>((resolve) =>
    npm.once("exit", (c, signal) => {
      code = c ?? signal;
      resolve(code);
    }),
  );
  const url = `http://127.0.0.1:${ports.app}`;
  const log = () => readFileSync(logFile, "utf8");
  const health = () =>
    fetch(`${url}/api/health`).then(
      (r) => r.status,
      () => 0,
    );
  const pidFile = (file: string) => Number(readFileSync(path.join(START_DIR, `${file}.pid`), "utf8").split("\n")[0]);

  const end = Date.now() + timeoutMs;
  for (;;) {
    if (code !== undefined) throw new Error(`npm start exited (${code}) before the app answered:\n${log()}`);
    if ((await health()) === 200) break;
    if (Date.now() > end) throw new Error(`npm start did not answer on ${url} within ${timeoutMs} ms:\n${log()}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  return { npm, npmPid: npm.pid!, exited, logFile, log, url, pidFile, health };
}

/** Every process of a running npm start: npm, the script, the app, the mail sink, MariaDB, and their children. */
export function processesOf(s: NpmStart): Proc[] {
  const roots = [s.npmPid, s.pidFile("start"), s.pidFile("next"), s.pidFile("mail-sink"), s.pidFile("mysqld")];
  return processTree(roots);
}

export const startFileExists = (name: string) => existsSync(path.join(START_DIR, name));
