import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as XLSX from "xlsx";
import { api, ORIGIN } from "../support/app";
import {
  buildHostileScenario,
  HOSTILE,
  HOSTILE_DEPOT,
  HOSTILE_DROPOFF,
  hostileCode,
  type HostileScenario,
} from "../support/hostile";
import { closeDb, db } from "@/db/knex";

afterAll(closeDb);

let s: HostileScenario;
beforeAll(async () => {
  s = await buildHostileScenario();
}, 180_000);

describe("hostile text is stored exactly and comes back the same through the JSON APIs", () => {
  it("user names", async () => {
    const res = await api().get("/api/users").set("Cookie", s.admin);
    expect(res.status).toBe(200);
    const byId = new Map(res.body.users.map((u: { id: string; displayName: string }) => [u.id, u.displayName]));
    for (const u of s.users) expect(byId.get(u.id)).toBe(u.displayName);
    // …and the session of the hostile-named picker says the same name.
    const me = await api().get("/api/session").set("Cookie", s.pickerCookie);
    expect(me.body.user.displayName).toBe(HOSTILE[0]);
  });

  it("floor plan names", async () => {
    const res = await api().get("/api/floor-plans").set("Cookie", s.admin);
    const byId = new Map(res.body.floorPlans.map((p: { id: number; name: string }) => [p.id, p.name]));
    s.planIds.forEach((id, i) => expect(byId.get(id)).toBe(s.planNames[i]));
  });

  it("bin codes made from a pattern's literal text, and depot and drop-off names, in the published layout", async () => {
    const res = await api().get(`/api/floor-plans/${s.planId}/versions/1`).set("Cookie", s.admin);
    expect(res.status).toBe(200);
    const codes = new Set(res.body.bins.map((b: { code: string }) => b.code));
    for (const code of [
      hostileCode("R1", 1, 1),
      hostileCode("R1", 10, 2),
      hostileCode("R2", 11, 1),
      hostileCode("R2", 20, 2),
    ])
      expect(codes).toContain(code);
    expect(res.body.version.document.depots[0].name).toBe(HOSTILE_DEPOT);
    expect(res.body.version.document.dropoffs[0].name).toBe(HOSTILE_DROPOFF);
  });

  it("items from the item master import: SKU, description, unit and bin exactly as in the sheet", async () => {
    const res = await api().get("/api/items").set("Cookie", s.planner);
    const bySku = new Map(res.body.items.map((i: { sku: string }) => [i.sku, i]));
    for (const it of s.items)
      expect(bySku.get(it.sku)).toMatchObject({
        sku: it.sku,
        description: it.description,
        uom: it.uom,
        bins: [it.bin],
      });
  });

  it("orders from the order import: order number and customer reference exactly as in the sheet", async () => {
    const res = await api().get("/api/orders?status=all").set("Cookie", s.planner);
    const byNumber = new Map(res.body.orders.map((o: { orderNumber: string }) => [o.orderNumber, o]));
    for (const o of s.orders)
      expect(byNumber.get(o.orderNumber)).toMatchObject({ orderNumber: o.orderNumber, customerRef: o.customerRef });
  });

  it("the wave's name, its short-pick list and the handheld's batch", async () => {
    const res = await api().get(`/api/waves/${s.waveId}`).set("Cookie", s.planner);
    expect(res.body.wave.name).toBe(s.waveName);
    expect(res.body.wave.orderCount).toBe(HOSTILE.length);
    const short = res.body.shortPicks[0];
    const item = s.items.find((i) => i.sku === short.sku);
    expect(item, "the short pick names one of our SKUs exactly").toBeDefined();
    expect(short.binCode).toBe(item!.bin);
    expect(s.orders.map((o) => o.orderNumber)).toContain(short.orderNumber);

    const pick = await api().get(`/api/batches/${s.batchIds[0]}/pick`).set("Cookie", s.pickerCookie);
    expect(pick.status).toBe(200);
    const lines = pick.body.stops.flatMap(
      (st: { lines: { sku: string; description: string; binCode: string }[] }) => st.lines,
    );
    expect(lines.length).toBe(HOSTILE.length);
    for (const l of lines) {
      const it = s.items.find((i) => i.sku === l.sku)!;
      expect(l).toMatchObject({ sku: it.sku, description: it.description, binCode: it.bin });
    }
  });

  it("a short-pick reason is one of the handheld's fixed choices: free text is refused and nothing is recorded", async () => {
    const batchId = s.batchIds[0]!;
    const line = await db()("batch_lines")
      .where({ batch_id: batchId })
      .whereNot({ order_line_id: s.shortLineId })
      .first("order_line_id", "pick_status", "bin_code");
    const { version: batchVersion } = await db()("batches").where({ id: batchId }).first("version");
    for (const reason of HOSTILE) {
      const res = await api()
        .post(`/api/batches/${batchId}/confirm`)
        .set("Cookie", s.pickerCookie)
        .set("Origin", ORIGIN)
        .send({
          idempotencyKey: `${s.tag}-reason-${HOSTILE.indexOf(reason)}`,
          orderLineId: line.order_line_id,
          quantity: 0,
          short: { reason },
          binCode: line.bin_code,
          batchVersion,
        });
      expect(res.status).toBe(400);
    }
    expect(
      await db()("batch_lines").where({ order_line_id: line.order_line_id }).first("pick_status", "short_reason"),
    ).toEqual({ pick_status: line.pick_status, short_reason: null });
  });

  it("the SQL-looking text did nothing to the tables", async () => {
    const n = Number((await db()("orders").count({ n: "*" }).first())!.n);
    expect(n).toBeGreaterThanOrEqual(HOSTILE.length);
  });
});

describe("exported spreadsheets keep hostile text inert", () => {
  it("the item master export has every description as text; one that looks like a formula is escaped, and no cell is a formula", async () => {
    const res = await api()
      .get("/api/items/export")
      .set("Cookie", s.planner)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    const book = XLSX.read(res.body as Buffer, { type: "buffer", cellFormula: true });
    const sheet = book.Sheets[book.SheetNames[0]!]!;
    for (const [ref, cell] of Object.entries(sheet)) {
      if (ref.startsWith("!")) continue;
      expect((cell as XLSX.CellObject).f, `cell ${ref} is a formula`).toBeUndefined();
    }
    const rows = XLSX.utils.sheet_to_json<string[]>(sheet, { header: 1, raw: true });
    const bySku = new Map(rows.map((r) => [String(r[0]), r]));
    for (const it of s.items) {
      const row = bySku.get(it.sku);
      expect(row, `export has ${it.sku}`).toBeDefined();
      // OWASP "CSV Injection": a leading = + - @ tab or CR is prefixed with an apostrophe.
      expect(row![1]).toBe(/^[=+\-@\t\r]/.test(it.description) ? `'${it.description}` : it.description);
      expect(row![4]).toBe(it.bin);
    }
  });
});
