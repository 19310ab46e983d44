import { describe, expect, it } from "vitest";
import { ITEM_FIELDS } from "@/lib/imports/fields";
import { guessMapping } from "@/lib/imports/mapping";
import { binLookup, validateItemRows } from "@/lib/imports/items";

const header = ["SKU", "Description", "Unit of measure", "Unit weight (g)", "Pick bins"];
const mapping = guessMapping(header, ITEM_FIELDS);
const bins = binLookup(["01-001-1", "01-001-2", "01-002-1"]);

describe("item master rows", () => {
  it("reads good rows, several bins per cell in order, ignoring case of bin codes", () => {
    const r = validateItemRows(
      [
        ["A-1", "Bolt", "BOX", "1250", "01-001-2; 01-001-1"],
        ["A-2", "Nut", "EA", "12.6", "01-002-1"],
      ],
      mapping,
      bins,
    );
    expect(r.problems).toEqual([]);
    expect(r.items).toEqual([
      { row: 2, sku: "A-1", description: "Bolt", uom: "BOX", unitWeightG: 1250, bins: ["01-001-2", "01-001-1"] },
      { row: 3, sku: "A-2", description: "Nut", uom: "EA", unitWeightG: 13, bins: ["01-002-1"] },
    ]);
    expect(validateItemRows([["A-1", "Bolt", "BOX", "1", "01-001-1"]], mapping, bins).items[0]!.bins).toEqual([
      "01-001-1",
    ]);
  });

  it("reports every kind of bad row with its sheet row number (header is row 1)", () => {
    const r = validateItemRows(
      [
        ["A-1", "Bolt", "BOX", "1250", "01-001-1"],
        ["A-2", "", "BOX", "10", "01-001-1"],
        ["A-3", "Nut", "BOX", "ten", "01-001-1"],
        ["A-4", "Nut", "BOX", "-5", "01-001-1"],
        ["A-5", "Nut", "BOX", "5", "99-999-9"],
        ["a-1", "Bolt again", "BOX", "5", "01-001-1"],
        ["", "", "", "", ""],
        ["A-6", "Plug", "PK", "5", ""],
      ],
      mapping,
      bins,
    );
    const byRow = Object.fromEntries(r.problems.map((p) => [p.row, p.message]));
    expect(Object.keys(byRow).map(Number)).toEqual([3, 4, 5, 6, 7, 9]);
    expect(byRow[3]).toMatch(/description is empty/);
    expect(byRow[4]).toMatch(/not a number/);
    expect(byRow[5]).toMatch(/not a number/);
    expect(byRow[6]).toMatch(/99-999-9.*not in the chosen layout version/);
    expect(byRow[7]).toMatch(/listed twice.*row 2/);
    expect(byRow[9]).toMatch(/No pick bin/);
  });

  it("says so when there are no data rows", () => {
    expect(validateItemRows([], mapping, bins).problems).toEqual([
      { row: 2, message: expect.stringMatching(/no items/) },
    ]);
  });
});
