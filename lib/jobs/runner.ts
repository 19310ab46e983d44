import type { Knex } from "knex";
import type { JobStart, JobToRun } from "@/db/jobs";
import type { JobDTO, JobStatus } from "@/lib/contracts/jobs";
import type { SignedInUser } from "@/lib/auth/session";
import { roleMay, type Permission } from "@/lib/auth/permissions";
import { HttpError } from "@/lib/http/errors";
import { progressPacer } from "./pacer";
import type { JobQueue } from "./queue";

type JobPatch = { status?: JobStatus; progress?: number; message?: string; result?: unknown };

/** Where jobs live: the database (db/jobs.ts) in the server, a fake in unit tests. */
export interface JobStore {
  createOrJoin(
    siteId: number,
    kind: string,
    key: string,
    userId: string | null,
    message: string,
    input: unknown,
  ): Promise<JobStart>;
  claim(id: string, startMessage: (kind: string) => string): Promise<JobToRun | null>;
  /** Changes a queued or running job only, and says whether it did. */
  update(id: string, patch: JobPatch, trx?: Knex.Transaction): Promise<boolean>;
  get(siteId: number, id: string): Promise<JobDTO | null>;
}

/** What a job's work gets: the job and its stored input, progress, a stop signal, and its finish. */
export type JobContext<Input> = {
  job: JobDTO;
  siteId: number;
  userId: string | null;
  input: Input;
  /** Paced: call it as often as the work likes. */
  progress(fraction: number, message?: string): void;
  /** Aborted when the job is cancelled, here or (seen at a progress write) by another process. */
  signal: AbortSignal;
  /**
   * Marks the job done inside the transaction that stores its result (`null`: nothing to store). A job
   * cancelled meanwhile makes this throw, which rolls the result back: a cancel that answered 202
   * leaves nothing behind.
   */
  finish(trx: Knex.Transaction | null, done: { message: string; result: unknown }): Promise<void>;
};

export type JobDefinition<Input> = {
  /** Who may watch a job of this kind, and who may stop it: it follows what the job works on. */
  access: { watch: Permission; cancel: Permission };
  /** The job's message once it starts running, and once it is cancelled. */
  messages: { start: string; cancelled: string };
  /** The words a failed job shows a person; engine or SQL details stay in the server log. */
  failureMessage(e: unknown, jobId: string): string;
  run(ctx: JobContext<Input>): Promise<void>;
};

/** A registered kind of job; its input type travels with it to `startJob`. */
export type JobKind<Input> = { readonly kind: string; readonly definition: JobDefinition<Input> };

export type JobSpec<Input> = { siteId: number; key: string; userId: string; message: string; input: Input };

/** The job ended (cancelled) before its work could store a result; the work drops what it made. */
export class JobNoLongerRunning extends Error {
  constructor(readonly jobId: string) {
    super(`job ${jobId} is no longer running`);
  }
}

/**
 * What every runner of one process shares: the registered kinds, and the running jobs' stop switches
 * (only a fast path for a cancel that reaches the process running the job: the job's row decides).
 */
export type RunnerState = { kinds: Map<string, JobDefinition<never>>; aborts: Map<string, AbortController> };

export const newRunnerState = (): RunnerState => ({ kinds: new Map(), aborts: new Map() });

