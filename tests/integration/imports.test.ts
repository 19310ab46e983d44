import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import http from "node:http";
import * as XLSX from "xlsx";
import { api, ORIGIN, signInAs } from "../support/app";
import { smallDocument } from "../support/documents";
import { closeDb, db } from "@/db/knex";
import { openOrdersForPlanning } from "@/db/orders";
import { upsertItems } from "@/db/items";
import { MAX_UPLOAD_BYTES } from "@/lib/sheets/read";

afterAll(closeDb);

const ITEM_HEADER = ["SKU", "Description", "Unit of measure", "Unit weight (g)", "Pick bins"];
const ORDER_HEADER = ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"];
// Fresh SKUs and order numbers per run, so the tests never meet the demo's or an earlier run's.
const RUN = `T${Date.now().toString(36).toUpperCase()}`;
let seq = 0;
const fresh = (what: string) => `${RUN}-${what}-${++seq}`;

function xlsx(rows: (string | number)[][], sheetName = "Sheet1"): Buffer {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(rows), sheetName);
  return XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
}
const csv = (rows: (string | number)[][]) =>
  Buffer.from(
    rows
      .map((r) => r.map((c) => (/[",\n]/.test(String(c)) ? `"${String(c).replace(/"/g, '""')}"` : String(c))).join(","))
      .join("\n") + "\n",
  );

let planner = "";
let versionId = 0;
let bins: string[] = [];

function send(url: string, file: Buffer, name: string, fields: Record<string, string> = {}, cookie = planner) {
  let req = api().post(url).set("Cookie", cookie).set("Origin", ORIGIN);
  for (const [k, v] of Object.entries({ layoutVersionId: String(versionId), ...fields })) req = req.field(k, v);
  return req.attach("file", file, name);
}
const preview = (kind: string, file: Buffer, name: string, fields?: Record<string, string>) =>
  send(`/api/imports/${kind}/preview`, file, name, fields);
const importFile = (kind: string, file: Buffer, name: string, fields?: Record<string, string>) =>
  send(`/api/imports/${kind}`, file, name, fields);

async function itemsBySku(): Promise<
  Map<string, { sku: string; description: string; uom: string; unitWeightG: number; bins: string[] }>
> {
  const res = await api().get("/api/items").set("Cookie", planner);
  expect(res.status).toBe(200);
  return new Map(res.body.items.map((i: { sku: string }) => [i.sku, i]));
}
async function orderNumbers(): Promise<string[]> {
  const res = await api().get("/api/orders?status=all").set("Cookie", planner);
  expect(res.status).toBe(200);
  return res.body.orders.map((o: { orderNumber: string }) => o.orderNumber);
}

beforeAll(async () => {
  planner = await signInAs("planner");
  // The seeded demo: floor plan 1, Bramblegate, published as layout version 1.
  const v = await api().get("/api/floor-plans/1/versions/1").set("Cookie", planner);
  expect(v.status).toBe(200);
  versionId = v.body.version.id;
  bins = v.body.bins.map((b: { code: string }) => b.code);
  expect(bins.length).toBeGreaterThan(4);
});

describe("item master import", () => {
  it("template round trip: download, fill in, import, listed; a second import updates and replaces bins", async () => {
    const t = await api()
      .get("/api/imports/items/template")
      .set("Cookie", planner)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => cb(null, Buffer.concat(chunks)));
      });
    expect(t.status).toBe(200);
    const book = XLSX.read(t.body as Buffer, { type: "buffer" });
    expect(book.SheetNames).toEqual(["Items", "How to fill in"]);
    const header = XLSX.utils.sheet_to_json<string[]>(book.Sheets.Items!, { header: 1 })[0]!;
    expect(header).toEqual(ITEM_HEADER);
    const a = fresh("BOLT");
    const b = fresh("NUT");
    const filled = xlsx([
      header,
      [a, "=1+1 hex bolt", "BOX", 2750, `${bins[0]}; ${bins[1]}`],
      [b, "Hex nut", "EA", 12, bins[2]!],
    ]);
    const res = await importFile("items", filled, "items.xlsx");
    expect(res.status).toBe(201);
    expect(res.body.counts).toMatchObject({ rows: 2, items: 2, inserted: 2, updated: 0 });
    const listed = await itemsBySku();
    expect(listed.get(a)).toEqual({
      sku: a,
      description: "=1+1 hex bolt",
      uom: "BOX",
      unitWeightG: 2750,
      bins: [bins[0], bins[1]],
    });
    expect(listed.get(b)?.bins).toEqual([bins[2]]);

    const again = await importFile("items", xlsx([header, [a, "Hex bolt", "BOX", 2800, bins[3]!]]), "items-2.xlsx");
    expect(again.status).toBe(201);
    expect(again.body.counts).toMatchObject({ items: 1, inserted: 0, updated: 1 });
    const after = await itemsBySku();
    expect(after.get(a)).toMatchObject({ description: "Hex bolt", unitWeightG: 2800, bins: [bins[3]] });
    expect(after.get(b)?.bins).toEqual([bins[2]]);
  });

  it("exports the item master as .xlsx with formula-like text escaped", async () => {
    const sku = fresh("EXP");
    expect(
      (await importFile("items", csv([ITEM_HEADER, [sku, '=HYPERLINK("http://x")', "EA", 5, bins[0]!]]), "exp.csv"))
        .status,
    ).toBe(201);
    const res = await api()
      .get("/api/items/export")
      .set("Cookie", planner)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toContain("spreadsheetml");
    const sheet = XLSX.read(res.body as Buffer, { type: "buffer" });
    const rows = XLSX.utils.sheet_to_json<string[]>(sheet.Sheets[sheet.SheetNames[0]!]!, { header: 1 });
    expect(rows[0]).toEqual(ITEM_HEADER);
    const row = rows.find((r) => r[0] === sku)!;
    expect(row[1]).toBe('\'=HYPERLINK("http://x")');
    expect(Object.values(sheet.Sheets[sheet.SheetNames[0]!]!).some((c) => typeof c === "object" && c && "f" in c)).toBe(
      false,
    );
  });

  it("an unchanged export imports back to exactly the same item master", async () => {
    // Stored as they are (not through an import), so the values are known whatever an import does.
    const stored = [
      { sku: `=${fresh("SKU")}`, description: "-20 °C freezer gloves" },
      { sku: `+${fresh("PLUS")}`, description: "@home delivery pack" },
      { sku: fresh("APOS"), description: "'=literally an apostrophe then an equals sign" },
      { sku: `'${fresh("Q")}`, description: "'quoted by hand" },
      { sku: fresh("WIDE"), description: "＝SUM(A1) ＋ －20 ＠x" },
      { sku: fresh("TAB"), description: "\tstarts with a tab" },
      { sku: fresh("ESC"), description: "_x0041_ is not an A" },
    ].map((i, k) => ({
      row: k + 2,
      ...i,
      uom: k % 2 ? "-EA" : "EA",
      unitWeightG: 10 + k,
      bins: [bins[k % bins.length]!],
    }));
    await db().transaction((trx) => upsertItems(trx, 1, stored));
    const before = await itemsBySku();

    const exported = await api()
      .get("/api/items/export")
      .set("Cookie", planner)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => cb(null, Buffer.concat(chunks)));
      });
    expect(exported.status).toBe(200);
    const book = XLSX.read(exported.body as Buffer, { type: "buffer" });
    const cells = XLSX.utils
      .sheet_to_json<string[]>(book.Sheets[book.SheetNames[0]!]!, { header: 1, raw: false })
      .flat();
    expect(
      cells.filter((c) => /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/.test(c)),
      "formula-like cells in the export",
    ).toEqual([]);

    const res = await importFile("items", exported.body as Buffer, "item-master.xlsx");
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const after = await itemsBySku();
    for (const i of stored)
      expect(after.get(i.sku), i.sku).toEqual({
        sku: i.sku,
        description: i.description,
        uom: i.uom,
        unitWeightG: i.unitWeightG,
        bins: i.bins,
      });
    expect(
      [...after.keys()].filter((sku) => sku.startsWith("'=") || sku.startsWith("'+")),
      "SKUs the import made up",
    ).toEqual([]);
    expect(after).toEqual(before);
  });

  it("maps columns whose headers differ from the template", async () => {
    const sku = fresh("MAP");
    const file = csv([
      ["Artikel", "Text", "ME", "Gewicht", "Platz"],
      [sku, "Wall plug", "PK", 60, bins[0]!],
    ]);
    const guessed = await preview("items", file, "other.csv");
    expect(guessed.status).toBe(200);
    expect(guessed.body.headers).toEqual(["Artikel", "Text", "ME", "Gewicht", "Platz"]);
    expect(guessed.body.problems.map((p: { row: number }) => p.row)).toEqual([1, 1, 1, 1, 1]);
    const mapping = JSON.stringify({ sku: 0, description: 1, uom: 2, unitWeightG: 3, bins: 4 });
    const mapped = await preview("items", file, "other.csv", { mapping });
    expect(mapped.status).toBe(200);
    expect(mapped.body.problems).toEqual([]);
    expect(mapped.body.preview).toEqual([[sku, "Wall plug", "PK", "60", bins[0]]]);
    expect(mapped.body.counts).toEqual({ rows: 1, items: 1 });
    expect((await itemsBySku()).has(sku)).toBe(false);
    const res = await importFile("items", file, "other.csv", { mapping });
    expect(res.status).toBe(201);
    expect((await itemsBySku()).get(sku)?.bins).toEqual([bins[0]]);
  });

  it("reports every kind of bad row with its sheet row number and writes nothing", async () => {
    const good = fresh("GOOD");
    const dup = fresh("DUP");
    const file = xlsx([
      ITEM_HEADER,
      [good, "Fine", "EA", 10, bins[0]!], // 2
      [fresh("X"), "Unknown bin", "EA", 10, "ZZ-999-9"], // 3
      [dup, "First", "EA", 10, bins[0]!], // 4
      [dup, "Second", "EA", 10, bins[0]!], // 5
      [fresh("X"), "Bad weight", "EA", "heavy", bins[0]!], // 6
      [fresh("X"), "", "EA", 10, bins[0]!], // 7
    ]);
    const p = await preview("items", file, "bad.xlsx");
    expect(p.status).toBe(200);
    expect(p.body.problems.map((x: { row: number }) => x.row)).toEqual([3, 5, 6, 7]);
    const res = await importFile("items", file, "bad.xlsx");
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/4 rows .* nothing was imported/);
    const byRow = Object.fromEntries(res.body.rows.map((x: { row: number; message: string }) => [x.row, x.message]));
    expect(byRow[3]).toMatch(/ZZ-999-9.*not in the chosen layout version/);
    expect(byRow[5]).toMatch(/listed twice.*row 4/);
    expect(byRow[6]).toMatch(/not a number/);
    expect(byRow[7]).toMatch(/description is empty/);
    const listed = await itemsBySku();
    expect(listed.has(good)).toBe(false);
    expect(listed.has(dup)).toBe(false);
  });
});

