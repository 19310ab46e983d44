// Set-up of a load run through the product's own API, as the people would do it: the admin adds the
// pickers, the planner imports invented orders on the seeded Bramblegate items, plans and releases a
// wave, each handheld takes batches with "Take the next batch" and loads them; then the planner
// imports the 1,000 orders of the wave that is planned during the load.
import { DEMO_ACCOUNTS } from "../../db/seeds/demo/accounts";
import { mulberry32, randomInt } from "../../lib/routing/random";
import { type Api, ApiError, signIn } from "./api";

export type PickLine = {
  batchId: number;
  batchVersion: number;
  orderLineId: number;
  binCode: string;
  sku: string;
  quantity: number;
};
export type HandheldAccount = {
  index: number;
  email: string;
  userId: string;
  cookie: string;
  batches: { id: number; lines: PickLine[] }[];
};
export type LoadSetup = {
  handhelds: HandheldAccount[];
  plannerCookie: string;
  planWave: { id: number; version: number; orders: number; lines: number };
  pickBatchIds: number[];
};

// The cart limits of the demo waves (db/seeds/demo/orders.ts DEMO_CART_LIMITS).
const LIMITS = { totesPerCart: 6, maxLines: 30, maxWeightG: 150_000 };
// Both sheets are dated before the demo week, so a wave cut off at their day takes only their orders.
const PICK_DAY = "2026-11-20";
const PLAN_DAY = "2026-11-21";

const account = (email: string) => DEMO_ACCOUNTS.find((a) => a.email === email)!;

/** Invented orders over the given SKUs as an order sheet in the template's columns. */
export function orderSheet(
  prefix: string,
  day: string,
  orders: number,
  lines: [number, number],
  skus: string[],
  seed: number,
): { csv: string; lines: number } {
  const rand = mulberry32(seed);
  const rows = ["Order number,Line,SKU,Quantity,Cut-off,Priority,Customer reference"];
  const cutoffs = ["10:00", "12:00", "14:30", "16:30"];
  let n = 0;
  for (let o = 0; o < orders; o++) {
    const count = randomInt(rand, lines[0], lines[1]);
    const used = new Set<string>();
    while (used.size < Math.min(count, skus.length)) used.add(skus[randomInt(rand, 0, skus.length - 1)]!);
    let line = 0;
    for (const sku of used) {
      rows.push(
        `${prefix}-${String(o + 1).padStart(6, "0")},${++line},${sku},${randomInt(rand, 1, 4)},${day} ${cutoffs[o % cutoffs.length]},${1 + (o % 3)},Load customer ${o % 40}`,
      );
      n++;
    }
  }
  return { csv: rows.join("\r\n") + "\r\n", lines: n };
}

async function importOrders(a: Api, cookie: string, layoutVersionId: number, name: string, csv: string) {
  const form = new FormData();
  form.set("layoutVersionId", String(layoutVersionId));
  form.set("file", new Blob([csv], { type: "text/csv" }), name);
  return (await a.call("POST", "/api/imports/orders", { cookie, form, expect: [201] })).body;
}

