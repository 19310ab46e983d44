// Node-only: runs tasks (routing, wave planning) in worker_threads so long solves never block the server's event loop.
import path from "node:path";
import { Worker, type ResourceLimits } from "node:worker_threads";
import type { RoutingTask, SerializedError, TaskResult } from "./routing-tasks";
import { deserializeError } from "./routing-tasks";

/** What a worker entry sends back; any entry speaking it (see ./serve-tasks) can back a pool. */
type PoolMessage =
  | { type: "progress"; taskId: number; fraction: number }
  | { type: "done"; taskId: number; result: unknown }
  | { type: "error"; taskId: number; error: SerializedError };

export type TaskFailure = "timeout" | "cancelled" | "crashed" | "closed";

/** A task that did not finish: over its time limit, cancelled, its worker died, or the pool closed. */
export class TaskError extends Error {
  readonly reason: TaskFailure;
  constructor(reason: TaskFailure, message: string) {
    super(message);
    this.name = "TaskError";
    this.reason = reason;
  }
}

export interface PoolOptions {
  /** What the pool's workers do, as its errors name it ("routing worker crashed", "wave planning worker crashed"). */
  kind: string;
  /** Worker threads; default 1 (the bench machine has 2 cores shared with the web server). */
  size?: number;
  /** Per-task limit when run() gives none; default 30 s. */
  defaultTimeoutMs?: number;
  /** Worker entry, relative to process.cwd(). */
  workerPath: string;
  /** Heap caps for each worker: a task that needs more fails as "crashed" instead of growing the process. */
  resourceLimits?: ResourceLimits;
}

export interface RunOptions {
  timeoutMs?: number;
  signal?: AbortSignal;
  onProgress?: (fraction: number) => void;
}

interface Pending {
  id: number;
  task: unknown;
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

/** A pool of worker threads running one kind of task; the entry decides what a task means. */
export class WorkerPool<Task, Result> {
  private readonly kind: string;
  private readonly size: number;
  private readonly timeoutMs: number;
  private readonly entry: string;
  private readonly resourceLimits: ResourceLimits | undefined;
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(options: PoolOptions) {
    this.kind = options.kind;
    this.size = Math.max(1, options.size ?? 1);
    this.timeoutMs = options.defaultTimeoutMs ?? 30_000;
    // Resolved from the working directory (repo root under next start and vitest) so that no
    // bundler tries to follow the worker file.
    this.entry = path.resolve(/*turbopackIgnore: true*/ process.cwd(), options.workerPath);
    this.resourceLimits = options.resourceLimits;
  }

  run(task: Task, opts: RunOptions = {}): Promise<Result> {
    if (this.closed) return Promise.reject(new TaskError("closed", `the ${this.kind} pool is closed`));
    if (opts.signal?.aborted) return Promise.reject(new TaskError("cancelled", "task cancelled before it started"));
    return new Promise<Result>((resolve, reject) => {
      const p: Pending = { id: this.nextId++, task, opts, resolve: resolve as (v: unknown) => void, reject };
      const onQueuedAbort = () => {
        const i = this.queue.indexOf(p);
        if (i >= 0) {
          this.queue.splice(i, 1);
          reject(new TaskError("cancelled", `task ${p.id} cancelled while queued`));
        }
      };
      opts.signal?.addEventListener("abort", onQueuedAbort, { once: true });
      this.queue.push(p);
      this.pump();
    });
  }

  /** Tasks waiting for a free worker. */
  get queued(): number {
    return this.queue.length;
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const p of this.queue.splice(0)) p.reject(new TaskError("closed", `the ${this.kind} pool was closed`));
    await Promise.all(
      this.slots.splice(0).map((s) => {
        if (s.running)
          this.finish(s, () => s.running?.reject(new TaskError("closed", `the ${this.kind} pool was closed`)));
        return s.worker.terminate();
      }),
    );
  }

  private spawn(): Slot {
    // On Node 20, `new Worker(entry.ts, { execArgv: ["--import", "tsx"] })` alone fails with
    // ERR_UNKNOWN_FILE_EXTENSION (tsx issue #354: the hook is not in place for a worker's entry),
    // so a one-line CommonJS bootstrap registers tsx before requiring the .ts entry.
    const bootstrap = `require("tsx/cjs/api").register(); require(${JSON.stringify(this.entry)});`;
    const worker = new Worker(bootstrap, {
      eval: true,
      execArgv: ["--import", "tsx"],
      ...(this.resourceLimits ? { resourceLimits: this.resourceLimits } : {}),
    });
    worker.unref();
    const slot: Slot = { worker, running: null, timer: null, onAbort: null };
    worker.on("message", (m: PoolMessage) => this.onMessage(slot, m));
    worker.on("error", (e) => this.fail(slot, "crashed", `${this.kind} worker crashed: ${e.message}`));
    worker.on("exit", (code) => this.fail(slot, "crashed", `${this.kind} worker exited with code ${code}`));
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
    slot.timer = setTimeout(() => this.fail(slot, "timeout", `task ${p.id} exceeded its ${limit} ms limit`), limit);
    if (p.opts.signal) {
      slot.onAbort = () => this.fail(slot, "cancelled", `task ${p.id} cancelled`);
      p.opts.signal.addEventListener("abort", slot.onAbort, { once: true });
    }
    slot.worker.postMessage({ taskId: p.id, task: p.task });
  }

  private onMessage(slot: Slot, m: PoolMessage): void {
    const p = slot.running;
    if (!p || m.taskId !== p.id) return;
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

  /** Ends the running task with an error and replaces the worker: a busy thread cannot be interrupted otherwise. */
  private fail(slot: Slot, reason: TaskFailure, message: string): void {
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
    p?.reject(new TaskError(reason, message));
    if (!this.closed) this.pump();
  }
}

/** The routing engine's pool: sequencing and Floyd–Warshall tasks, typed by kind. */
export class RoutingPool extends WorkerPool<RoutingTask, unknown> {
  constructor(options: Partial<PoolOptions> = {}) {
    super({ kind: "routing", workerPath: "lib/workers/routing-worker.ts", ...options });
  }

  override run<T extends RoutingTask>(task: T, opts: RunOptions = {}): Promise<TaskResult<T>> {
    return super.run(task, opts) as Promise<TaskResult<T>>;
  }
}