describe("order lines import", () => {
  const skuA = fresh("OA");
  const skuB = fresh("OB");
  const skuElsewhere = fresh("OTHERPLAN");

  beforeAll(async () => {
    expect(
      (
        await importFile(
          "items",
          csv([
            ITEM_HEADER,
            [skuA, "Item A", "EA", 100, bins[0]!],
            [skuB, "Item B", "BOX", 2500, `${bins[1]};${bins[2]}`],
          ]),
          "ab.csv",
        )
      ).status,
    ).toBe(201);
    // An item whose only bin is in another floor plan's layout version: it has no bin in Bramblegate's.
    const admin = await signInAs("admin");
    const plan = await api()
      .post("/api/floor-plans")
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ name: `Imports test ${RUN}`, widthM: 12, heightM: 7, cellMm: 1000 });
    expect(plan.status).toBe(201);
    const saved = await api()
      .put(`/api/floor-plans/${plan.body.id}/draft`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: smallDocument() });
    const start = await api()
      .post(`/api/floor-plans/${plan.body.id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: saved.body.version });
    expect(start.status).toBe(202);
    let job: { status: string; result: { layoutVersionId: number } } | undefined;
    for (let i = 0; i < 200 && !["done", "failed", "cancelled"].includes(job?.status ?? ""); i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = (await api().get(`/api/jobs/${start.body.jobId}`).set("Cookie", admin)).body.job;
    }
    expect(job?.status).toBe("done");
    const other = await importFile(
      "items",
      csv([ITEM_HEADER, [skuElsewhere, "Elsewhere", "EA", 1, "01-01-1"]]),
      "other.csv",
      { layoutVersionId: String(job!.result.layoutVersionId) },
    );
    expect(other.status).toBe(201);
  });

  it("imports orders with site-time cut-offs stored as UTC; a repeated submit is idempotent", async () => {
    const o1 = fresh("SO");
    const o2 = fresh("SO");
    const file = xlsx([
      ORDER_HEADER,
      [o1, 1, skuA, 3, "2026-07-01 09:05", 1, "PO-1"],
      [o1, 2, skuB, 1, "2026-07-01 09:05", 1, "PO-1"],
      [o2, 1, skuA, 2, "", "", ""],
    ]);
    const p = await preview("orders", file, "orders.xlsx");
    expect(p.status).toBe(200);
    expect(p.body).toMatchObject({ problems: [], counts: { rows: 3, orders: 2, lines: 3 }, duplicate: null });
    const res = await importFile("orders", file, "orders.xlsx");
    expect(res.status).toBe(201);
    expect(res.body.counts).toEqual({ rows: 3, orders: 2, lines: 3 });

    const open = await api().get("/api/orders?status=open").set("Cookie", planner);
    const first = open.body.orders.find((o: { orderNumber: string }) => o.orderNumber === o1);
    // Europe/London is on summer time (UTC+1) on 1 July.
    expect(first).toMatchObject({
      customerRef: "PO-1",
      priority: 1,
      cutoffAt: "2026-07-01T08:05:00.000Z",
      status: "open",
      lineCount: 2,
    });
    expect(open.body.orders.find((o: { orderNumber: string }) => o.orderNumber === o2)).toMatchObject({
      priority: 2,
      cutoffAt: null,
      customerRef: null,
    });

    const retry = await importFile("orders", file, "orders (1).xlsx");
    expect(retry.status).toBe(200);
    expect(retry.body).toMatchObject({
      alreadyImported: true,
      filename: "orders.xlsx",
      counts: { rows: 3, orders: 2, lines: 3 },
    });
    expect(typeof retry.body.importedAt).toBe("string");
    const numbers = await orderNumbers();
    expect(numbers.filter((n) => n === o1 || n === o2)).toHaveLength(2);
    const again = await preview("orders", file, "orders.xlsx");
    expect(again.body.duplicate).toMatchObject({ filename: "orders.xlsx" });

    // For wave planning: open orders with lines, weights and pick bins.
    const site = await db()("sites").where({ code: "BRAMBLEGATE" }).first("id");
    const planning = await openOrdersForPlanning(site.id, { priorities: [1], layoutVersionId: versionId });
    const mine = planning.find((o) => o.orderNumber === o1)!;
    expect(mine).toMatchObject({ cutoffAt: "2026-07-01T08:05:00.000Z", priority: 1, customerRef: "PO-1" });
    expect(mine.lines).toEqual([
      { lineId: expect.any(Number), lineNo: 1, sku: skuA, quantity: 3, unitWeightG: 100, binCodes: [bins[0]] },
      {
        lineId: expect.any(Number),
        lineNo: 2,
        sku: skuB,
        quantity: 1,
        unitWeightG: 2500,
        binCodes: [bins[1], bins[2]],
      },
    ]);
    expect(planning.some((o) => o.orderNumber === o2)).toBe(false);
  });

  it("reports every kind of bad row with its row number; one bad row writes nothing", async () => {
    const taken = fresh("SO");
    expect((await importFile("orders", csv([ORDER_HEADER, [taken, 1, skuA, 1, "", "", ""]]), "taken.csv")).status).toBe(
      201,
    );
    const ok = fresh("SO");
    const mixed = fresh("SO");
    const file = csv([
      ORDER_HEADER,
      [ok, 1, skuA, 1, "", "", ""], // 2 fine
      [fresh("SO"), 1, "NO-SUCH-SKU", 1, "", "", ""], // 3
      [fresh("SO"), 1, skuElsewhere, 1, "", "", ""], // 4
      [fresh("SO"), 1, skuA, 0, "", "", ""], // 5
      [fresh("SO"), 1, skuA, "2.5", "", "", ""], // 6
      [mixed, 1, skuA, 1, "2026-12-03 16:30", 1, ""], // 7 fine
      [mixed, 2, skuB, 1, "2026-12-03 17:30", 1, ""], // 8 cut-off disagrees
      [taken, 2, skuA, 1, "", "", ""], // 9 exists from another file
      [fresh("SO"), 1, skuA, 1, "", 4, ""], // 10
      [fresh("SO"), 1, "", 1, "", "", ""], // 11 missing SKU
    ]);
    const res = await importFile("orders", file, "bad-orders.csv");
    expect(res.status).toBe(400);
    const byRow = Object.fromEntries(res.body.rows.map((x: { row: number; message: string }) => [x.row, x.message]));
    expect(Object.keys(byRow).map(Number)).toEqual([3, 4, 5, 6, 8, 9, 10, 11]);
    expect(byRow[3]).toMatch(/not in the item master/);
    expect(byRow[4]).toMatch(/no pick bin in the chosen layout version/);
    expect(byRow[5]).toMatch(/Quantity “0”/);
    expect(byRow[6]).toMatch(/Quantity “2.5”/);
    expect(byRow[8]).toMatch(/cut-off differs from row 7/);
    expect(byRow[9]).toMatch(/already exists/);
    expect(byRow[10]).toMatch(/Priority “4”/);
    expect(byRow[11]).toMatch(/SKU is empty/);
    const numbers = await orderNumbers();
    expect(numbers).not.toContain(ok);
    expect(numbers).not.toContain(mixed);
    // The refused file was not recorded as imported (the same bytes are checked again, not waved
    // through), and its good order was not written (else the fixed file would hit "already exists").
    expect((await importFile("orders", file, "bad-orders.csv")).status).toBe(400);
    const fixed = await importFile("orders", csv([ORDER_HEADER, [ok, 1, skuA, 1, "", "", ""]]), "bad-orders.csv");
    expect(fixed.status).toBe(201);
  });
});

/**
 * A multipart upload by hand: the server refuses an oversize body from its declared length and
 * answers before reading it, which makes supertest fail on the broken pipe instead of showing the answer.
 */
function postEarlyAnswered(url: string, file: Buffer): Promise<{ status: number; text: string }> {
  const boundary = "----trailbin-test";
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="layoutVersionId"\r\n\r\n${versionId}\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`,
  );
  const body = Buffer.concat([head, file, Buffer.from(`\r\n--${boundary}--\r\n`)]);
  return new Promise((resolve, reject) => {
    let answered = false;
    const req = http.request(
      new URL(url, ORIGIN),
      {
        method: "POST",
        headers: {
          cookie: planner,
          origin: ORIGIN,
          "content-type": `multipart/form-data; boundary=${boundary}`,
          "content-length": body.length,
        },
      },
      (res) => {
        answered = true;
        let text = "";
        res.setEncoding("utf8");
        res.on("data", (c: string) => (text += c));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, text }));
      },
    );
    req.on("error", (e) => {
      if (!answered) reject(e);
    });
    req.end(body);
  });
}

