// The worker side of WorkerPool: run each posted task, report progress and the result or error.
import { parentPort } from "node:worker_threads";
import { serializeError, type SerializedError } from "./routing-tasks";

export function serveTasks<Task>(
  run: (task: Task, onProgress: (fraction: number) => void) => unknown,
  serialize: (e: unknown) => SerializedError = serializeError,
): void {
  const port = parentPort;
  if (!port) throw new Error("a pool's worker entry must run in a worker thread");
  port.on("message", (msg: { taskId: number; task: Task }) => {
    let lastSent = -1;
    try {
      const result = run(msg.task, (fraction) => {
        // Throttle to whole percents: progress is for a progress bar, not a log.
        const pct = Math.floor(fraction * 100);
        if (pct !== lastSent) {
          lastSent = pct;
          port.postMessage({ type: "progress", taskId: msg.taskId, fraction });
        }
      });
      port.postMessage({ type: "done", taskId: msg.taskId, result });
    } catch (e) {
      port.postMessage({ type: "error", taskId: msg.taskId, error: serialize(e) });
    }
  });
}
