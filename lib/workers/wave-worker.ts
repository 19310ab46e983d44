// Worker-thread entry for wave planning: batching plus an exact route per batch can take a while.
import { serveJobs } from "@/lib/routing/serve-jobs";
import { batchOrders } from "@/lib/waves/batching";
import type { WaveJob } from "./wave-job";

serveJobs<WaveJob>((job, onProgress) => batchOrders(job.graph, job.matrix, job.orders, job.limits, { method: job.method, from: job.from, to: job.to, onProgress }));
