import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { loadLayoutGraph } from "@/db/layout-versions";
import { planPick } from "@/lib/routing/plan";
import { waitForJob } from "../support/jobs";

afterAll(closeDb);

const LIMITS = { totesPerCart: 4, maxLines: 12, maxWeightG: 60_000 };

/** A wave of Wednesday's open demo orders up to a cut-off, on the demo layout version 1. */
async function newWave(cookie: string, cutoffBefore: string | undefined, method: "first-come" | "savings" = "savings") {
  const res = await api()
    .post("/api/waves")
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({
      name: `Test wave ${Date.now()}`,
      layoutVersionId: 1,
      settings: { ...LIMITS, depotId: "D1", dropoffId: "P1", method },
      cutoffBefore,
      priorities: [1, 2, 3],
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as number;
}

async function plan(cookie: string, id: number) {
  const wave = (await api().get(`/api/waves/${id}`).set("Cookie", cookie)).body.wave;
  const start = await api()
    .post(`/api/waves/${id}/plan`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ version: wave.version });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(cookie, start.body.jobId);
  expect(job.status, job.message).toBe("done");
  return (await api().get(`/api/waves/${id}`).set("Cookie", cookie)).body;
}

describe("planning a wave", () => {
  it("cuts the orders into batches within every cart limit, each line in exactly one batch, routes as the engine computes them", async () => {
    const planner = await signInAs("planner");
    const id = await newWave(planner, "2026-11-25T12:00:00Z");
    const { wave, batches } = await plan(planner, id);
    expect(wave.status).toBe("planned");
    expect(batches.length).toBeGreaterThan(0);
    for (const b of batches) {
      expect(b.toteCount).toBeLessThanOrEqual(LIMITS.totesPerCart);
      expect(b.lineCount).toBeLessThanOrEqual(LIMITS.maxLines);
      expect(b.weightG).toBeLessThanOrEqual(LIMITS.maxWeightG);
    }
    // Every line of every batched order is in exactly one batch (the primary key makes twice impossible).
    const unbatchable = new Set(wave.unbatchable.map((u: { orderId: number }) => u.orderId));
    const lines = await db()("order_lines as l")
      .join("wave_orders as wo", "wo.order_id", "l.order_id")
      .where("wo.wave_id", id)
      .select("l.id", "l.order_id");
    const placed = await db()("batch_lines as bl")
      .join("batches as b", "b.id", "bl.batch_id")
      .where("b.wave_id", id)
      .select("bl.order_line_id");
    const placedIds = new Set(placed.map((p: { order_line_id: number }) => p.order_line_id));
    for (const l of lines) expect(placedIds.has(l.id) || unbatchable.has(l.order_id)).toBe(true);
    expect(placed.length).toBe(placedIds.size);

    // The stored route of each batch equals a fresh run of the engine on the stored layout matrix.
    const { graph, matrix } = await loadLayoutGraph(1);
    for (const b of batches.slice(0, 8)) {
      const codes = await db()("batch_lines")
        .where({ batch_id: b.id })
        .orderBy([{ column: "tote" }, { column: "order_line_id" }])
        .pluck("bin_code");
      const fresh = planPick(graph, matrix, { from: "D1", to: "P1", binCodes: codes });
      expect(b.distanceMm).toBe(fresh.lengthMm);
      expect(b.baselineMm).toBe(fresh.baselineMm);
      expect(b.optimal).toBe(fresh.optimal);
      expect(b.stopCount).toBe(fresh.stops.length);
    }
    expect(wave.distanceMm).toBe(batches.reduce((a: number, b: { distanceMm: number }) => a + b.distanceMm, 0));
  });

  it("a second click on Plan joins the running job", async () => {
    const planner = await signInAs("planner");
    const id = await newWave(planner, "2026-11-25T14:30:00Z", "first-come");
    const a = await api()
      .post(`/api/waves/${id}/plan`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: 1 });
    const b = await api()
      .post(`/api/waves/${id}/plan`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: 1 });
    expect(a.status).toBe(202);
    expect(b.body.jobId).toBe(a.body.jobId);
    await waitForJob(planner, a.body.jobId);
  });

  it("two planners re-planning the same wave at once: exactly one plans, the other gets 409 naming who", async () => {
    const planner = await signInAs("planner");
    const second = await makeUser("planner");
    const secondCookie = await signIn(second.email, second.password);
    const id = await newWave(planner, "2026-11-25T23:59:00Z", "first-come");
    const first = (await plan(planner, id)).wave;
    const replan = (cookie: string) =>
      api().post(`/api/waves/${id}/plan`).set("Cookie", cookie).set("Origin", ORIGIN).send({ version: first.version });
    const answers = await Promise.all([replan(planner), replan(secondCookie)]);
    expect(answers.map((r) => r.status).sort()).toEqual([202, 409]);
    const winner = answers.find((r) => r.status === 202)!;
    const loser = answers.find((r) => r.status === 409)!;
    expect(loser.body.error).toMatch(/is planning this wave right now|has just planned this wave/);
    const winnerName = (
      await api()
        .get("/api/session")
        .set("Cookie", winner === answers[0] ? planner : secondCookie)
    ).body.user.displayName;
    expect(loser.body.startedBy).toBe(winnerName);
    expect(loser.body.error).toContain(winnerName);
    const job = await waitForJob(planner, winner.body.jobId);
    expect(job.status, job.message).toBe("done");
    const after = (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body.wave;
    expect(after.version).toBe(first.version + 1);
  });

  it("orders already in a wave are not taken by the next one", async () => {
    const planner = await signInAs("planner");
    const res = await api()
      .post("/api/waves")
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({
        name: "Everything again",
        layoutVersionId: 1,
        settings: { ...LIMITS, depotId: "D1", dropoffId: "P1", method: "savings" },
        cutoffBefore: "2026-11-25T12:00:00Z",
      });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/already in a wave/);
  });

  it("a wrong depot is refused with the layout's name for it", async () => {
    const planner = await signInAs("planner");
    const res = await api()
      .post("/api/waves")
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({
        name: "x",
        layoutVersionId: 1,
        settings: { ...LIMITS, depotId: "NOPE", dropoffId: "P1", method: "savings" },
      });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/no depot NOPE/);
  });
});

