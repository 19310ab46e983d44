import { expect } from "vitest";
import * as XLSX from "xlsx";
import { api, ORIGIN, signIn, signInAs } from "./app";
import { run, smallDocument } from "./documents";
import { db } from "@/db/knex";
import { waitForJob } from "./jobs";

/**
 * Text that would do something if any page treated it as markup, a template, SQL or a link: the
 * classic probes of the OWASP XSS filter evasion cheat sheet and the Web Security Testing Guide
 * (HTML and attribute breakout, SQL quote breakout, client- and server-side template expressions),
 * a javascript: URL, and Unicode bidi overrides and zero-width characters (CVE-2021-42574,
 * "Trojan Source"). Each must be stored exactly and shown as the same plain text.
 */
export const HOSTILE = [
  "<script>alert(1)</script>",
  '"><img src=x onerror=alert(1)>',
  "'; DROP TABLE orders; --",
  "Robert'); --",
  "{{7*7}}",
  "${7*7}",
  "javascript:alert(1)",
  "abc\u202Efed\u200Bx\u200Dy\u2066z\u2069\u200F",
  '=HYPERLINK("http://example.invalid","open")',
] as const;

/** Bin code patterns whose literal text is markup (the editor allows any literal text around {bay} and {level}). */
export const HOSTILE_PATTERNS = {
  R1: "<img src onerror=alert(1)>{bay}-{level}",
  R2: "<script>{bay}</script>{level}",
} as const;
export const hostileCode = (runId: "R1" | "R2", bay: number, level: number) =>
  HOSTILE_PATTERNS[runId].replace("{bay}", String(bay)).replace("{level}", String(level));
export const HOSTILE_DEPOT = "<script>alert(1)</script>";
export const HOSTILE_DROPOFF = '"><img src=x onerror=alert(1)>';

const ITEM_HEADER = ["SKU", "Description", "Unit of measure", "Unit weight (g)", "Pick bins"];
const ORDER_HEADER = ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"];
// Long before any other test's orders (the demo's week is November 2026): the wave that takes these
// asks for cut-offs up to 2000-01-01, so it claims nothing of anyone else's, and no other wave
// gets these, because they are in a wave the moment they exist.
const CUTOFF = "1999-12-31 08:00";
const CLAIM_BEFORE = "2000-01-01T00:00:00Z";

function xlsx(rows: (string | number)[][]): Buffer {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(rows), "Sheet1");
  return XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
}

export type HostileScenario = Awaited<ReturnType<typeof buildHostileScenario>>;

/**
 * Everything a person can type or import, filled with HOSTILE text through the JSON APIs and the
 * imports: users, floor plans, bin codes and point names of a published layout, items, orders, a
 * released wave whose only batch a hostile-named picker of our own holds, with one short pick.
 */
