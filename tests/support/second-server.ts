import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, openSync, closeSync } from "node:fs";
import path from "node:path";
import request from "supertest";

export type SecondServer = {
  url: string;
  origin: string;
  api: () => ReturnType<typeof request>;
  logFile: string;
  stop: () => Promise<void>;
};

/**
 * A second `next start` from the test build (NEXT_DIST_DIR), on TEST_SECOND_APP_PORT, against the same
 * test database, with extra settings in its environment: for faults that need the server configured
 * differently. Its own process group, so stop() ends it and anything it forked, and nothing else.
 */
export async function startSecondServer(settings: Record<string, string>, name: string): Promise<SecondServer> {
  const port = process.env.TEST_SECOND_APP_PORT;
  if (!port) throw new Error("TEST_SECOND_APP_PORT is not set: run the fault tests through npm test");
  const url = `http://127.0.0.1:${port}`;
  const dir = path.resolve(process.cwd(), ".data/test");
  mkdirSync(dir, { recursive: true });
  const logFile = path.join(dir, `second-app-${name}.log`);
  const log = openSync(logFile, "w");
  let child: ChildProcess;
  try {
    child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", port], {
      // Its own address is its public origin (APP_ORIGIN), unless the settings say otherwise.
      env: { ...process.env, NODE_ENV: "production", APP_ORIGIN: url, ...settings },
      detached: true,
      stdio: ["ignore", log, log],
    });
  } finally {
    closeSync(log);
  }
  let exited = false;
  child.once("exit", () => (exited = true));

  const stop = async () => {
    if (exited || !child.pid) return;
    const gone = new Promise<void>((r) => child.once("exit", () => r()));
    process.kill(-child.pid, "SIGTERM");
    const killer = setTimeout(() => {
      if (!exited && child.pid) process.kill(-child.pid, "SIGKILL");
    }, 15_000);
    await gone;
    clearTimeout(killer);
  };

  for (let i = 0; i < 600; i++) {
    if (exited) throw new Error(`the second server exited before answering; see ${logFile}`);
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.status === 200,
      () => false,
    );
    if (ok) return { url, origin: url, api: () => request(url), logFile, stop };
    await new Promise((r) => setTimeout(r, 100));
  }
  await stop();
  throw new Error(`the second server did not answer on ${url} within 60 s; see ${logFile}`);
}