describe("crafted and wrong files", () => {
  const protoKeys = () => Object.getOwnPropertyNames(Object.prototype).sort();

  it("prototype-pollution headers and cells, in CSV and .xlsx, change nothing and the server answers normally", async () => {
    const before = protoKeys();
    const sku = fresh("PROTO");
    const csvFile = Buffer.from(
      readFileSync(path.join(import.meta.dirname, "../fixtures/sheets/prototype-pollution.csv"), "utf8")
        .replaceAll("SKU_PLACEHOLDER", sku)
        .replaceAll("BIN_PLACEHOLDER", bins[0]!),
    );
    const rows = [
      ["__proto__", "constructor", "prototype", ...ITEM_HEADER],
      ["__proto__", "constructor", "prototype", `${sku}-X`, "__proto__", "EA", 1, bins[0]!],
      ["prototype", "__proto__", "constructor", `${sku}-Y`, "constructor", "prototype", 2, bins[0]!],
    ];
    // Written as text: an object literal's __proto__ would set its prototype instead of a key.
    const mapping =
      '{"__proto__":{"polluted":true},"constructor":1,"prototype":2,"sku":3,"description":4,"uom":5,"unitWeightG":6,"bins":7}';
    for (const [file, name] of [
      [csvFile, "proto.csv"],
      [xlsx(rows), "proto.xlsx"],
    ] as const) {
      const p = await preview("items", file, name, { mapping });
      expect(p.status).toBe(200);
      expect(p.body.headers.slice(0, 3)).toEqual(["__proto__", "constructor", "prototype"]);
      expect(Object.keys(p.body.mapping).sort()).toEqual(["bins", "description", "sku", "unitWeightG", "uom"]);
      expect(p.body.problems).toEqual([]);
      const res = await importFile("items", file, name, { mapping });
      expect(res.status).toBe(201);
      const o = await preview("orders", file, name, { mapping });
      expect(o.status).toBe(200);
    }
    const listed = await itemsBySku();
    expect(listed.get(`${sku}-X`)).toMatchObject({ description: "__proto__", uom: "EA" });
    expect(listed.get(`${sku}-Y`)).toMatchObject({ description: "constructor", uom: "prototype" });
    expect(listed.get(sku)).toMatchObject({ description: "__proto__" });
    expect(protoKeys()).toEqual(before);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect((await api().get("/api/health")).status).toBe(200);
    const normal = await preview(
      "items",
      csv([ITEM_HEADER, [fresh("AFTER"), "Normal", "EA", 1, bins[0]!]]),
      "after.csv",
    );
    expect(normal.status).toBe(200);
    expect(normal.body.problems).toEqual([]);
  });

  it("an oversize file gets 413 and a non-spreadsheet 415, with messages", async () => {
    const big = Buffer.alloc(MAX_UPLOAD_BYTES + 200 * 1024, "a");
    const tooBig = await postEarlyAnswered("/api/imports/items/preview", big);
    expect(tooBig.status).toBe(413);
    expect(JSON.parse(tooBig.text).error).toMatch(/larger than 5 MiB/);
    const binary = await importFile("items", Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0, 1, 2, 0]), "items.xlsx");
    expect(binary.status).toBe(415);
    expect(binary.body.error).toMatch(/not a spreadsheet/);
    const noVersion = await api()
      .post("/api/imports/items/preview")
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .attach("file", csv([ITEM_HEADER]), "x.csv");
    expect(noVersion.status).toBe(400);
    expect(JSON.stringify(noVersion.body)).toMatch(/layout version/);
  });

  it("an unknown kind is 404 and a picker gets 403", async () => {
    const unknown = await send("/api/imports/customers/preview", csv([ITEM_HEADER]), "x.csv");
    expect(unknown.status).toBe(404);
    expect(unknown.body.error).toMatch(/items.*orders/);
    const picker = await signInAs("picker");
    for (const url of ["/api/imports/items", "/api/imports/orders/preview"]) {
      const res = await send(url, csv([ITEM_HEADER]), "x.csv", {}, picker);
      expect(res.status).toBe(403);
    }
    expect((await api().get("/api/imports/orders/template").set("Cookie", picker)).status).toBe(403);
    expect((await api().get("/api/items").set("Cookie", picker)).status).toBe(403);
  });
});
