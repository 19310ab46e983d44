import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Knex } from "knex";
import type { RowDataPacket } from "mysql2";
import type mysql from "mysql2/promise";
import { api, ORIGIN, signInAs } from "../support/app";
import { smallDocument } from "../support/documents";
import { waitForJob } from "../support/jobs";
import { appUserConnection } from "../support/db-direct";
import { closeDb, db } from "@/db/knex";
import { createOrJoinJob, getJob, updateJob } from "@/db/jobs";

// Cancelling races the job's own last write. These tests hold a row lock the job needs, so the job
// is stopped at a known point (seen waiting in MariaDB's process list) while the cancel arrives.

let watcher: mysql.Connection;
let admin = "";
let planner = "";
beforeAll(async () => {
  watcher = await appUserConnection();
  admin = await signInAs("admin");
  planner = await signInAs("planner");
});
afterAll(async () => {
  await watcher?.end();
  await closeDb();
});

/** Until some other connection of the app's user is waiting in a statement like `like`. */
async function waitForBlockedQuery(like: string) {
  for (let i = 0; i < 600; i++) {
    const [rows] = await watcher.query<RowDataPacket[]>(
      "SELECT ID FROM information_schema.PROCESSLIST WHERE USER = ? AND ID <> CONNECTION_ID() AND COMMAND = 'Query' AND INFO LIKE ?",
      [process.env.DB_USER, like],
    );
    if (rows.length > 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no statement like ${like} was waiting`);
}

/** Holds `table` row `id` FOR UPDATE on a connection of the test's own until release(). */
async function holdRow(table: string, id: number) {
  const trx: Knex.Transaction = await db().transaction();
  await trx(table).where({ id }).forUpdate().first("id");
  return {
    release: () => trx.rollback(),
    // Queued behind the job's own FOR UPDATE on the row, so this returns once the job's transaction has ended.
    afterJobsTransaction: async () =>
      db().transaction(async (t) => void (await t(table).where({ id }).forUpdate().first("id"))),
  };
}

let n = 0;
async function savedFloorPlan() {
  const res = await api()
    .post("/api/floor-plans")
    .set("Cookie", admin)
    .set("Origin", ORIGIN)
    .send({ name: `Cancel test ${Date.now()}-${++n}`, widthM: 12, heightM: 7, cellMm: 1000 });
  expect(res.status).toBe(201);
  const id = res.body.id as number;
  const saved = await api()
    .put(`/api/floor-plans/${id}/draft`)
    .set("Cookie", admin)
    .set("Origin", ORIGIN)
    .send({ version: 1, document: smallDocument() });
  expect(saved.status).toBe(200);
  return { id, version: saved.body.version as number };
}
const versionsOf = async (floorPlanId: number) =>
  Number((await db()("layout_versions").where({ floor_plan_id: floorPlanId }).count({ n: "*" }).first())?.n);

describe("cancelling a publish", () => {
  it("a cancel that arrives first wins: 202 cancelled, the job stays cancelled and no layout version is made", async () => {
    const plan = await savedFloorPlan();
    const lock = await holdRow("floor_plans", plan.id);
    let jobId = "";
    try {
      const start = await api()
        .post(`/api/floor-plans/${plan.id}/publish`)
        .set("Cookie", admin)
        .set("Origin", ORIGIN)
        .send({ version: plan.version });
      expect(start.status).toBe(202);
      jobId = start.body.jobId;
      // The job has computed the layout and waits to store it.
      await waitForBlockedQuery("%floor_plans%for update%");
      const cancel = await api().delete(`/api/jobs/${jobId}`).set("Cookie", admin).set("Origin", ORIGIN);
      expect(cancel.status, JSON.stringify(cancel.body)).toBe(202);
      expect(cancel.body.job.status).toBe("cancelled");
    } finally {
      await lock.release();
    }
    await lock.afterJobsTransaction();
    expect(await versionsOf(plan.id)).toBe(0);
    expect((await waitForJob(admin, jobId)).status).toBe("cancelled");
    const again = await api().delete(`/api/jobs/${jobId}`).set("Cookie", admin).set("Origin", ORIGIN);
    expect(again.status, "a repeated cancel answers like the first did").toBe(200);
    expect(again.body.job.status).toBe("cancelled");
  });

  it("a cancel after the job finished gets 409 and the job stays done", async () => {
    const plan = await savedFloorPlan();
    const start = await api()
      .post(`/api/floor-plans/${plan.id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: plan.version });
    const done = await waitForJob(admin, start.body.jobId);
    expect(done.status).toBe("done");
    const cancel = await api().delete(`/api/jobs/${start.body.jobId}`).set("Cookie", admin).set("Origin", ORIGIN);
    expect(cancel.status).toBe(409);
    expect(cancel.body.error).toMatch(/already finished/);
    expect(cancel.body.job.status).toBe("done");
    expect((await waitForJob(admin, start.body.jobId)).status).toBe("done");
    expect(await versionsOf(plan.id)).toBe(1);
  });
});

