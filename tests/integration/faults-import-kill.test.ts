import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import type { Connection, RowDataPacket } from "mysql2/promise";
import { api, ORIGIN, signInAs } from "../support/app";
import { appUserConnection } from "../support/db-direct";
import { closeDb, db } from "@/db/knex";

// The app's database connection is killed (KILL CONNECTION, MariaDB's own statement) while an order
// import is writing: the person gets a 503 that says nothing was saved, the database holds no row
// of that import, and the same file imported again goes in whole, once.

const ORDER_HEADER = ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"];
// 2,500 orders of 2 lines: the orders go in 500 a statement (db/orders.ts), so the kill below,
// aimed at the statement holding order 1,200, lands after 1,000 orders and their lines were written.
const ORDERS = 2500;
const LINES_PER_ORDER = 2;
const TARGET = 1200;
const ATTEMPTS = 5;

const RUN = `K${Date.now().toString(36).toUpperCase()}`;
const marks: string[] = [];
let planner = "";
let skus: string[] = [];
let watcher: Connection;

const orderNumber = (mark: string, i: number) => `${mark}-${String(i).padStart(5, "0")}`;

function orderSheet(mark: string): Buffer {
  const rows = [ORDER_HEADER.join(",")];
  for (let i = 0; i < ORDERS; i++) {
    for (let l = 1; l <= LINES_PER_ORDER; l++)
      rows.push([orderNumber(mark, i), l, skus[(i + l) % skus.length], 1 + ((i + l) % 5), "", 3, ""].join(","));
  }
  return Buffer.from(rows.join("\n") + "\n");
}

const importOrders = (file: Buffer, name: string) =>
  api()
    .post("/api/imports/orders")
    .set("Cookie", planner)
    .set("Origin", ORIGIN)
    .field("layoutVersionId", "1")
    .attach("file", file, name);

type Killed = { id: number; info: string };

/**
 * Watches the process list for the app's INSERT of the chunk holding order TARGET of this import and
 * kills that connection at once. Resolves null if the import ended before the statement was seen.
 */
async function killDuringInsert(mark: string, importDone: () => boolean): Promise<Killed | null> {
  const pattern = `insert into \`orders\`%${orderNumber(mark, TARGET)}%`;
  while (!importDone()) {
    const [rows] = await watcher.query<RowDataPacket[]>(
      "SELECT ID, INFO FROM information_schema.PROCESSLIST WHERE USER = ? AND ID <> CONNECTION_ID() AND COMMAND = 'Query' AND INFO LIKE ?",
      [process.env.DB_USER, pattern],
    );
    const hit = rows[0];
    if (hit) {
      await watcher.query(`KILL CONNECTION ${Number(hit.ID)}`);
      return { id: Number(hit.ID), info: String(hit.INFO) };
    }
  }
  return null;
}

async function rowsOfImport(mark: string, sha256: string) {
  const orders = await db()("orders").where("order_number", "like", `${mark}-%`).select("id", "order_number");
  const ids = orders.map((o: { id: number }) => o.id);
  const lines = ids.length ? await db()("order_lines").whereIn("order_id", ids).select("order_id", "line_no") : [];
  const files = await db()("import_files").where({ sha256 }).select("id");
  return { orders, lines, files };
}

const totalLines = async () => Number((await db()("order_lines").count({ n: "*" }).first())!.n);

beforeAll(async () => {
  planner = await signInAs("planner");
  const items = await api().get("/api/items").set("Cookie", planner);
  expect(items.status).toBe(200);
  skus = items.body.items
    .filter((i: { bins: string[] }) => i.bins.length > 0)
    .map((i: { sku: string }) => i.sku)
    .slice(0, 20);
  expect(skus.length).toBeGreaterThan(5);
  watcher = await appUserConnection();
});