export function createJobRunner(
  store: JobStore,
  makeQueue: (run: (jobId: string) => Promise<void>) => JobQueue,
  state: RunnerState = newRunnerState(),
) {
  const { kinds, aborts } = state;

  async function run(jobId: string): Promise<void> {
    const claimed = await store.claim(jobId, (kind) => kinds.get(kind)?.messages.start ?? "Starting");
    // Cancelled while it waited to start, or another worker has it.
    if (!claimed) return;
    const kind = claimed.job.kind;
    const definition = kinds.get(kind) as JobDefinition<unknown> | undefined;
    if (!definition) {
      await store.update(jobId, { status: "failed", message: `This server cannot run jobs of kind ${kind}.` });
      return;
    }
    const controller = new AbortController();
    aborts.set(jobId, controller);
    const pacer = progressPacer(
      (p) => store.update(jobId, { status: "running", progress: p.fraction, message: p.message }),
      () => controller.abort(),
    );
    let finished = false;
    const ctx: JobContext<unknown> = {
      job: claimed.job,
      siteId: claimed.siteId,
      userId: claimed.userId,
      input: claimed.input,
      progress: pacer.report,
      signal: controller.signal,
      finish: async (trx, done) => {
        pacer.stop();
        if (!(await store.update(jobId, { status: "done", progress: 1, ...done }, trx ?? undefined)))
          throw new JobNoLongerRunning(jobId);
        finished = true;
      },
    };
    try {
      await definition.run(ctx);
      if (!finished && !controller.signal.aborted) throw new Error(`the ${kind} job's work ended without a result`);
    } catch (e) {
      if (e instanceof JobNoLongerRunning) return;
      pacer.stop();
      if (controller.signal.aborted) {
        await store
          .update(jobId, { status: "cancelled", message: definition.messages.cancelled })
          .catch(() => undefined);
        return;
      }
      console.error(`${kind} job ${jobId} failed`, e);
      await store
        .update(jobId, { status: "failed", message: definition.failureMessage(e, jobId) })
        .catch(() => undefined);
    } finally {
      pacer.stop();
      aborts.delete(jobId);
    }
  }

  const queue = makeQueue(run);

  /** Registers a kind of job once; start jobs of it with `startJob`. */
  function defineJob<Input>(kind: string, definition: JobDefinition<Input>): JobKind<Input> {
    kinds.set(kind, definition as JobDefinition<never>);
    return { kind, definition };
  }

  /**
   * A job for `spec.key`, new or the one already queued, running or done for it. The same person
   * asking again (a double click, a retry on flaky Wi-Fi) joins their own job. Someone else asking for
   * the same work while it runs, or after it is done, did not win: they get 409 naming who did
   * (`refusal`), instead of silently riding on a job they did not start. `onCreated` runs before a
   * new job is queued (an audit line that must come first).
   */
  async function startJob<Input>(
    kind: JobKind<Input>,
    spec: JobSpec<Input>,
    refusal: (by: string, job: JobDTO) => string,
    onCreated?: (job: JobDTO) => Promise<void>,
  ): Promise<JobDTO> {
    const start = await store.createOrJoin(spec.siteId, kind.kind, spec.key, spec.userId, spec.message, spec.input);
    if (!start.created) {
      if (!start.startedBy || start.startedBy.id === spec.userId) return start.job;
      throw new HttpError(409, refusal(start.startedBy.name, start.job), {
        jobId: start.job.id,
        startedBy: start.startedBy.name,
      });
    }
    await onCreated?.(start.job);
    queue.enqueue(start.job.id);
    return start.job;
  }

  /** The job and its kind, if `user` may watch it (and, for "cancel", stop it). */
  async function jobFor(user: SignedInUser, id: string, need: "watch" | "cancel") {
    const job = await store.get(user.siteId, id);
    const definition = job ? kinds.get(job.kind) : undefined;
    if (!job || !definition || !roleMay(user.role, definition.access.watch))
      throw new HttpError(404, "No such job. It may belong to another site or have been cleared.");
    if (!roleMay(user.role, definition.access[need]))
      throw new HttpError(403, "Your role may watch this job but not stop it.");
    return { job, definition };
  }

  async function watchJob(user: SignedInUser, id: string): Promise<JobDTO> {
    return (await jobFor(user, id, "watch")).job;
  }

  /**
   * `stopped` only when this request stopped the job: the row changes only while the job is live, and
   * the job's own finish commits only while it still says running, so exactly one of the two wins.
   */
  async function cancelJob(user: SignedInUser, id: string): Promise<{ job: JobDTO; stopped: boolean }> {
    const { job, definition } = await jobFor(user, id, "cancel");
    if (await store.update(job.id, { status: "cancelled", message: definition.messages.cancelled })) {
      aborts.get(job.id)?.abort();
      return { job: (await store.get(user.siteId, job.id)) ?? job, stopped: true };
    }
    const now = (await store.get(user.siteId, job.id)) ?? job;
    // A repeated cancel (a double click) answers like the first did.
    if (now.status === "cancelled") return { job: now, stopped: false };
    const message =
      now.status === "done"
        ? `This job has already finished (${now.message}), so there is nothing to cancel. Reload the page to see the result.`
        : `This job has already finished: it failed (${now.message}). There is nothing to cancel.`;
    throw new HttpError(409, message, { job: now });
  }

  return { defineJob, startJob, watchJob, cancelJob, run };
}
