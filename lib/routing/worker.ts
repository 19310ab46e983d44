// Worker-thread entry for RoutingPool; started with `--import tsx` so it runs as TypeScript.
import { parentPort } from "node:worker_threads";
import type { RoutingJob, WorkerMessage } from "./jobs";
import { runJob, serializeError } from "./jobs";

const port = parentPort;
if (!port) throw new Error("lib/routing/worker.ts must run in a worker thread");

port.on("message", (msg: { jobId: number; job: RoutingJob }) => {
  const send = (m: WorkerMessage) => port.postMessage(m);
  let lastSent = -1;
  try {
    const result = runJob(msg.job, (fraction) => {
      // Throttle to whole percents: progress is for a progress bar, not a log.
      const pct = Math.floor(fraction * 100);
      if (pct !== lastSent) {
        lastSent = pct;
        send({ type: "progress", jobId: msg.jobId, fraction });
      }
    });
    send({ type: "done", jobId: msg.jobId, result });
  } catch (e) {
    send({ type: "error", jobId: msg.jobId, error: serializeError(e) });
  }
});
