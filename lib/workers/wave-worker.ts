// Worker-thread entry for wave planning: batching plus an exact route per batch can take a while.
import { serveJobs } from "@/lib/workers/serve-tasks";
import { batchOrders } from "@/lib/batching/batching";
import type { WaveJob } from "./wave-task";

serveJobs<WaveJob>((job, onProgress) => batchOrders(job.graph, job.matrix, job.orders, job.limits, { method: job.method, from: job.from, to: job.to, onProgress }));
