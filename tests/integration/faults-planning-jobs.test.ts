import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { api, demoAccount, ORIGIN, signInAs } from "../support/app";
import { startSecondServer, type SecondServer } from "../support/second-server";
import { closeDb } from "@/db/knex";

// A planning job whose worker runs out of its memory cap, or over its time limit, on a second server
// started from the same build with those two settings (README, "Settings"): the job ends failed with
// words a planner can act on, the wave is as it was and can be planned again, the server stays up.

const ORDER_HEADER = ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"];
const RUN = `J${Date.now().toString(36).toUpperCase()}`;
// A cut-off long before any other test's orders, so this wave takes only the orders made here.
const CUTOFF = "2020-01-06 08:00";
const CUTOFF_BEFORE = "2020-01-06T12:00:00Z";

let planner = "";
let waveId = 0;
let server: SecondServer | null = null;

afterEach(async () => {
  await server?.stop();
  server = null;
});
afterAll(closeDb);

beforeAll(async () => {
  planner = await signInAs("planner");
  const items = await api().get("/api/items").set("Cookie", planner);
  const skus: string[] = items.body.items
    .filter((i: { bins: string[] }) => i.bins.length > 0)
    .map((i: { sku: string }) => i.sku)
    .slice(0, 12);
  const rows = [ORDER_HEADER.join(",")];
  for (let i = 0; i < 12; i++) rows.push([`${RUN}-${i}`, 1, skus[i % skus.length], 1, CUTOFF, 2, ""].join(","));
  const imported = await api()
    .post("/api/imports/orders")
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .field("layoutVersionId", "1")
    .attach("file", Buffer.from(rows.join("\n") + "\n"), `${RUN}.csv`);
  expect(imported.status, JSON.stringify(imported.body)).toBe(201);
  const wave = await api()
    .post("/api/waves")
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .send({
      name: `Fault wave ${RUN}`,
      layoutVersionId: 1,
      settings: {
        totesPerCart: 4,
        maxLines: 12,
        maxWeightG: 60_000,
        depotId: "D1",
        dropoffId: "P1",
        method: "savings",
      },
      cutoffBefore: CUTOFF_BEFORE,
    });
  expect(wave.status, JSON.stringify(wave.body)).toBe(201);
  expect(wave.body.orders).toBe(12);
  waveId = wave.body.id;
});

async function signInOn(s: SecondServer): Promise<string> {
  const a = demoAccount("planner");
  const res = await s.api().post("/api/session").set("Origin", s.origin).send({ email: a.email, password: a.password });
  expect(res.status).toBe(200);
  return [res.headers["set-cookie"]]
    .flat()
    .find((c): c is string => typeof c === "string" && c.startsWith("trailbin_session="))!
    .split(";")[0]!;
}

async function waveNow(cookie: string, on = api) {
  const res = await on().get(`/api/waves/${waveId}`).set("Cookie", cookie);
  expect(res.status).toBe(200);
  return res.body as { wave: { status: string; version: number }; batches: unknown[] };
}

/** Plans the wave on `s` and follows the job through GET /api/jobs/[id] until it ends. */
async function planOn(s: SecondServer, cookie: string) {
  const before = await waveNow(cookie, s.api);
  const start = await s
    .api()
    .post(`/api/waves/${waveId}/plan`)
    .set("Cookie", cookie)
    .set("Origin", s.origin)
    .send({ version: before.wave.version });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  for (let i = 0; i < 600; i++) {
    const res = await s.api().get(`/api/jobs/${start.body.jobId}`).set("Cookie", cookie);
    expect(res.status).toBe(200);
    if (["done", "failed", "cancelled"].includes(res.body.job.status))
      return { before, job: res.body.job as { status: string; message: string } };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error("the planning job did not end");
}

/** The server that ran the failed job still serves: health, a page of data, a sign-in. */
async function stillServing(s: SecondServer, cookie: string) {
  expect((await s.api().get("/api/health")).status).toBe(200);
  expect((await s.api().get("/api/waves").set("Cookie", cookie)).status).toBe(200);
  expect(await signInOn(s)).toMatch(/^trailbin_session=/);
}

describe("a planning job that fails in its worker", () => {
  it("the worker over its memory cap (WAVE_WORKER_MAX_HEAP_MB): job failed with words, wave unchanged, server up", async () => {
    // 4 MB is less than the worker needs to load its code and take the job (8 MB already plans this
    // small wave), so it dies of "JS heap out of memory" with the job in hand, every time.
    server = await startSecondServer({ WAVE_WORKER_MAX_HEAP_MB: "4" }, "heap");
    const cookie = await signInOn(server);
    const { before, job } = await planOn(server, cookie);
    expect(job.status).toBe("failed");
    expect(job.message).toMatch(
      /^Planning failed: the planning worker stopped unexpectedly because it ran out of memory\. The wave is unchanged and can be planned again\. .*smaller wave/,
    );
    const after = await waveNow(cookie, server.api);
    expect(after.wave).toEqual(before.wave);
    expect(after.batches).toEqual(before.batches);
    await stillServing(server, cookie);
  });

  it("over its time limit (WAVE_PLAN_TIME_LIMIT_MS): job failed with the limit named, wave unchanged, server up", async () => {
    server = await startSecondServer({ WAVE_PLAN_TIME_LIMIT_MS: "50" }, "time-limit");
    const cookie = await signInOn(server);
    const { before, job } = await planOn(server, cookie);
    expect(job.status).toBe("failed");
    expect(job.message).toMatch(
      /^Planning failed: it took longer than the time limit of 50 ms and was stopped\. The wave is unchanged and can be planned again\./,
    );
    const after = await waveNow(cookie, server.api);
    expect(after.wave).toEqual(before.wave);
    await stillServing(server, cookie);
  });

  it("the same wave then plans on the usual server: the failures left nothing in the way", async () => {
    const before = await waveNow(planner);
    expect(before.wave.status).toBe("draft");
    const start = await api()
      .post(`/api/waves/${waveId}/plan`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: before.wave.version });
    expect(start.status, JSON.stringify(start.body)).toBe(202);
    let job: { status: string; message: string } = { status: "", message: "" };
    for (let i = 0; i < 600 && !["done", "failed", "cancelled"].includes(job.status); i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = (await api().get(`/api/jobs/${start.body.jobId}`).set("Cookie", planner)).body.job;
    }
    expect(job.status, job.message).toBe("done");
    const after = await waveNow(planner);
    expect(after.wave.status).toBe("planned");
    expect(after.batches.length).toBeGreaterThan(0);
  });
});