afterAll(async () => {
  // The orders this test put in are its own: take them out so later tests plan waves of the usual size.
  for (const mark of marks) {
    const ids = (await db()("orders").where("order_number", "like", `${mark}-%`).select("id", "import_file_id")) as {
      id: number;
      import_file_id: number;
    }[];
    const fileIds = [...new Set(ids.map((o) => o.import_file_id))];
    for (let i = 0; i < ids.length; i += 500)
      await db()("order_lines")
        .whereIn(
          "order_id",
          ids.slice(i, i + 500).map((o) => o.id),
        )
        .delete();
    for (let i = 0; i < ids.length; i += 500)
      await db()("orders")
        .whereIn(
          "id",
          ids.slice(i, i + 500).map((o) => o.id),
        )
        .delete();
    if (fileIds.length) await db()("import_files").whereIn("id", fileIds).delete();
  }
  await watcher?.end();
  await closeDb();
});

describe("the database connection killed in the middle of an order import", () => {
  it("answers 503 'nothing was saved', leaves no row of the import, and the same file then imports whole, once", async () => {
    let killed: Killed | null = null;
    let mark = "";
    let file: Buffer = Buffer.alloc(0);
    let answer: Awaited<ReturnType<typeof importOrders>> | null = null;
    const linesBefore = await totalLines();

    // The kill has to land inside the write; if the import outran the watcher, try with a new file.
    for (let attempt = 1; attempt <= ATTEMPTS && !killed; attempt++) {
      mark = `${RUN}${attempt}`;
      marks.push(mark);
      file = orderSheet(mark);
      let done = false;
      const request = importOrders(file, `${mark}.csv`).then((r) => {
        done = true;
        return r;
      });
      killed = await killDuringInsert(mark, () => done);
      answer = await request;
      if (!killed)
        expect(
          answer.status,
          `attempt ${attempt} was not killed, so it must have gone in: ${JSON.stringify(answer.body)}`,
        ).toBe(201);
    }
    expect(killed, `the import's INSERT was not caught in ${ATTEMPTS} attempts`).not.toBeNull();

    // What was killed: this import's INSERT of the orders chunk with order TARGET, after earlier chunks.
    expect(killed!.info).toMatch(/^insert into `orders`/i);
    expect(killed!.info).toContain(orderNumber(mark, TARGET));
    expect(killed!.info).not.toContain(orderNumber(mark, 0));
    // The killed thread stays listed (as Killed) while the server rolls its transaction back.
    let listed: RowDataPacket[] = [];
    for (let i = 0; i < 100; i++) {
      [listed] = await watcher.query<RowDataPacket[]>(
        "SELECT ID, COMMAND FROM information_schema.PROCESSLIST WHERE ID = ?",
        [killed!.id],
      );
      if (listed.length === 0) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(listed, "the killed connection is gone").toEqual([]);

    expect(answer!.status, JSON.stringify(answer!.body)).toBe(503);
    expect(answer!.body.error).toMatch(/database connection dropped, so nothing was saved\. Try again/);
    expect(answer!.headers["retry-after"]).toMatch(/^\d+$/);

    const sha256 = createHash("sha256").update(file).digest("hex");
    const after = await rowsOfImport(mark, sha256);
    expect(after).toEqual({ orders: [], lines: [], files: [] });
    expect(await totalLines()).toBe(linesBefore);

    // The same file again: every order and line once.
    const retry = await importOrders(file, `${mark}.csv`);
    expect(retry.status, JSON.stringify(retry.body)).toBe(201);
    expect(retry.body.counts).toEqual({
      rows: ORDERS * LINES_PER_ORDER,
      orders: ORDERS,
      lines: ORDERS * LINES_PER_ORDER,
    });
    const stored = await rowsOfImport(mark, sha256);
    expect(stored.files).toHaveLength(1);
    expect(new Set(stored.orders.map((o: { order_number: string }) => o.order_number)).size).toBe(ORDERS);
    expect(stored.orders).toHaveLength(ORDERS);
    expect(
      new Set(stored.lines.map((l: { order_id: number; line_no: number }) => `${l.order_id}/${l.line_no}`)).size,
    ).toBe(ORDERS * LINES_PER_ORDER);
    expect(stored.lines).toHaveLength(ORDERS * LINES_PER_ORDER);
    expect(await totalLines()).toBe(linesBefore + ORDERS * LINES_PER_ORDER);

    // And the server goes on with other requests on its remaining connections.
    expect((await api().get("/api/health")).status).toBe(200);
  });
});