describe("release", () => {
  it("locks the wave: exactly one of two planners releases, re-planning is refused afterwards", async () => {
    const planner = await signInAs("planner");
    const admin = await signInAs("admin");
    const id = await newWave(planner, "2026-11-26T12:00:00Z");
    const { wave } = await plan(planner, id);
    const [a, b] = await Promise.all([
      api()
        .post(`/api/waves/${id}/release`)
        .set("Cookie", planner)
        .set("Origin", ORIGIN)
        .send({ version: wave.version }),
      api().post(`/api/waves/${id}/release`).set("Cookie", admin).set("Origin", ORIGIN).send({ version: wave.version }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const replan = await api()
      .post(`/api/waves/${id}/plan`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: wave.version + 1 });
    expect(replan.status).toBe(409);
    expect(replan.body.error).toMatch(/released/);
    const statuses = await db()("orders")
      .whereIn("id", db()("wave_orders").where({ wave_id: id }).select("order_id"))
      .distinct()
      .pluck("status");
    expect(statuses).toEqual(["released"]);
    // The planner's "wave released" mail was queued with the release, once, even with two tries at it.
    const mails = await db()("outbox")
      .where({ dedupe_key: `wave-released:${id}` })
      .select("to_address", "subject");
    expect(mails).toEqual([
      {
        to_address: "planner@bramblegate.example",
        subject: expect.stringMatching(/^Wave released: .* \(\d+ batches\)$/),
      },
    ]);
  });

  it("a retried release by the same planner answers like the first", async () => {
    const planner = await signInAs("planner");
    const id = await newWave(planner, "2026-11-26T16:30:00Z", "first-come");
    const { wave } = await plan(planner, id);
    const first = await api()
      .post(`/api/waves/${id}/release`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: wave.version });
    const again = await api()
      .post(`/api/waves/${id}/release`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: wave.version });
    expect(first.status).toBe(200);
    expect(again.status).toBe(200);
  });
});

describe("cancelling", () => {
  it("a planner can cancel a planning job; the wave stays as it was", async () => {
    const planner = await signInAs("planner");
    const id = await newWave(planner, "2026-11-27T16:30:00Z", "savings");
    const start = await api()
      .post(`/api/waves/${id}/plan`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: 1 });
    const cancel = await api().delete(`/api/jobs/${start.body.jobId}`).set("Cookie", planner).set("Origin", ORIGIN);
    expect([200, 202]).toContain(cancel.status);
    const job = await waitForJob(planner, start.body.jobId);
    // The job may have finished before the cancel arrived; either way it ended cleanly.
    expect(["cancelled", "done"]).toContain(job.status);
    const wave = (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body.wave;
    expect(wave.status).toBe(job.status === "cancelled" ? "draft" : "planned");
  });
});

describe("the planner sees picking as it happens", () => {
  it("a short pick on the floor shows in the wave's short-pick list and its batch's progress", async () => {
    const planner = await signInAs("planner");
    const picker = await signInAs("picker");
    // Whatever no earlier test took, orders without a cut-off included.
    const id = await newWave(planner, undefined, "first-come");
    const { wave } = await plan(planner, id);
    expect(
      (
        await api()
          .post(`/api/waves/${id}/release`)
          .set("Cookie", planner)
          .set("Origin", ORIGIN)
          .send({ version: wave.version })
      ).status,
    ).toBe(200);
    const batch = await db()("batches").where({ wave_id: id, number: 1 }).first("id", "version");
    const took = await api()
      .post(`/api/batches/${batch.id}/take`)
      .set("Cookie", picker)
      .set("Origin", ORIGIN)
      .send({ version: batch.version });
    expect(took.status, JSON.stringify(took.body)).toBe(200);
    const line = await db()("batch_lines as bl")
      .join("order_lines as l", "l.id", "bl.order_line_id")
      .where("bl.batch_id", batch.id)
      .first("bl.order_line_id", "bl.bin_code", "l.quantity");
    const short = await api()
      .post(`/api/batches/${batch.id}/confirm`)
      .set("Cookie", picker)
      .set("Origin", ORIGIN)
      .send({
        idempotencyKey: `short-${id}-${line.order_line_id}`,
        orderLineId: line.order_line_id,
        quantity: 0,
        short: { reason: "empty bin" },
        binCode: line.bin_code,
        batchVersion: took.body.batch.version,
      });
    expect(short.status, JSON.stringify(short.body)).toBeLessThan(300);
    const seen = (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body;
    expect(seen.shortPicks).toEqual([
      expect.objectContaining({
        batchNumber: 1,
        binCode: line.bin_code,
        ordered: line.quantity,
        picked: 0,
        reason: "empty bin",
      }),
    ]);
    expect(seen.batches.find((b: { number: number }) => b.number === 1)).toMatchObject({
      shortLines: 1,
      pickedLines: 0,
    });
  });
});
