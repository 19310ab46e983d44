import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, demoAccount, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { auditMark, auditedSince } from "../support/audit";
import { TestOrders } from "../support/wave-orders";
import { assign, confirmLine, floorOf, floorRow, pickViewOf, releasedShiftWave } from "../support/shift-wave";
import { closeDb, db } from "@/db/knex";
import { getSite } from "@/db/sites";
import { estimateSeconds, siteTiming } from "@/lib/batching/estimate";

// Every test here works batches of its own released wave (one order of two lines per batch) and
// pickers it makes, so the demo's batches and the other files' pickers are left as they were.
const TAG = `SF${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
const SUPERVISOR = demoAccount("supervisor").displayName;

type Picker = { id: string; name: string; cookie: string };
let planner: string;
let supervisor: string;
let batches: { id: number; number: number; distanceMm: number; lineCount: number }[];
let a: Picker, b: Picker, c: Picker;
let nextBatch = 0;
/** A batch of the wave no test has used yet. */
const freshBatch = () => batches[nextBatch++]!;

async function picker(): Promise<Picker> {
  const u = await makeUser("picker");
  const cookie = await signIn(u.email, u.password);
  const me = await api().get("/api/session").set("Cookie", cookie);
  return { id: u.id, name: me.body.user.displayName, cookie };
}

beforeAll(async () => {
  planner = await signInAs("planner");
  supervisor = await signInAs("supervisor");
  ({ batches } = await releasedShiftWave(planner, TAG, 12, fixtures));
  [a, b, c] = [await picker(), await picker(), await picker()];
}, 120_000);

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

describe("the floor follows a batch's life", () => {
  it("shows taken, started, lines done and finished as a picker works it, against its estimate", async () => {
    const batch = freshBatch();
    const waiting = await floorRow(supervisor, batch.id);
    expect(waiting).toMatchObject({
      floorStatus: "waiting",
      pickerId: null,
      takenAt: null,
      startedAt: null,
      finishedAt: null,
      doneLines: 0,
      lineCount: 2,
      actualSeconds: null,
      late: false,
    });
    const site = await getSite((await db()("users").where({ id: a.id }).first("site_id")).site_id);
    expect(waiting.estimateSeconds).toBe(
      Math.round(estimateSeconds({ distanceMm: batch.distanceMm, lines: batch.lineCount }, siteTiming(site))),
    );

    const take = await api()
      .post(`/api/batches/${batch.id}/take`)
      .set("Cookie", a.cookie)
      .set("Origin", ORIGIN)
      .send({ version: waiting.version });
    expect(take.status, JSON.stringify(take.body)).toBe(200);
    const taken = await floorRow(supervisor, batch.id);
    expect(taken).toMatchObject({ floorStatus: "taken", pickerId: a.id, pickerName: a.name, startedAt: null });
    expect(taken.takenAt).not.toBeNull();

    const view = await pickViewOf(a.cookie, batch.id);
    expect(view.lines).toHaveLength(2);
    const first = await confirmLine(a.cookie, batch.id, view.lines[0]!, view.version);
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    const started = await floorRow(supervisor, batch.id);
    expect(started).toMatchObject({ floorStatus: "in progress", doneLines: 1, finishedAt: null });
    expect(started.startedAt).not.toBeNull();
    expect(new Date(started.startedAt!).getTime()).toBeGreaterThanOrEqual(new Date(taken.takenAt!).getTime());
    expect(started.actualSeconds).toBeGreaterThanOrEqual(0);

    const second = await confirmLine(a.cookie, batch.id, view.lines[1]!, view.version);
    expect(second.status, JSON.stringify(second.body)).toBe(200);
    const done = await floorRow(supervisor, batch.id);
    expect(done).toMatchObject({ floorStatus: "done", doneLines: 2, pickerName: a.name });
    const actual = Math.round((new Date(done.finishedAt!).getTime() - new Date(done.startedAt!).getTime()) / 1000);
    expect(done.actualSeconds).toBe(actual);
    expect(done.late).toBe(actual > done.estimateSeconds);

    // Holding nothing unfinished now, the picker is idle since that batch finished.
    const me = (await floorOf(supervisor)).pickers.find((p) => p.id === a.id)!;
    expect(me).toMatchObject({ openBatches: 0, onShift: true, idleSince: done.finishedAt });
  });

  it("a finished batch cannot be assigned or moved", async () => {
    const done = (await floorOf(supervisor)).batches.find((x) => x.floorStatus === "done" && x.pickerId === a.id)!;
    const res = await assign(supervisor, done.id, { pickerId: b.id, version: done.version });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/picked to the end; a finished batch cannot be assigned or moved/);
    expect((await floorRow(supervisor, done.id)).pickerId).toBe(a.id);
  });
});

describe("who may watch and change the floor", () => {
  it("pickers are refused the floor and its changes; planners and supervisors see it; nobody signed out does", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    expect((await api().get("/api/floor").set("Cookie", a.cookie)).status).toBe(403);
    const refused = await assign(a.cookie, batch.id, { pickerId: a.id, version: row.version });
    expect(refused.status).toBe(403);
    expect((await api().get("/api/floor")).status).toBe(401);
    expect((await api().get("/api/floor").set("Cookie", planner)).status).toBe(200);
    expect((await api().get("/floor").set("Cookie", a.cookie)).status).toBe(403);
    expect((await api().get("/floor").set("Cookie", supervisor)).status).toBe(200);
    // Nothing changed hands.
    expect((await floorRow(supervisor, batch.id)).pickerId).toBeNull();
    nextBatch--;
  });
});

describe("assigning, taking back and moving", () => {
  it("assigns a waiting batch: the picker sees who assigned it, the change is audited, a resend is the same change", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    const mark = await auditMark();
    const res = await assign(supervisor, batch.id, { pickerId: b.id, version: row.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.message).toContain(b.name);
    const after = await floorRow(supervisor, batch.id);
    expect(after).toMatchObject({ floorStatus: "taken", pickerId: b.id, version: row.version + 1 });
    expect(after.takenAt).not.toBeNull();
    expect(after.lastHandover).toMatchObject({ kind: "assigned", byName: SUPERVISOR, toName: b.name });
    const audited = await auditedSince(mark, "batch.assigned");
    expect(audited.map((x) => x.subject)).toEqual([`batch:${batch.id}`]);

    const mine = await api().get("/api/my-batches").set("Cookie", b.cookie);
    const listed = mine.body.batches.find((x: { id: number }) => x.id === batch.id);
    expect(listed.assignedBy).toMatchObject({ name: SUPERVISOR });
    const page = await api().get("/my-batches").set("Cookie", b.cookie);
    expect(page.text.replace(/<!-- -->/g, "")).toContain(`Assigned to you by ${SUPERVISOR}`);

    // The answer was lost and the supervisor's browser sends it again: the same change, not a 409.
    const again = await assign(supervisor, batch.id, { pickerId: b.id, version: row.version });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect((await floorRow(supervisor, batch.id)).version).toBe(row.version + 1);
    expect(await auditedSince(mark, "batch.assigned")).toHaveLength(1);
    // Back to the pool, so b has room under the cap for the tests that follow.
    expect((await assign(supervisor, batch.id, { pickerId: null, version: row.version + 1 })).status).toBe(200);
  });

  it("refuses a target that is not an active picker at the site", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    const supervisorId = (
      await db()("users")
        .where({ email: demoAccount("supervisor").email })
        .first("id")
    ).id;
    const gone = await makeUser("picker");
    const admin = await signInAs("admin");
    const disable = await api()
      .patch(`/api/users/${gone.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: gone.version, disabled: true });
    expect(disable.status, JSON.stringify(disable.body)).toBe(200);
    for (const pickerId of [supervisorId, gone.id, "no-such-user"]) {
      const res = await assign(supervisor, batch.id, { pickerId, version: row.version });
      expect(res.status, pickerId).toBe(422);
      expect(res.body.error).toMatch(/not an active picker at this site/);
    }
    expect(await floorRow(supervisor, batch.id)).toMatchObject({ pickerId: null, version: row.version });
    nextBatch--;
  });

  it("respects the cap of unfinished batches per picker, naming it; taking one back makes room", async () => {
    const floor = await floorOf(supervisor);
    const cap = floor.capPerPicker;
    expect(cap).toBeGreaterThan(0);
    expect(batches.length - nextBatch).toBeGreaterThan(cap);
    const given: number[] = [];
    for (let i = 0; i < cap; i++) {
      const batch = freshBatch();
      const row = await floorRow(supervisor, batch.id);
      const res = await assign(supervisor, batch.id, { pickerId: c.id, version: row.version });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      given.push(batch.id);
    }
    const one = freshBatch();
    const row = await floorRow(supervisor, one.id);
    const full = await assign(supervisor, one.id, { pickerId: c.id, version: row.version });
    expect(full.status).toBe(409);
    expect(full.body.error).toContain(c.name);
    expect(full.body.error).toContain(`the most this site allows (${cap} per picker)`);
    expect((await floorRow(supervisor, one.id)).pickerId).toBeNull();
    // The picker's own take counts against the same cap.
    const own = await api()
      .post(`/api/batches/${one.id}/take`)
      .set("Cookie", c.cookie)
      .set("Origin", ORIGIN)
      .send({ version: row.version });
    expect(own.status).toBe(409);

    const back = await floorRow(supervisor, given[0]!);
    const mark = await auditMark();
    const taken = await assign(supervisor, back.id, { pickerId: null, version: back.version });
    expect(taken.status, JSON.stringify(taken.body)).toBe(200);
    expect(await floorRow(supervisor, back.id)).toMatchObject({
      pickerId: null,
      takenAt: null,
      floorStatus: "waiting",
    });
    expect((await auditedSince(mark, "batch.taken-back")).map((x) => x.subject)).toEqual([`batch:${back.id}`]);
    const nobody = await assign(supervisor, back.id, { pickerId: null, version: back.version + 1 });
    expect(nobody.status).toBe(409);
    expect(nobody.body.error).toMatch(/Nobody holds batch/);
    const room = await assign(supervisor, one.id, { pickerId: c.id, version: row.version });
    expect(room.status, JSON.stringify(room.body)).toBe(200);
    // c's batches go back to the pool for the tests that follow.
    for (const id of [...given.slice(1), one.id]) {
      const r = await floorRow(supervisor, id);
      expect((await assign(supervisor, id, { pickerId: null, version: r.version })).status).toBe(200);
    }
  });

  it("two supervisors moving one batch at once: one wins, the other gets 409 saying what changed", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    const other = await makeUser("supervisor");
    const second = await signIn(other.email, other.password);
    const [one, two] = await Promise.all([
      assign(supervisor, batch.id, { pickerId: a.id, version: row.version }),
      assign(second, batch.id, { pickerId: b.id, version: row.version }),
    ]);
    expect([one.status, two.status].sort()).toEqual([200, 409]);
    const lost = one.status === 409 ? one : two;
    const winner = one.status === 200 ? a : b;
    expect(lost.body.error).toMatch(/changed since your screen loaded it/);
    expect(lost.body.error).toContain(`${winner.name} holds it now`);
    expect(await floorRow(supervisor, batch.id)).toMatchObject({ pickerId: winner.id, version: row.version + 1 });
    expect(Number((await db()("batch_handovers").where({ batch_id: batch.id }).count({ n: "*" }).first())!.n)).toBe(1);
    // Back to the pool, so whoever won holds nothing of it in the tests that follow.
    expect((await assign(supervisor, batch.id, { pickerId: null, version: row.version + 1 })).status).toBe(200);
  });

  it("a picker who took the batch meanwhile wins over the supervisor's stale assignment", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    const take = await api()
      .post(`/api/batches/${batch.id}/take`)
      .set("Cookie", c.cookie)
      .set("Origin", ORIGIN)
      .send({ version: row.version });
    expect(take.status, JSON.stringify(take.body)).toBe(200);
    const late = await assign(supervisor, batch.id, { pickerId: b.id, version: row.version });
    expect(late.status).toBe(409);
    expect(late.body.error).toContain(`${c.name} holds it now (they took it themselves)`);
    expect((await floorRow(supervisor, batch.id)).pickerId).toBe(c.id);
  });

  it("moves a started batch: the old holder's next confirm is refused naming who moved it, the new holder continues", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    expect((await assign(supervisor, batch.id, { pickerId: b.id, version: row.version })).status).toBe(200);
    const seen = await pickViewOf(b.cookie, batch.id);
    expect(seen.status).toBe(200);
    const [first, second] = seen.lines;
    expect((await confirmLine(b.cookie, batch.id, first!, seen.version)).status).toBe(200);

    const started = await floorRow(supervisor, batch.id);
    expect(started.floorStatus).toBe("in progress");
    const mark = await auditMark();
    const moved = await assign(supervisor, batch.id, { pickerId: a.id, version: started.version });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect((await auditedSince(mark, "batch.moved")).map((x) => x.subject)).toEqual([`batch:${batch.id}`]);
    const logged = await db()("audit_log")
      .where({ event: "batch.moved", subject: `batch:${batch.id}` })
      .first("detail");
    expect(typeof logged.detail === "string" ? JSON.parse(logged.detail) : logged.detail).toEqual({
      from: b.id,
      to: a.id,
    });

    const message = new RegExp(
      `^${SUPERVISOR} moved this batch to ${a.name} at \\d{1,2}:\\d{2}( [AP]M)?\\. Your confirmed lines are kept\\.$`,
    );
    const refused = await confirmLine(b.cookie, batch.id, second!, seen.version);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(message);
    expect(
      (await db()("batch_lines").where({ order_line_id: second!.orderLineId }).first("pick_status")).pick_status,
    ).toBe("open");
    // The handheld's poll says the same, and so does the page when the picker reloads it.
    const poll = await pickViewOf(b.cookie, batch.id);
    expect(poll.status).toBe(403);
    expect(poll.body.error).toMatch(message);
    const page = await api().get(`/pick/${batch.id}`).set("Cookie", b.cookie);
    expect(page.status).toBe(200);
    expect(page.text.replace(/<!-- -->/g, "")).toMatch(new RegExp(`${SUPERVISOR} moved this batch to ${a.name} at`));
    // The moved-away message is no refusal of someone else's batch: nothing logged as a denial for it.
    expect(
      (await auditedSince(mark, "access.denied")).filter(
        (x) => x.actorUserId === b.id && x.subject?.includes(`${batch.id}`),
      ),
    ).toEqual([]);

    // The new holder sees the confirmed line as picked and continues from the open one.
    const theirs = await pickViewOf(a.cookie, batch.id);
    expect(theirs.status).toBe(200);
    expect(theirs.lines.map((l) => [l.orderLineId, l.pickStatus])).toEqual([
      [first!.orderLineId, "picked"],
      [second!.orderLineId, "open"],
    ]);
    const finish = await confirmLine(a.cookie, batch.id, second!, theirs.version);
    expect(finish.status, JSON.stringify(finish.body)).toBe(200);
    expect(finish.body.batch).toMatchObject({ status: "done", openLines: 0 });
    const done = await floorRow(supervisor, batch.id);
    expect(done).toMatchObject({ floorStatus: "done", pickerId: a.id, doneLines: 2 });
    const bIdle = (await floorOf(supervisor)).pickers.find((p) => p.id === b.id)!;
    expect(bIdle.openBatches).toBe(0);
  });

  it("taking back a started batch: the picker's screen says who took it back; the batch waits for the next picker", async () => {
    const batch = freshBatch();
    const row = await floorRow(supervisor, batch.id);
    expect((await assign(supervisor, batch.id, { pickerId: b.id, version: row.version })).status).toBe(200);
    const seen = await pickViewOf(b.cookie, batch.id);
    expect((await confirmLine(b.cookie, batch.id, seen.lines[0]!, seen.version)).status).toBe(200);
    const started = await floorRow(supervisor, batch.id);
    expect((await assign(supervisor, batch.id, { pickerId: null, version: started.version })).status).toBe(200);
    const refused = await confirmLine(b.cookie, batch.id, seen.lines[1]!, seen.version);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(
      new RegExp(
        `^${SUPERVISOR} took this batch back at \\d{1,2}:\\d{2}( [AP]M)?\\. Your confirmed lines are kept\\.$`,
      ),
    );
    expect(await floorRow(supervisor, batch.id)).toMatchObject({
      floorStatus: "waiting",
      pickerId: null,
      doneLines: 1,
    });
  });
});