export async function buildHostileScenario() {
  const tag = `H${Date.now().toString(36).toUpperCase()}${process.pid}`;
  const admin = await signInAs("admin");
  const planner = await signInAs("planner");
  const post = (url: string, cookie: string) => api().post(url).set("Cookie", cookie).set("Origin", ORIGIN);

  const users: { id: string; email: string; password: string; displayName: string }[] = [];
  for (const [i, displayName] of HOSTILE.entries()) {
    // "zz-": the users list sorts by role and e-mail; ours go after the demo people other tests look for.
    const email = `zz-${tag.toLowerCase()}-${i}@tests.example`;
    const password = "correct horse battery";
    const res = await post("/api/users", admin).send({ email, displayName, role: "picker", password });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    users.push({ id: res.body.user.id, email, password, displayName });
  }

  // The published one is named from our tag first: layout version choices list floor plans by name
  // and preselect the first, which must stay the demo's Bramblegate for the other tests.
  const planNames = HOSTILE.map((h, i) => (i === 0 ? `${tag} ${h}` : `${h} ${tag}`));
  const planIds: number[] = [];
  for (const name of planNames) {
    const res = await post("/api/floor-plans", admin).send({ name, widthM: 12, heightM: 7, cellMm: 1000 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    planIds.push(res.body.id);
  }
  // The first plan gets a layout with hostile bin codes and point names, and is published.
  const planId = planIds[0]!;
  const document = smallDocument();
  document.rackRuns = [
    run({ id: "R1", x: 1, y: 2, length: 10, facing: "S", aisle: 1, pattern: HOSTILE_PATTERNS.R1 }),
    run({ id: "R2", x: 1, y: 4, length: 10, facing: "N", aisle: 1, firstBay: 11, pattern: HOSTILE_PATTERNS.R2 }),
  ];
  document.depots = [{ ...document.depots[0]!, name: HOSTILE_DEPOT }];
  document.dropoffs = [{ ...document.dropoffs[0]!, name: HOSTILE_DROPOFF }];
  const saved = await api()
    .put(`/api/floor-plans/${planId}/draft`)
    .set("Cookie", admin)
    .set("Origin", ORIGIN)
    .send({ version: 1, document });
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  const publish = await post(`/api/floor-plans/${planId}/publish`, admin).send({ version: saved.body.version });
  expect(publish.status, JSON.stringify(publish.body)).toBe(202);
  const published = await waitForJob(admin, publish.body.jobId);
  expect(published.status, published.message).toBe("done");
  const layoutVersionId = published.result.layoutVersionId as number;

  // One item and one order per hostile string: the text as SKU (after our tag), description,
  // order number and customer reference; bins alternate between the two hostile runs.
  const items = HOSTILE.map((h, i) => ({
    sku: `${tag}-${i}${h}`,
    description: h,
    uom: i === 5 ? "${7*7}" : "EA",
    bin: i % 2 === 0 ? hostileCode("R1", i + 1, 1) : hostileCode("R2", 11 + i, 2),
  }));
  const itemSheet = xlsx([ITEM_HEADER, ...items.map((it) => [it.sku, it.description, it.uom, 100, it.bin])]);
  const importedItems = await post("/api/imports/items", planner)
    .field("layoutVersionId", String(layoutVersionId))
    .attach("file", itemSheet, "hostile-items.xlsx");
  expect(importedItems.status, JSON.stringify(importedItems.body)).toBe(201);

  const orders = HOSTILE.map((h, i) => ({ orderNumber: `${tag}-${i}${h}`, customerRef: h, sku: items[i]!.sku }));
  const orderSheet = xlsx([ORDER_HEADER, ...orders.map((o) => [o.orderNumber, 1, o.sku, 1, CUTOFF, 1, o.customerRef])]);
  const importedOrders = await post("/api/imports/orders", planner)
    .field("layoutVersionId", String(layoutVersionId))
    .attach("file", orderSheet, "hostile-orders.xlsx");
  expect(importedOrders.status, JSON.stringify(importedOrders.body)).toBe(201);

  const waveName = `${tag} <script>alert(1)</script> "><img src=x onerror=alert(1)> {{7*7}} \${7*7} '; DROP TABLE orders; --`;
  const wave = await post("/api/waves", planner).send({
    name: waveName,
    layoutVersionId,
    settings: {
      totesPerCart: 20,
      maxLines: 50,
      maxWeightG: 100_000,
      depotId: "D1",
      dropoffId: "P1",
      method: "first-come",
    },
    cutoffBefore: CLAIM_BEFORE,
    priorities: [1, 2, 3],
  });
  expect(wave.status, JSON.stringify(wave.body)).toBe(201);
  const waveId = wave.body.id as number;
  // Only ours: nobody else's orders have a cut-off that early.
  expect(wave.body.orders).toBe(HOSTILE.length);
  const planStart = await post(`/api/waves/${waveId}/plan`, planner).send({ version: 1 });
  expect(planStart.status, JSON.stringify(planStart.body)).toBe(202);
  const planned = await waitForJob(planner, planStart.body.jobId);
  expect(planned.status, planned.message).toBe("done");
  const afterPlan = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.wave;
  const released = await post(`/api/waves/${waveId}/release`, planner).send({ version: afterPlan.version });
  expect(released.status, JSON.stringify(released.body)).toBe(200);

  // Our hostile-named picker takes every batch at once, so no other test's "take the next batch" gets one.
  const picker = users[0]!;
  const pickerCookie = await signIn(picker.email, picker.password);
  const batches = await db()("batches").where({ wave_id: waveId }).orderBy("number").select("id", "number", "version");
  expect(batches.length).toBeGreaterThan(0);
  for (const b of batches) {
    const took = await post(`/api/batches/${b.id}/take`, pickerCookie).send({ version: b.version });
    expect(took.status, JSON.stringify(took.body)).toBe(200);
  }
  const batchId = batches[0]!.id as number;
  const line = await db()("batch_lines")
    .where({ batch_id: batchId })
    .orderBy("order_line_id")
    .first("order_line_id", "bin_code");
  const { version: batchVersion } = await db()("batches").where({ id: batchId }).first("version");
  const short = await post(`/api/batches/${batchId}/confirm`, pickerCookie).send({
    idempotencyKey: `${tag}-short`,
    orderLineId: line.order_line_id,
    quantity: 0,
    short: { reason: "other" },
    binCode: line.bin_code,
    batchVersion,
  });
  expect(short.status, JSON.stringify(short.body)).toBeLessThan(300);

  return {
    tag,
    admin,
    planner,
    users,
    picker,
    pickerCookie,
    planIds,
    planNames,
    planId,
    layoutVersionId,
    items,
    orders,
    waveId,
    waveName,
    batchIds: batches.map((b: { id: number }) => b.id),
    shortLineId: line.order_line_id as number,
  };
}
