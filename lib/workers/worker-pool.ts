// Node-only: runs routing jobs in worker_threads so long solves never block the server's event loop.
import path from "node:path";
import { Worker, type ResourceLimits } from "node:worker_threads";
import type { JobResult, RoutingJob, SerializedError } from "./routing-tasks";
import { deserializeError } from "./routing-tasks";

/** What a worker entry sends back; any entry speaking it (see ./serve-jobs) can back a pool. */
type PoolMessage =
  | { type: "progress"; jobId: number; fraction: number }
  | { type: "done"; jobId: number; result: unknown }
  | { type: "error"; jobId: number; error: SerializedError };

export type JobFailure = "timeout" | "cancelled" | "crashed" | "closed";

/** A job that did not finish: over its time limit, cancelled, its worker died, or the pool closed. */
export class RoutingJobError extends Error {
  readonly reason: JobFailure;
  constructor(reason: JobFailure, message: string) {
    super(message);
    this.name = "RoutingJobError";
    this.reason = reason;
  }
}

export interface PoolOptions {
  /** Worker threads; default 1 (the bench machine has 2 cores shared with the web server). */
  size?: number;
  /** Per-job limit when run() gives none; default 30 s. */
  defaultTimeoutMs?: number;
  /** Worker entry, relative to process.cwd(); default lib/workers/routing-worker.ts. */
  workerPath?: string;
  /** Heap caps for each worker: a job that needs more fails as "crashed" instead of growing the process. */
  resourceLimits?: ResourceLimits;
}

export interface RunOptions {
  timeoutMs?: number;
  signal?: AbortSignal;
  onProgress?: (fraction: number) => void;
}

interface Pending {
  id: number;
  job: unknown;
  opts: RunOptions;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
}

interface Slot {
  worker: Worker;
  running: Pending | null;
  timer: ReturnType<typeof setTimeout> | null;
  onAbort: (() => void) | null;
}

/** A pool of worker threads running one kind of job; the entry decides what a job means. */
export class WorkerPool<Job, Result> {
  private readonly size: number;
  private readonly timeoutMs: number;
  private readonly entry: string;
  private readonly resourceLimits: ResourceLimits | undefined;
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(options: PoolOptions = {}) {
    this.size = Math.max(1, options.size ?? 1);
    this.timeoutMs = options.defaultTimeoutMs ?? 30_000;
    // Resolved from the working directory (repo root under next start and vitest) so that no
    // bundler tries to follow the worker file.
    this.entry = path.resolve(/*turbopackIgnore: true*/ process.cwd(), options.workerPath ?? "lib/workers/routing-worker.ts");
    this.resourceLimits = options.resourceLimits;
  }

  run(job: Job, opts: RunOptions = {}): Promise<Result> {
    if (this.closed) return Promise.reject(new RoutingJobError("closed", "the routing pool is closed"));
    if (opts.signal?.aborted) return Promise.reject(new RoutingJobError("cancelled", "job cancelled before it started"));
    return new Promise<Result>((resolve, reject) => {
      const p: Pending = { id: this.nextId++, job, opts, resolve: resolve as (v: unknown) => void, reject };
      const onQueuedAbort = () => {
        const i = this.queue.indexOf(p);
        if (i >= 0) {
          this.queue.splice(i, 1);
          reject(new RoutingJobError("cancelled", `job ${p.id} cancelled while queued`));
        }
      };
      opts.signal?.addEventListener("abort", onQueuedAbort, { once: true });
      this.queue.push(p);
      this.pump();
    });
  }

