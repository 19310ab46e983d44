import { describe, expect, it } from "vitest";
import type { JobStart, JobToRun } from "@/db/jobs";
import type { JobDTO } from "@/lib/contracts/jobs";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";
import { createJobRunner, JobNoLongerRunning, type JobDefinition, type JobStore } from "@/lib/jobs/runner";

// The runner against a store in memory: the join and refusal rule, cancelling, and how work ends.

type Row = JobDTO & { siteId: number; userId: string | null; input: unknown; key: string };

function fakeStore() {
  const rows = new Map<string, Row>();
  const names: Record<string, string> = { ann: "Ann", bob: "Bob" };
  let next = 1;
  const live = (r: Row) => r.status === "queued" || r.status === "running";
  const store: JobStore = {
    async createOrJoin(siteId, kind, key, userId, message, input): Promise<JobStart> {
      const existing = [...rows.values()]
        .reverse()
        .find((r) => r.key === key && r.status !== "failed" && r.status !== "cancelled");
      if (existing)
        return {
          job: { ...existing },
          created: false,
          startedBy: existing.userId ? { id: existing.userId, name: names[existing.userId] ?? "someone" } : null,
        };
      const id = `job${next++}`;
      const at = new Date(0).toISOString();
      rows.set(id, {
        id,
        kind,
        status: "queued",
        progress: 0,
        message,
        result: null,
        createdAt: at,
        updatedAt: at,
        siteId,
        userId,
        input,
        key,
      });
      return { job: { ...rows.get(id)! }, created: true, startedBy: null };
    },
    async claim(id, startMessage): Promise<JobToRun | null> {
      const r = rows.get(id);
      if (!r || r.status !== "queued") return null;
      Object.assign(r, { status: "running", progress: 0, message: startMessage(r.kind) });
      return { job: { ...r }, siteId: r.siteId, userId: r.userId, input: r.input };
    },
    async update(id, patch) {
      const r = rows.get(id);
      if (!r || !live(r)) return false;
      for (const [k, v] of Object.entries(patch)) if (v !== undefined) (r as Record<string, unknown>)[k] = v;
      return true;
    },
    async get(siteId, id) {
      const r = rows.get(id);
      return r && r.siteId === siteId ? { ...r } : null;
    },
  };
  return { store, rows };
}

const user = (id: string, role: SignedInUser["role"] = "admin"): SignedInUser => ({
  id,
  email: `${id}@example.test`,
  displayName: id,
  role,
  siteId: 1,
});
const refusal = (by: string, job: JobDTO) => `${by} has it (${job.status})`;

/** A runner whose queue holds jobs until `drain` runs them, so a test sees each step. */
function setUp(run: JobDefinition<{ n: number }>["run"]) {
  const { store, rows } = fakeStore();
  const queued: string[] = [];
  let runJob: (id: string) => Promise<void> = async () => {};
  const runner = createJobRunner(store, (r) => ((runJob = r), { enqueue: (id) => void queued.push(id) }));
  const kind = runner.defineJob<{ n: number }>("test-kind", {
    access: { watch: "waves.read", cancel: "waves.plan" },
    messages: { start: "Starting", cancelled: "Cancelled; nothing changed." },
    failureMessage: (e) => `Failed: ${(e as Error).message}`,
    run,
  });
  const start = (u: SignedInUser, key = "k") =>
    runner.startJob(kind, { siteId: 1, key, userId: u.id, message: "Waiting", input: { n: 7 } }, refusal);
  const drain = () => Promise.all(queued.splice(0).map((id) => runJob(id)));
  return { runner, rows, start, drain, queued };
}