describe("cancelling a wave plan", () => {
  it("a cancel while the plan is being stored wins: the wave stays a draft without batches", async () => {
    // Order lines of this test only, with a cut-off before anything else's, so the wave holds just these.
    const items = (await api().get("/api/items").set("Cookie", planner)).body.items as {
      sku: string;
      bins: string[];
    }[];
    const skus = items
      .filter((i) => i.bins.length > 0)
      .slice(0, 3)
      .map((i) => i.sku);
    const run = `CANCEL-${Date.now().toString(36).toUpperCase()}`;
    const csv =
      [
        "Order number,Line,SKU,Quantity,Cut-off",
        ...skus.map((sku, k) => `${run}-${k},1,${sku},1,2001-01-01 10:00`),
      ].join("\n") + "\n";
    const imported = await api()
      .post("/api/imports/orders")
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .field("layoutVersionId", "1")
      .attach("file", Buffer.from(csv), "orders.csv");
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const created = await api()
      .post("/api/waves")
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({
        name: `Cancel test ${run}`,
        layoutVersionId: 1,
        settings: {
          totesPerCart: 4,
          maxLines: 12,
          maxWeightG: 60_000,
          depotId: "D1",
          dropoffId: "P1",
          method: "first-come",
        },
        cutoffBefore: "2001-01-02T00:00:00Z",
      });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const waveId = created.body.id as number;

    const lock = await holdRow("waves", waveId);
    let jobId = "";
    try {
      const start = await api()
        .post(`/api/waves/${waveId}/plan`)
        .set("Cookie", planner)
        .set("Origin", ORIGIN)
        .send({ version: 1 });
      expect(start.status, JSON.stringify(start.body)).toBe(202);
      jobId = start.body.jobId;
      await waitForBlockedQuery("%waves%for update%");
      const cancel = await api().delete(`/api/jobs/${jobId}`).set("Cookie", planner).set("Origin", ORIGIN);
      expect(cancel.status, JSON.stringify(cancel.body)).toBe(202);
    } finally {
      await lock.release();
    }
    await lock.afterJobsTransaction();
    const wave = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body;
    expect(wave.wave.status).toBe("draft");
    expect(wave.batches).toEqual([]);
    expect((await waitForJob(planner, jobId)).status).toBe("cancelled");
  });
});

describe("the job's own finish and a cancel at the same moment", () => {
  it("a cancel arriving while the job stores its result does not overwrite done", async () => {
    const { job } = await createOrJoinJob(1, "test-race", `test-race:${Date.now()}`, null, "Waiting to start");
    await updateJob(job.id, { status: "running", message: "Working" });
    const finishing = await db().transaction();
    let cancel: Promise<unknown> | undefined;
    try {
      await updateJob(job.id, { status: "done", progress: 1, message: "Finished" }, finishing);
      cancel = updateJob(job.id, { status: "cancelled", message: "Cancelled." });
      await waitForBlockedQuery("update `jobs`%");
      await finishing.commit();
    } catch (e) {
      await finishing.rollback();
      throw e;
    }
    expect(await cancel).toBe(false);
    expect((await getJob(1, job.id))?.status).toBe("done");
    expect(await updateJob(job.id, { status: "running", progress: 0.5 }), "a finished job never runs again").toBe(
      false,
    );
    expect((await getJob(1, job.id))?.status).toBe("done");
  });
});
