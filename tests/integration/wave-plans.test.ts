import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { createWave } from "@/db/waves";
import { loadLayoutGraph } from "@/db/layout-versions";
import { accessDistance } from "@/lib/routing/access";
import { nodeAccessPoint, type AccessPoint, type CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { BatchSummaryDTO, StoredBatch } from "@/lib/contracts/batches";
import type { WavePlanDTO } from "@/lib/contracts/wave-plans";
import { waitForJob } from "../support/jobs";
import { TestOrders } from "../support/wave-orders";

const TAG = `P${Date.now().toString(36).toUpperCase()}`;
const ENDS = { depotId: "D1", dropoffId: "P1" };
const WAVE_SETTINGS = { totesPerCart: 3, maxLines: 12, maxWeightG: 60_000, method: "first-come" as const, ...ENDS };
const VARIANTS = [
  { method: "first-come", totesPerCart: 3, maxLines: 12, maxWeightG: 60_000 },
  { method: "savings", totesPerCart: 2, maxLines: 8, maxWeightG: 40_000 },
];
// How many bins each test order picks from: small, so brute force over every visiting order is cheap.
const ORDER_SIZES = [1, 2, 3, 4, 2, 3, 1, 4, 3];

const fixtures = new TestOrders();
let planner: string;
let plannerId: string;
let layout: { graph: CompactGraph; matrix: DistanceMatrix };

beforeAll(async () => {
  planner = await signInAs("planner");
  plannerId = (await api().get("/api/session").set("Cookie", planner)).body.user.id;
  layout = await loadLayoutGraph(1);
});

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

/** A draft wave of this file's own orders only (named by id, so no other test's open orders join it). */
async function ownWave(): Promise<number> {
  const items = await fixtures.itemsOnLayout(40);
  const ids: number[] = [];
  let next = 0;
  for (const [i, n] of ORDER_SIZES.entries()) {
    const picks = Array.from({ length: n }, () => items[(next += 7) % items.length] as number);
    ids.push(
      await fixtures.addOrder(`${TAG}-${fixtures.waveIds.length}-${i + 1}`, "2026-02-10T09:00:00Z", [
        ...new Set(picks),
      ]),
    );
  }
  const id = await createWave(
    await fixtures.siteId(),
    { name: `Plans test ${TAG}`, layoutVersionId: 1, settings: WAVE_SETTINGS, orderIds: ids },
    plannerId,
  );
  fixtures.waveIds.push(id);
  return id;
}

const getWave = async (id: number) => (await api().get(`/api/waves/${id}`).set("Cookie", planner)).body;
const getPlans = async (id: number, cookie = planner) =>
  (await api().get(`/api/waves/${id}/plans`).set("Cookie", cookie)).body as {
    wave: { version: number };
    plans: WavePlanDTO[];
  };

const post = (cookie: string, url: string, body: object) =>
  api().post(url).set("Cookie", cookie).set("Origin", ORIGIN).send(body);

async function compare(id: number, variants = VARIANTS, cookie = planner) {
  const { version } = (await getWave(id)).wave;
  const start = await post(cookie, `/api/waves/${id}/plans`, { version, variants });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(cookie, start.body.jobId);
  expect(job.status, job.message).toBe("done");
  return getPlans(id, cookie);
}

const storedBatches = async (planId: number): Promise<StoredBatch[]> => {
  const r = await db()("wave_plans").where({ id: planId }).first("batches");
  return typeof r.batches === "string" ? JSON.parse(r.batches) : r.batches;
};

/** Shortest walk depot → every stop → drop-off by trying every visiting order (brute force, independent of Held–Karp). */
function bruteForceTour(points: AccessPoint[], from: AccessPoint, to: AccessPoint): number {
  const d = (p: AccessPoint, q: AccessPoint) => accessDistance(layout.graph, layout.matrix, p, q);
  let best = Infinity;
  const walk = (at: AccessPoint, left: AccessPoint[], sofar: number) => {
    if (sofar >= best) return;
    if (left.length === 0) {
      best = Math.min(best, sofar + d(at, to));
      return;
    }
    for (const [i, p] of left.entries()) walk(p, [...left.slice(0, i), ...left.slice(i + 1)], sofar + d(at, p));
  };
  walk(from, points, 0);
  return best;
}

async function orderByOrderByHand(waveId: number): Promise<number> {
  const { graph } = layout;
  const end = (id: string) =>
    nodeAccessPoint(graph, (graph.depots.find((p) => p.id === id) ?? graph.dropoffs.find((p) => p.id === id))!.node);
  const apOf = new Map(graph.bins.map((b) => [b.code, b.accessPoint]));
  const rows = await db()("wave_orders as wo")
    .join("order_lines as l", "l.order_id", "wo.order_id")
    .join("item_bins as ib", "ib.item_id", "l.item_id")
    .join("layout_bins as lb", function () {
      this.on("lb.code", "=", "ib.bin_code").andOn("lb.layout_version_id", "=", db().raw("1"));
    })
    .where("wo.wave_id", waveId)
    .orderBy(["l.id", "ib.rank", "ib.bin_code"])
    .select("wo.order_id", "l.id as line_id", "ib.bin_code");
  // Each line picks from its first bin on the layout version.
  const binOfLine = new Map<number, { order: number; bin: string }>();
  for (const r of rows) if (!binOfLine.has(r.line_id)) binOfLine.set(r.line_id, { order: r.order_id, bin: r.bin_code });
  const stops = new Map<number, Set<number>>();
  for (const { order, bin } of binOfLine.values()) {
    if (!stops.has(order)) stops.set(order, new Set());
    stops.get(order)!.add(apOf.get(bin)!);
  }
  let total = 0;
  for (const aps of stops.values())
    total += bruteForceTour(
      [...aps].map((a) => graph.accessPoints[a]!),
      end(ENDS.depotId),
      end(ENDS.dropoffId),
    );
  return total;
}

describe("plans compared on the same orders", () => {
  let waveId: number;
  let plans: WavePlanDTO[];

  beforeAll(async () => {
    waveId = await ownWave();
    plans = (await compare(waveId)).plans;
  });

  it("stores one current plan per variant, each holding every order of the wave in exactly one batch", async () => {
    expect(plans).toHaveLength(2);
    expect(plans.map((p) => p.settings)).toEqual(VARIANTS.map((v) => ({ ...v, ...ENDS })));
    expect(plans.every((p) => p.current && !p.kept)).toBe(true);
    const lines = await db()("order_lines as l")
      .join("wave_orders as wo", "wo.order_id", "l.order_id")
      .where("wo.wave_id", waveId)
      .select("l.id", "l.order_id");
    const orderOf = new Map(lines.map((l: { id: number; order_id: number }) => [l.id, l.order_id]));
    for (const plan of plans) {
      const batches = await storedBatches(plan.id);
      const placed = batches.flatMap((b) => b.lines.map((l) => l.orderLineId));
      expect(placed.length).toBe(lines.length);
      expect(new Set(placed)).toEqual(new Set(orderOf.keys()));
      expect(batches.reduce((a, b) => a + b.lineCount, 0)).toBe(lines.length);
      // Each order rides in exactly one batch and one tote.
      const where = new Map<number, string>();
      batches.forEach((b, i) =>
        b.lines.forEach((l) => {
          const order = orderOf.get(l.orderLineId)!;
          const at = `${i}/${l.tote}`;
          expect(where.get(order) ?? at, `order ${order}`).toBe(at);
          where.set(order, at);
        }),
      );
      expect(where.size).toBe(ORDER_SIZES.length);
      const limits = plan.settings;
      for (const b of batches) expect(b.toteCount).toBeLessThanOrEqual(limits.totesPerCart);
      expect(plan.summary).toMatchObject({
        batches: batches.length,
        orders: ORDER_SIZES.length,
        lines: lines.length,
        unbatchedOrders: 0,
        distanceMm: batches.reduce((a, b) => a + b.distanceMm, 0),
        usualWalkMm: batches.reduce((a, b) => a + b.baselineMm, 0),
      });
    }
    // Two totes a cart cannot carry nine orders in as few carts as three totes.
    expect(plans[1]!.summary.batches).toBeGreaterThan(plans[0]!.summary.batches);
  });

  it("order by order is the sum of each order's shortest own trip, by brute force on the layout's distances", async () => {
    const byHand = await orderByOrderByHand(waveId);
    expect(byHand).toBeGreaterThan(0);
    for (const p of plans) {
      expect(p.summary.orderByOrderMm).toBe(byHand);
      expect(p.summary.orderByOrderOptimal).toBe(true);
    }
  });

  it("estimates walking, handling and set-up time with the site's figures, batch by batch and order by order", async () => {
    const site = await db()("sites")
      .where({ id: await fixtures.siteId() })
      .first();
    const lines = plans[0]!.summary.lines;
    for (const p of plans) {
      expect(p.summary.timing).toEqual({
        walkingSpeedMmPerS: site.walking_speed_mm_s,
        secondsPerLine: site.seconds_per_line,
        setupSecondsPerBatch: site.setup_seconds_per_batch,
      });
      const handling = lines * site.seconds_per_line;
      // One set-up per cart: per batch for a plan, per order when every order is its own trip.
      expect(p.summary.estimatedSeconds).toBeCloseTo(
        p.summary.distanceMm / site.walking_speed_mm_s + handling + p.summary.batches * site.setup_seconds_per_batch,
        6,
      );
      expect(p.summary.orderByOrderSeconds).toBeCloseTo(
        p.summary.orderByOrderMm / site.walking_speed_mm_s + handling + p.summary.orders * site.setup_seconds_per_batch,
        6,
      );
    }
  });

  it("keeping a plan makes its batches and settings the wave's; a resend is answered as done; the other plan stays keepable", async () => {
    const chosen = plans[1]!;
    const before = (await getWave(waveId)).wave;
    const keep = await post(planner, `/api/waves/${waveId}/plans/${chosen.id}/keep`, { version: before.version });
    expect(keep.status, JSON.stringify(keep.body)).toBe(200);
    const { wave, batches } = await getWave(waveId);
    expect(wave.status).toBe("planned");
    expect(wave.version).toBe(before.version + 1);
    expect(wave.settings).toEqual(chosen.settings);
    expect(wave.distanceMm).toBe(chosen.summary.distanceMm);
    expect(wave.baselineMm).toBe(chosen.summary.usualWalkMm);
    const stored = await storedBatches(chosen.id);
    expect(
      batches.map((b: BatchSummaryDTO) => [
        b.lineCount,
        b.toteCount,
        b.distanceMm,
        b.baselineMm,
        b.lowerBoundMm,
        b.method,
      ]),
    ).toEqual(stored.map((b) => [b.lineCount, b.toteCount, b.distanceMm, b.baselineMm, b.lowerBoundMm, b.method]));
    const lines = await db()("batch_lines as bl")
      .join("batches as b", "b.id", "bl.batch_id")
      .where("b.wave_id", waveId)
      .orderBy(["b.number", "bl.order_line_id"])
      .select("b.number", "bl.order_line_id", "bl.tote", "bl.stop_seq");
    expect(lines).toEqual(
      stored
        .flatMap((b, i) =>
          b.lines.map((l) => ({ number: i + 1, order_line_id: l.orderLineId, tote: l.tote, stop_seq: l.stopSeq })),
        )
        .sort((a, b) => a.number - b.number || a.order_line_id - b.order_line_id),
    );

    const again = await post(planner, `/api/waves/${waveId}/plans/${chosen.id}/keep`, { version: before.version });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect((await getWave(waveId)).wave.version).toBe(before.version + 1);

    const after = await getPlans(waveId);
    expect(after.plans.find((p) => p.id === chosen.id)).toMatchObject({ kept: true, current: true });
    expect(after.plans.find((p) => p.id === plans[0]!.id)).toMatchObject({ kept: false, current: true });
    const back = await post(planner, `/api/waves/${waveId}/plans/${plans[0]!.id}/keep`, { version: wave.version });
    expect(back.status, JSON.stringify(back.body)).toBe(200);
    expect((await getWave(waveId)).wave.settings).toEqual(plans[0]!.settings);
  });

  it("two planners keeping different plans at once: one wins, the other gets 409 and the wave holds the winner's plan", async () => {
    const fresh = (await compare(waveId)).plans.filter((p) => p.current && !p.kept);
    const newest = fresh.slice(-2);
    expect(newest).toHaveLength(2);
    const other = await makeUser("planner");
    const otherCookie = await signIn(other.email, other.password);
    const { version } = (await getWave(waveId)).wave;
    const answers = await Promise.all([
      post(planner, `/api/waves/${waveId}/plans/${newest[0]!.id}/keep`, { version }),
      post(otherCookie, `/api/waves/${waveId}/plans/${newest[1]!.id}/keep`, { version }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    const loser = answers.find((a) => a.status === 409)!;
    expect(loser.body.error).toMatch(/changed the wave a moment ago|changed since you loaded it/);
    const winner = newest[answers.findIndex((a) => a.status === 200)]!;
    const { wave } = await getWave(waveId);
    expect(wave.version).toBe(version + 1);
    expect(wave.settings).toEqual(winner.settings);
    expect(wave.distanceMm).toBe(winner.summary.distanceMm);
  });

  it("after the wave changes, its plans are out of date and keeping one is refused with 409", async () => {
    const { plans: now } = await getPlans(waveId);
    const candidate = now.find((p) => p.current && !p.kept)!;
    const { wave } = await getWave(waveId);
    const replan = await post(planner, `/api/waves/${waveId}/plan`, { version: wave.version });
    expect(replan.status, JSON.stringify(replan.body)).toBe(202);
    expect((await waitForJob(planner, replan.body.jobId)).status).toBe("done");
    const changed = (await getWave(waveId)).wave;
    expect(changed.version).toBeGreaterThan(wave.version);
    const listed = await getPlans(waveId);
    expect(listed.plans.every((p) => !p.current)).toBe(true);
    const refused = await post(planner, `/api/waves/${waveId}/plans/${candidate.id}/keep`, {
      version: changed.version,
    });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/earlier state of the wave/);
    const stale = await post(planner, `/api/waves/${waveId}/plans`, { version: wave.version, variants: VARIANTS });
    expect(stale.status).toBe(409);
  });

  it("a plan whose orders the wave no longer holds is refused with 409 and the wave is left as it was", async () => {
    const { plans: fresh } = await compare(waveId);
    const candidate = fresh.find((p) => p.current && !p.kept)!;
    const [gone] = await db()("wave_orders").where({ wave_id: waveId }).orderBy("order_id").limit(1).pluck("order_id");
    await db()("wave_orders").where({ wave_id: waveId, order_id: gone }).delete();
    const before = await getWave(waveId);
    try {
      const refused = await post(planner, `/api/waves/${waveId}/plans/${candidate.id}/keep`, {
        version: before.wave.version,
      });
      expect(refused.status).toBe(409);
      expect(refused.body.error).toMatch(/orders changed/);
      const after = await getWave(waveId);
      expect(after.wave.version).toBe(before.wave.version);
      expect(after.batches.map((b: { id: number }) => b.id)).toEqual(before.batches.map((b: { id: number }) => b.id));
    } finally {
      await db()("wave_orders").insert({ wave_id: waveId, order_id: gone });
    }
  });

  it("refuses fewer than two or more than four plans, the same plan twice, and a released wave", async () => {
    const { version } = (await getWave(waveId)).wave;
    const one = await post(planner, `/api/waves/${waveId}/plans`, { version, variants: VARIANTS.slice(0, 1) });
    expect(one.status).toBe(400);
    expect(one.body.error + JSON.stringify(one.body.issues)).toMatch(/at least two/);
    const five = await post(planner, `/api/waves/${waveId}/plans`, {
      version,
      variants: Array.from({ length: 5 }, (_, i) => ({ ...VARIANTS[0], totesPerCart: i + 1 })),
    });
    expect(five.status).toBe(400);
    const twice = await post(planner, `/api/waves/${waveId}/plans`, { version, variants: [VARIANTS[0], VARIANTS[0]] });
    expect(twice.status).toBe(422);
    const { plans: listed } = await getPlans(waveId);
    const release = await post(planner, `/api/waves/${waveId}/release`, { version });
    expect(release.status, JSON.stringify(release.body)).toBe(200);
    const released = (await getWave(waveId)).wave;
    const compareReleased = await post(planner, `/api/waves/${waveId}/plans`, {
      version: released.version,
      variants: VARIANTS,
    });
    expect(compareReleased.status).toBe(409);
    expect(compareReleased.body.error).toMatch(/released/);
    const keepReleased = await post(planner, `/api/waves/${waveId}/plans/${listed[0]!.id}/keep`, {
      version: released.version,
    });
    expect(keepReleased.status).toBe(409);
    expect(keepReleased.body.error).toMatch(/released/);
    expect((await getPlans(waveId)).plans.every((p) => !p.current)).toBe(true);
  });
});

describe("who may compare and keep plans", () => {
  let waveId: number;
  let planId: number;

  beforeAll(async () => {
    waveId = await ownWave();
    planId = (await compare(waveId)).plans[0]!.id;
  });

  it("a supervisor reads the plans but may neither compare nor keep; a picker may do none; nobody signed out", async () => {
    const supervisor = await signInAs("supervisor");
    const picker = await signInAs("picker");
    const { version } = (await getWave(waveId)).wave;
    const read = await api().get(`/api/waves/${waveId}/plans`).set("Cookie", supervisor);
    expect(read.status).toBe(200);
    expect(read.body.plans.length).toBe(2);
    for (const cookie of [supervisor, picker]) {
      expect((await post(cookie, `/api/waves/${waveId}/plans`, { version, variants: VARIANTS })).status).toBe(403);
      expect((await post(cookie, `/api/waves/${waveId}/plans/${planId}/keep`, { version })).status).toBe(403);
    }
    expect((await api().get(`/api/waves/${waveId}/plans`).set("Cookie", picker)).status).toBe(403);
    expect((await api().get(`/api/waves/${waveId}/plans`)).status).toBe(401);
    expect((await getWave(waveId)).wave.version).toBe(version);
  });

  it("a plan of another wave is not found through this one", async () => {
    const other = await ownWave();
    const { version } = (await getWave(other)).wave;
    const res = await post(planner, `/api/waves/${other}/plans/${planId}/keep`, { version });
    expect(res.status).toBe(404);
  });
});

describe("a plan whose carts are too small for some orders", () => {
  it("leaves those orders out and sets it only against order by order of the orders it holds", async () => {
    const waveId = await ownWave();
    const big = ORDER_SIZES.filter((n) => n > 3).length;
    const { plans } = await compare(waveId, [VARIANTS[0]!, { ...VARIANTS[0]!, maxLines: 3 }]);
    const [roomy, small] = plans as [WavePlanDTO, WavePlanDTO];
    expect(roomy.summary).toMatchObject({ orders: ORDER_SIZES.length, unbatchedOrders: 0 });
    expect(small.summary).toMatchObject({ orders: ORDER_SIZES.length - big, unbatchedOrders: big });
    const left = await db()("wave_plans").where({ id: small.id }).first("unbatchable");
    const reasons = (typeof left.unbatchable === "string" ? JSON.parse(left.unbatchable) : left.unbatchable) as {
      reason: string;
    }[];
    expect(reasons).toHaveLength(big);
    for (const r of reasons) expect(r.reason).toMatch(/a cart takes at most 3/);
    // Its order-by-order walk counts only the orders it batched, so both sides of its savings cover the same orders.
    expect(small.summary.orderByOrderMm).toBeLessThan(roomy.summary.orderByOrderMm);
    expect(small.summary.lines).toBe(roomy.summary.lines - ORDER_SIZES.filter((n) => n > 3).reduce((a, n) => a + n, 0));
  });
});