  /** Jobs waiting for a free worker. */
  get queued(): number {
    return this.queue.length;
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const p of this.queue.splice(0)) p.reject(new RoutingJobError("closed", "the routing pool was closed"));
    await Promise.all(
      this.slots.splice(0).map((s) => {
        if (s.running) this.finish(s, () => s.running?.reject(new RoutingJobError("closed", "the routing pool was closed")));
        return s.worker.terminate();
      }),
    );
  }

  private spawn(): Slot {
    // On Node 20, `new Worker(entry.ts, { execArgv: ["--import", "tsx"] })` alone fails with
    // ERR_UNKNOWN_FILE_EXTENSION (tsx issue #354: the hook is not in place for a worker's entry),
    // so a one-line CommonJS bootstrap registers tsx before requiring the .ts entry.
    const bootstrap = `require("tsx/cjs/api").register(); require(${JSON.stringify(this.entry)});`;
    const worker = new Worker(bootstrap, { eval: true, execArgv: ["--import", "tsx"], ...(this.resourceLimits ? { resourceLimits: this.resourceLimits } : {}) });
    worker.unref();
    const slot: Slot = { worker, running: null, timer: null, onAbort: null };
    worker.on("message", (m: PoolMessage) => this.onMessage(slot, m));
    worker.on("error", (e) => this.fail(slot, "crashed", `routing worker crashed: ${e.message}`));
    worker.on("exit", (code) => this.fail(slot, "crashed", `routing worker exited with code ${code}`));
    this.slots.push(slot);
    return slot;
  }

  private pump(): void {
    while (this.queue.length > 0) {
      let slot = this.slots.find((s) => !s.running);
      if (!slot && this.slots.length < this.size) slot = this.spawn();
      if (!slot) return;
      this.start(slot, this.queue.shift() as Pending);
    }
  }

  private start(slot: Slot, p: Pending): void {
    slot.running = p;
    slot.worker.ref();
    const limit = p.opts.timeoutMs ?? this.timeoutMs;
    slot.timer = setTimeout(() => this.fail(slot, "timeout", `job ${p.id} exceeded its ${limit} ms limit`), limit);
    if (p.opts.signal) {
      slot.onAbort = () => this.fail(slot, "cancelled", `job ${p.id} cancelled`);
      p.opts.signal.addEventListener("abort", slot.onAbort, { once: true });
    }
    slot.worker.postMessage({ jobId: p.id, job: p.job });
  }

  private onMessage(slot: Slot, m: PoolMessage): void {
    const p = slot.running;
    if (!p || m.jobId !== p.id) return;
    if (m.type === "progress") p.opts.onProgress?.(m.fraction);
    else if (m.type === "done") this.finish(slot, () => p.resolve(m.result));
    else this.finish(slot, () => p.reject(deserializeError(m.error)));
  }

  private finish(slot: Slot, settle: () => void): void {
    const p = slot.running;
    if (slot.timer) clearTimeout(slot.timer);
    if (p && slot.onAbort) p.opts.signal?.removeEventListener("abort", slot.onAbort);
    slot.running = null;
    slot.timer = null;
    slot.onAbort = null;
    slot.worker.unref();
    settle();
    if (!this.closed) this.pump();
  }

  /** Ends the running job with an error and replaces the worker: a busy thread cannot be interrupted otherwise. */
  private fail(slot: Slot, reason: JobFailure, message: string): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return;
    this.slots.splice(i, 1);
    slot.worker.removeAllListeners();
    slot.worker.on("error", () => {});
    void slot.worker.terminate();
    const p = slot.running;
    if (slot.timer) clearTimeout(slot.timer);
    if (p && slot.onAbort) p.opts.signal?.removeEventListener("abort", slot.onAbort);
    slot.running = null;
    p?.reject(new RoutingJobError(reason, message));
    if (!this.closed) this.pump();
  }
}

/** The routing engine's pool: sequencing and Floyd–Warshall jobs, typed by kind. */
export class RoutingPool extends WorkerPool<RoutingJob, unknown> {
  override run<J extends RoutingJob>(job: J, opts: RunOptions = {}): Promise<JobResult<J>> {
    return super.run(job, opts) as Promise<JobResult<J>>;
  }
}
