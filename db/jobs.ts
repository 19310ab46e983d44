import "server-only";
import { randomBytes } from "node:crypto";
import type { Knex } from "knex";
import { db } from "./knex";
import type { JobDTO, JobStatus } from "@/lib/contracts/jobs";

type JobRow = {
  id: string;
  site_id: number;
  kind: string;
  status: JobStatus;
  progress: number;
  message: string;
  result: string | null;
  input: string | null;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
};

const json = (v: unknown): unknown => (typeof v === "string" ? JSON.parse(v) : v);

const toDTO = (r: JobRow): JobDTO => ({
  id: r.id,
  kind: r.kind,
  status: r.status,
  progress: r.progress,
  message: r.message,
  result: json(r.result),
  createdAt: r.created_at.toISOString(),
  updatedAt: r.updated_at.toISOString(),
});

/**
 * A job for `key`, or the one already queued/running/done for it: a double click or a retried request
 * on flaky Wi-Fi joins the first job instead of starting a second.
 */
export type JobStart = { job: JobDTO; created: boolean; startedBy: { id: string; name: string } | null };

export async function createOrJoinJob(
  siteId: number,
  kind: string,
  key: string,
  userId: string | null,
  message: string,
  input: unknown = null,
): Promise<JobStart> {
  return db().transaction(async (trx) => {
    await trx("sites").where({ id: siteId }).forUpdate().first("id");
    const existing = (await trx("jobs as j")
      .leftJoin("users as u", "u.id", "j.created_by")
      .where({ "j.job_key": key })
      .whereIn("j.status", ["queued", "running", "done"])
      .orderBy("j.created_at", "desc")
      .first("j.*", "u.display_name as started_by_name")) as
      (JobRow & { created_by: string | null; started_by_name: string | null }) | undefined;
    if (existing) {
      const startedBy = existing.created_by
        ? { id: existing.created_by, name: existing.started_by_name ?? "someone" }
        : null;
      return { job: toDTO(existing), created: false, startedBy };
    }
    const id = randomBytes(16).toString("hex");
    await trx("jobs").insert({
      id,
      site_id: siteId,
      kind,
      job_key: key,
      status: "queued",
      message,
      created_by: userId,
      input: JSON.stringify(input),
    });
    const row = (await trx("jobs").where({ id }).first()) as JobRow;
    return { job: toDTO(row), created: true, startedBy: null };
  });
}

/**
 * Changes a job that is still queued or running, and says whether it did. A job that has ended
 * (done, failed, cancelled) never changes again, so neither a late progress write nor a cancel that
 * loses the race to the finish can undo how it ended. The job's own finish passes the transaction
 * that stores its result: result and "done" then commit together, or not at all if a cancel came first.
 */
export async function updateJob(
  id: string,
  patch: { status?: JobStatus; progress?: number; message?: string; result?: unknown },
  trx?: Knex.Transaction,
): Promise<boolean> {
  const q = trx ?? db();
  const row: Record<string, unknown> = { updated_at: q.fn.now(3) };
  if (patch.status) row.status = patch.status;
  if (patch.progress !== undefined) row.progress = Math.max(0, Math.min(1, patch.progress));
  if (patch.message !== undefined) row.message = patch.message.slice(0, 500);
  if (patch.result !== undefined) row.result = JSON.stringify(patch.result);
  const changed = await q("jobs").where({ id }).whereIn("status", ["queued", "running"]).update(row);
  return changed > 0;
}

/** A job as a worker runs it: who started it, at which site, on what. */
export type JobToRun = { job: JobDTO; siteId: number; userId: string | null; input: unknown };

/**
 * Takes a queued job to run it, and says whether this caller got it: only one claim of a job ever
 * succeeds, so several worker processes can share one queue; a job cancelled while it waited is not taken.
 */
export async function claimJob(id: string, startMessage: (kind: string) => string): Promise<JobToRun | null> {
  const queued = (await db()("jobs").where({ id, status: "queued" }).first()) as JobRow | undefined;
  if (!queued) return null;
  const message = startMessage(queued.kind).slice(0, 500);
  const changed = await db()("jobs")
    .where({ id, status: "queued" })
    .update({ status: "running", progress: 0, message, updated_at: db().fn.now(3) });
  if (changed === 0) return null;
  const job = toDTO({ ...queued, status: "running", progress: 0, message });
  return { job, siteId: queued.site_id, userId: queued.created_by, input: json(queued.input) };
}

export async function getJob(siteId: number, id: string): Promise<JobDTO | null> {
  const r = (await db()("jobs").where({ id, site_id: siteId }).first()) as JobRow | undefined;
  return r ? toDTO(r) : null;
}

/** Jobs a previous server process left running can never finish: say so instead of spinning forever. */
export async function failOrphanedJobs(): Promise<number> {
  return db()("jobs")
    .whereIn("status", ["queued", "running"])
    .update({
      status: "failed",
      message: "The server restarted while this was running. Start it again.",
      updated_at: db().fn.now(3),
    });
}
