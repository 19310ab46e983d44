// The worker side of WorkerPool: run each posted job, report progress and the result or error.
import { parentPort } from "node:worker_threads";
import { serializeError, type SerializedError } from "./routing-tasks";

export function serveJobs<Job>(run: (job: Job, onProgress: (fraction: number) => void) => unknown, serialize: (e: unknown) => SerializedError = serializeError): void {
  const port = parentPort;
  if (!port) throw new Error("a job worker must run in a worker thread");
  port.on("message", (msg: { jobId: number; job: Job }) => {
    let lastSent = -1;
    try {
      const result = run(msg.job, (fraction) => {
        // Throttle to whole percents: progress is for a progress bar, not a log.
        const pct = Math.floor(fraction * 100);
        if (pct !== lastSent) {
          lastSent = pct;
          port.postMessage({ type: "progress", jobId: msg.jobId, fraction });
        }
      });
      port.postMessage({ type: "done", jobId: msg.jobId, result });
    } catch (e) {
      port.postMessage({ type: "error", jobId: msg.jobId, error: serialize(e) });
    }
  });
}