describe("starting and joining a job", () => {
  it("the same person asking again joins their job; someone else gets 409 naming who started it", async () => {
    const { start, queued } = setUp(async ({ finish }) => finish(null, { message: "ok", result: 1 }));
    const first = await start(user("ann"));
    expect(first.status).toBe("queued");
    expect((await start(user("ann"))).id).toBe(first.id);
    expect(queued, "a joined job is not queued twice").toEqual([first.id]);
    const refused = await start(user("bob")).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(HttpError);
    expect(refused).toMatchObject({
      status: 409,
      message: "Ann has it (queued)",
      extra: { jobId: first.id, startedBy: "Ann" },
    });
  });

  it("runs the job from its stored input and ends it done with its result", async () => {
    const seen: unknown[] = [];
    const { start, drain, rows } = setUp(async ({ input, userId, siteId, finish }) => {
      seen.push(input, userId, siteId);
      await finish(null, { message: "Done it", result: { n: input.n } });
    });
    const job = await start(user("ann"));
    await drain();
    expect(seen).toEqual([{ n: 7 }, "ann", 1]);
    expect(rows.get(job.id)).toMatchObject({ status: "done", progress: 1, message: "Done it", result: { n: 7 } });
  });

  it("a failure ends the job failed with the kind's words; work that ends without a result fails too", async () => {
    const a = setUp(async () => {
      throw new Error("boom");
    });
    const job = await a.start(user("ann"));
    await a.drain();
    expect(a.rows.get(job.id)).toMatchObject({ status: "failed", message: "Failed: boom" });
    const b = setUp(async () => {});
    const other = await b.start(user("ann"));
    await b.drain();
    expect(b.rows.get(other.id)?.status).toBe("failed");
  });
});

describe("cancelling a job", () => {
  it("a queued job cancelled before it runs is never run", async () => {
    let ran = false;
    const { runner, start, drain, rows } = setUp(async () => void (ran = true));
    const job = await start(user("ann"));
    expect(await runner.cancelJob(user("ann"), job.id)).toMatchObject({
      stopped: true,
      job: { status: "cancelled", message: "Cancelled; nothing changed." },
    });
    await drain();
    expect(ran).toBe(false);
    expect(rows.get(job.id)?.status).toBe("cancelled");
    expect(await runner.cancelJob(user("ann"), job.id), "a repeated cancel answers like the first").toMatchObject({
      stopped: false,
      job: { status: "cancelled" },
    });
  });

  it("a running job sees its signal abort, and its finish cannot undo the cancel", async () => {
    let release: () => void = () => {};
    const outcome: unknown[] = [];
    const { runner, start, drain, rows } = setUp(async ({ signal, finish }) => {
      await new Promise<void>((r) => (release = r));
      outcome.push(signal.aborted);
      outcome.push(await finish(null, { message: "too late", result: null }).catch((e: unknown) => e));
    });
    const job = await start(user("ann"));
    const running = drain();
    await new Promise((r) => setTimeout(r, 0));
    expect((await runner.cancelJob(user("ann"), job.id)).stopped).toBe(true);
    release();
    await running;
    expect(outcome[0]).toBe(true);
    expect(outcome[1]).toBeInstanceOf(JobNoLongerRunning);
    expect(rows.get(job.id)).toMatchObject({ status: "cancelled", message: "Cancelled; nothing changed." });
  });

  it("a job cancelled elsewhere (only in its row) stops at its next progress write", async () => {
    const { start, drain, rows } = setUp(async ({ signal, progress }) => {
      rows.get([...rows.keys()][0]!)!.status = "cancelled";
      progress(0.5, "Halfway");
      await new Promise<void>((resolve, reject) =>
        signal.addEventListener("abort", () => reject(new Error("aborted")), { once: true }),
      );
    });
    const job = await start(user("ann"));
    await drain();
    expect(rows.get(job.id)?.status).toBe("cancelled");
  });

  it("a cancel after the job finished is refused with 409; a role that may only watch gets 403; another site's job is not there", async () => {
    const { runner, start, drain } = setUp(async ({ finish }) =>
      finish(null, { message: "Planned 3 batches", result: null }),
    );
    const job = await start(user("ann"));
    await drain();
    await expect(runner.cancelJob(user("ann"), job.id)).rejects.toMatchObject({
      status: 409,
      message: expect.stringMatching(/already finished \(Planned 3 batches\)/),
    });
    await expect(runner.cancelJob(user("pat", "picker"), job.id)).rejects.toMatchObject({ status: 404 });
    expect((await runner.watchJob(user("pam", "planner"), job.id)).status).toBe("done");
    await expect(runner.watchJob({ ...user("ann"), siteId: 2 }, job.id)).rejects.toMatchObject({ status: 404 });
  });
});
