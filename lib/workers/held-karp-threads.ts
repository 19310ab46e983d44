// Node-only: starts the second thread that heldKarp shares large tables with (lib/routing/held-karp-split.ts).
import os from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { setSplitHelper } from "../routing/held-karp-split";

// The shared status word: 0 while loading, then READY, or GONE once it failed or missed a barrier.
const READY = 1;
const GONE = 2;

let running: { worker: Worker; started: Promise<boolean> } | null = null;

/**
 * Starts the helper for this thread's heldKarp calls; resolves true once it is loaded, false when
 * there is no second core or it failed to load. Calls made before then run on one thread.
 */
export function startHeldKarpHelper(): Promise<boolean> {
  if (running) return running.started;
  if (os.availableParallelism() < 2) return Promise.resolve(false);
  const status = new Int32Array(new SharedArrayBuffer(4));
  // Resolved from the working directory and loaded through tsx, like WorkerPool's entries (see there).
  const entry = path.resolve(/*turbopackIgnore: true*/ process.cwd(), "lib/workers/held-karp-helper.ts");
  const bootstrap = `require("tsx/cjs/api").register(); require(${JSON.stringify(entry)});`;
  const worker = new Worker(bootstrap, { eval: true, execArgv: ["--import", "tsx"], workerData: { status } });
  worker.unref();
  setSplitHelper({
    ready: () => Atomics.load(status, 0) === READY,
    post: (job) => worker.postMessage(job),
    lost: () => Atomics.store(status, 0, GONE),
  });
  const started = new Promise<boolean>((resolve) => {
    worker.once("message", () => resolve(Atomics.load(status, 0) === READY));
    const down = () => {
      Atomics.store(status, 0, GONE);
      resolve(false);
    };
    worker.once("error", down);
    worker.once("exit", down);
  });
  running = { worker, started };
  return started;
}

/** Stops the helper; later heldKarp calls run on one thread until it is started again. */
export async function stopHeldKarpHelper(): Promise<void> {
  const r = running;
  if (!r) return;
  running = null;
  setSplitHelper(null);
  await r.worker.terminate();
}
