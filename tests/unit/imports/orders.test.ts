import { describe, expect, it } from "vitest";
import { ORDER_FIELDS } from "@/lib/imports/fields";
import { guessMapping } from "@/lib/imports/mapping";
import { validateOrderRows, type OrderLookups } from "@/lib/imports/orders";
import { parseCutoff, siteLocalToUtc } from "@/lib/imports/cutoff";

const header = ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"];
const mapping = guessMapping(header, ORDER_FIELDS);
const look: OrderLookups = {
  timeZone: "Europe/London",
  items: new Map([
    ["A-1", { itemId: 11, binsInVersion: 1 }],
    ["A-2", { itemId: 12, binsInVersion: 2 }],
    ["NOBIN", { itemId: 13, binsInVersion: 0 }],
  ]),
  existingOrders: new Set(["SO-OLD"]),
};

describe("cut-off times in site time", () => {
  // Europe/London is UTC+0 in winter and UTC+1 (BST) from the last Sunday of March (UK summer time rules).
  it("converts winter and summer wall-clock times to UTC", () => {
    expect(parseCutoff("2026-12-03 16:30", "Europe/London")).toEqual({
      ok: true,
      utc: new Date("2026-12-03T16:30:00Z"),
    });
    expect(parseCutoff("2026-07-01T09:05", "Europe/London")).toEqual({
      ok: true,
      utc: new Date("2026-07-01T08:05:00Z"),
    });
    expect(parseCutoff("2026-07-01 09:05", "America/New_York")).toEqual({
      ok: true,
      utc: new Date("2026-07-01T13:05:00Z"),
    });
  });
  it("takes an explicit offset as it is", () => {
    expect(parseCutoff("2026-07-01T09:05:00+02:00", "Europe/London")).toEqual({
      ok: true,
      utc: new Date("2026-07-01T07:05:00Z"),
    });
    expect(parseCutoff("2026-07-01T09:05:00Z", "Europe/London")).toEqual({
      ok: true,
      utc: new Date("2026-07-01T09:05:00Z"),
    });
  });
  it("refuses a time the clocks skip and takes the first of a time that happens twice", () => {
    // 29 March 2026 01:00 GMT the clocks go to 02:00 BST; 25 October 2026 02:00 BST they go back to 01:00 GMT.
    expect(siteLocalToUtc(2026, 3, 29, 1, 30, 0, "Europe/London")).toBeNull();
    expect(siteLocalToUtc(2026, 10, 25, 1, 30, 0, "Europe/London")).toEqual(new Date("2026-10-25T00:30:00Z"));
  });
  it("refuses what is not a date and time", () => {
    for (const t of ["3/12/26 16:30", "2026-02-30 10:00", "2026-12-03 25:00", "tomorrow"])
      expect(parseCutoff(t, "Europe/London").ok).toBe(false);
  });
});

describe("order line rows", () => {
  it("groups lines into orders with default priority 2 and no cut-off", () => {
    const r = validateOrderRows(
      [
        ["SO-1", "1", "A-1", "3", "2026-12-03 16:30", "1", "PO-9"],
        ["SO-1", "2", "a-2", "1", "2026-12-03 16:30", "1", "PO-9"],
        ["SO-2", "1", "A-1", "5", "", "", ""],
      ],
      mapping,
      look,
    );
    expect(r.problems).toEqual([]);
    expect(r.lineCount).toBe(3);
    expect(r.orders).toEqual([
      {
        firstRow: 2,
        orderNumber: "SO-1",
        customerRef: "PO-9",
        priority: 1,
        cutoffAt: new Date("2026-12-03T16:30:00Z"),
        lines: [
          { row: 2, lineNo: 1, itemId: 11, sku: "A-1", quantity: 3 },
          { row: 3, lineNo: 2, itemId: 12, sku: "a-2", quantity: 1 },
        ],
      },
      {
        firstRow: 4,
        orderNumber: "SO-2",
        customerRef: null,
        priority: 2,
        cutoffAt: null,
        lines: [{ row: 4, lineNo: 1, itemId: 11, sku: "A-1", quantity: 5 }],
      },
    ]);
  });

  it("reports every kind of bad row with its sheet row number", () => {
    const r = validateOrderRows(
      [
        ["SO-1", "1", "A-1", "3", "2026-12-03 16:30", "1", "PO-9"], // 2 fine
        ["SO-1", "2", "A-1", "0", "2026-12-03 16:30", "1", "PO-9"], // 3 quantity
        ["SO-1", "3", "A-1", "1.5", "2026-12-03 16:30", "1", "PO-9"], // 4 quantity
        ["SO-1", "4", "ZZZ", "1", "2026-12-03 16:30", "1", "PO-9"], // 5 unknown SKU
        ["SO-1", "5", "NOBIN", "1", "2026-12-03 16:30", "1", "PO-9"], // 6 no bin
        ["SO-1", "6", "A-1", "1", "2026-12-03 17:00", "1", "PO-9"], // 7 cut-off differs
        ["SO-1", "7", "A-1", "1", "2026-12-03 16:30", "3", "PO-9"], // 8 priority differs
        ["SO-1", "8", "A-1", "1", "2026-12-03 16:30", "1", "PO-X"], // 9 customer differs
        ["SO-1", "1", "A-1", "1", "2026-12-03 16:30", "1", "PO-9"], // 10 line twice
        ["SO-OLD", "1", "A-1", "1", "", "", ""], // 11 exists
        ["SO-3", "1", "A-1", "1", "", "7", ""], // 12 priority
        ["SO-4", "1", "A-1", "1", "soon", "", ""], // 13 cut-off
        ["", "1", "A-1", "1", "", "", ""], // 14 order number
        ["SO-5", "x", "A-1", "1", "", "", ""], // 15 line
      ],
      mapping,
      look,
    );
    const byRow = Object.fromEntries(r.problems.map((p) => [p.row, p.message]));
    expect(Object.keys(byRow).map(Number)).toEqual([3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]);
    expect(byRow[3]).toMatch(/Quantity “0”/);
    expect(byRow[4]).toMatch(/Quantity “1.5”/);
    expect(byRow[5]).toMatch(/not in the item master/);
    expect(byRow[6]).toMatch(/no pick bin in the chosen layout version/);
    expect(byRow[7]).toMatch(/cut-off differs from row 2/);
    expect(byRow[8]).toMatch(/priority differs from row 2/);
    expect(byRow[9]).toMatch(/customer reference differs from row 2/);
    expect(byRow[10]).toMatch(/line 1 is listed twice \(first on row 2\)/);
    expect(byRow[11]).toMatch(/already exists/);
    expect(byRow[12]).toMatch(/Priority “7”/);
    expect(byRow[13]).toMatch(/Cut-off “soon”/);
    expect(byRow[14]).toMatch(/order number is empty/);
    expect(byRow[15]).toMatch(/Line “x”/);
  });
});
