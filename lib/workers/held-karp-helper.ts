// Worker-thread entry for the second Held–Karp thread (TypeScript; held-karp-threads.ts registers
// tsx before loading it, as WorkerPool does for its entries).
import { parentPort, workerData } from "node:worker_threads";
import { serveSplitJob, type SplitJob } from "../routing/held-karp-split";

const port = parentPort;
if (!port) throw new Error("the Held–Karp helper must run in a worker thread");
const { status } = workerData as { status: Int32Array };
port.on("message", (job: SplitJob) => serveSplitJob(job));
// The caller may be blocked in a solve when the thread comes up, so readiness is a shared word it
// can read without its event loop, besides the message that settles startHeldKarpHelper().
Atomics.store(status, 0, 1);
port.postMessage("ready");