async function waitForJob(a: Api, cookie: string, jobId: string): Promise<Record<string, unknown>> {
  for (;;) {
    const { job } = (await a.call<{ job: Record<string, unknown> }>("GET", `/api/jobs/${jobId}`, { cookie })).body;
    if (job.status === "done") return job;
    if (job.status === "failed" || job.status === "cancelled")
      throw new Error(`job ${jobId} ${job.status}: ${job.message}`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

type WaveBody = { wave: { id: number; version: number; orderCount: number; status: string } };

async function createWave(
  a: Api,
  cookie: string,
  name: string,
  layoutVersionId: number,
  ends: { depotId: string; dropoffId: string },
  method: string,
  day: string,
) {
  const { body } = await a.call<{ id: number; orders: number }>("POST", "/api/waves", {
    cookie,
    json: { name, layoutVersionId, settings: { ...LIMITS, ...ends, method }, cutoffBefore: `${day}T23:59:00Z` },
    expect: [201],
  });
  const { wave } = (await a.call<WaveBody>("GET", `/api/waves/${body.id}`, { cookie })).body;
  return wave;
}

/** Runs `fn` over `items`, at most `width` at a time. */
async function inBatches<T, R>(items: T[], width: number, fn: (t: T) => Promise<R>): Promise<R[]> {
  const out: R[] = [];
  for (let i = 0; i < items.length; i += width) out.push(...(await Promise.all(items.slice(i, i + width).map(fn))));
  return out;
}

export async function setUpLoad(
  a: Api,
  opts: { handhelds: number; linesPerHandheld: number; planOrders: number; log: (s: string) => void },
): Promise<LoadSetup> {
  const { log } = opts;
  // Names of this run's people and orders carry a tag, so a second run against the same database
  // (while profiling, say) does not collide with the first.
  const tag = Date.now().toString(36).slice(-5).toUpperCase();
  const admin = await signIn(a.origin, "admin@bramblegate.example", account("admin@bramblegate.example").password);
  const planner = await signIn(
    a.origin,
    "planner@bramblegate.example",
    account("planner@bramblegate.example").password,
  );

  // The demo's own waves tell the layout version and its depot and drop-off.
  const { waves } = (
    await a.call<{ waves: { layoutVersionId: number; settings: { depotId: string; dropoffId: string } }[] }>(
      "GET",
      "/api/waves",
      { cookie: planner },
    )
  ).body;
  const demo = waves[0];
  if (!demo) throw new Error("the demo seed made no waves");
  const layoutVersionId = demo.layoutVersionId;
  const ends = { depotId: demo.settings.depotId, dropoffId: demo.settings.dropoffId };
  const { items } = (
    await a.call<{ items: { sku: string; bins: string[] }[] }>("GET", "/api/items", { cookie: planner })
  ).body;
  const skus = items.filter((i) => i.bins.length > 0).map((i) => i.sku);

  log(`adding ${opts.handhelds} picker accounts`);
  const password = "load run copper pallet lantern";
  const people = await inBatches(
    Array.from({ length: opts.handhelds }, (_, i) => i),
    4,
    async (i) => {
      const email = `handheld-${String(i + 1).padStart(2, "0")}-${tag.toLowerCase()}@load.example`;
      const { body } = await a.call<{ user: { id: string } }>("POST", "/api/users", {
        cookie: admin,
        json: { email, displayName: `Handheld ${i + 1}`, role: "picker", password },
        expect: [201],
      });
      return {
        index: i,
        email,
        userId: body.user.id,
        cookie: await signIn(a.origin, email, password),
        batches: [] as HandheldAccount["batches"],
      };
    },
  );

  // Orders of 5 lines fill a 6-tote, 30-line cart. A handheld's last batch overshoots its need by up to
  // a cart's lines; 5 % spare for carts the batching leaves less than full.
  const pickOrders = Math.ceil((opts.handhelds * (opts.linesPerHandheld + LIMITS.maxLines) * 1.05) / 5);
  const pickSheet = orderSheet(`LOAD-${tag}-H`, PICK_DAY, pickOrders, [5, 5], skus, 7);
  log(`importing ${pickOrders} orders (${pickSheet.lines} lines) for the handhelds; planning and releasing their wave`);
  await importOrders(a, planner, layoutVersionId, "load-handheld-orders.csv", pickSheet.csv);
  const pickWave = await createWave(
    a,
    planner,
    "Load run: handheld orders",
    layoutVersionId,
    ends,
    "first-come",
    PICK_DAY,
  );
  const { body: planned } = await a.call<{ jobId: string }>("POST", `/api/waves/${pickWave.id}/plan`, {
    cookie: planner,
    json: { version: pickWave.version },
    expect: [202],
  });
  await waitForJob(a, planner, planned.jobId);
  const ready = (await a.call<WaveBody>("GET", `/api/waves/${pickWave.id}`, { cookie: planner })).body.wave;
  await a.call("POST", `/api/waves/${pickWave.id}/release`, { cookie: planner, json: { version: ready.version } });

  // Every handheld takes the next batch in turn until it holds enough open lines for the whole run.
  log("each handheld takes batches until it holds enough lines");
  const held = new Map<number, number>();
  let active = people.slice();
  while (active.length) {
    for (const h of active) {
      for (let attempt = 0; ; attempt++) {
        const { next } = (
          await a.call<{ next: { id: number; version: number; openLines: number } | null }>("GET", "/api/my-batches", {
            cookie: h.cookie,
          })
        ).body;
        if (!next)
          throw new Error(
            `no batch left to take: the handhelds hold ${[...held.values()].reduce((x, y) => x + y, 0)} lines; import more orders`,
          );
        try {
          await a.call("POST", `/api/batches/${next.id}/take`, { cookie: h.cookie, json: { version: next.version } });
          h.batches.push({ id: next.id, lines: [] });
          held.set(h.index, (held.get(h.index) ?? 0) + next.openLines);
          break;
        } catch (e) {
          if (!(e instanceof ApiError && e.status === 409) || attempt > 5) throw e;
        }
      }
    }
    active = active.filter((h) => (held.get(h.index) ?? 0) < opts.linesPerHandheld);
  }

  log("loading each batch's lines in walking order");
  type View = {
    batch: { version: number };
    stops: { lines: { orderLineId: number; binCode: string; sku: string; quantity: number; pickStatus: string }[] }[];
  };
  await inBatches(
    people.flatMap((h) => h.batches.map((b) => ({ h, b }))),
    8,
    async ({ h, b }) => {
      const { body } = await a.call<View>("GET", `/api/batches/${b.id}/pick`, { cookie: h.cookie });
      b.lines = body.stops.flatMap((s) =>
        s.lines
          .filter((l) => l.pickStatus === "open")
          .map((l) => ({
            batchId: b.id,
            batchVersion: body.batch.version,
            orderLineId: l.orderLineId,
            binCode: l.binCode,
            sku: l.sku,
            quantity: l.quantity,
          })),
      );
    },
  );

  const planSheet = orderSheet(`LOAD-${tag}-W`, PLAN_DAY, opts.planOrders, [1, 5], skus, 11);
  log(
    `importing the ${opts.planOrders.toLocaleString("en")} orders (${planSheet.lines} lines) of the wave to plan during the load`,
  );
  await importOrders(a, planner, layoutVersionId, "load-wave-orders.csv", planSheet.csv);
  const planWave = await createWave(
    a,
    planner,
    `Load run: ${opts.planOrders} orders`,
    layoutVersionId,
    ends,
    "savings",
    PLAN_DAY,
  );
  if (planWave.orderCount !== opts.planOrders)
    throw new Error(`the wave to plan took ${planWave.orderCount} orders, not ${opts.planOrders}`);

  return {
    handhelds: people,
    plannerCookie: planner,
    planWave: { id: planWave.id, version: planWave.version, orders: planWave.orderCount, lines: planSheet.lines },
    pickBatchIds: people.flatMap((h) => h.batches.map((b) => b.id)),
  };
}
