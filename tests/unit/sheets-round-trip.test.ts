import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readSheet } from "@/lib/sheets/read";
import { csvText, safeCell, workbookBytes } from "@/lib/sheets/write";
import { cellOf } from "@/lib/sheets/columns";
import { cell } from "@/lib/imports/mapping";

// What Trailbin exports must import back unchanged, while no exported text cell starts with
// something a spreadsheet would run as a formula (= + - @, tab, CR, and their full-width forms).
const FORMULA_START = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;
const SEED = 20261203;
// Each case reads one workbook in the parse worker (~0.3 s); 30 values per workbook.
const RUNS = 12;

/** A value as an import stores it: the sheet cell through the importer's own reading. */
const imported = (raw: string) => cell([raw], { v: 0 }, "v");
const importedBin = (raw: string) => cellOf([raw], { v: 0 }, "v");

async function xlsxBack(values: readonly string[]): Promise<string[]> {
  const { rows } = await readSheet(new Uint8Array(workbookBytes("S", [["v"], ...values.map((v) => [v])])));
  return rows.slice(1).map((r) => r[0] ?? "");
}
async function csvBack(values: readonly string[]): Promise<string[]> {
  const { rows } = await readSheet(new TextEncoder().encode(csvText([["v"], ...values.map((v) => [v])])));
  return rows.slice(1).map((r) => r[0] ?? "");
}

// Values as Trailbin may hold them (an import trims; "'=x" comes from a cell "''=x").
const NAMED = [
  "=SKU1",
  "-20 °C freezer gloves",
  "+44 20 7946 0000",
  "@home",
  "\tTabbed",
  "'quoted by hand",
  "'=starts with an apostrophe and an equals sign",
  "''two apostrophes",
  "'",
  "＝SUM(A1)",
  "＋1",
  "－20",
  "＠x",
  "'＝x",
  "_x0041_ looks like a spreadsheet escape",
  "A-01-1",
];

// Hostile text: formula starters (ASCII and full-width), apostrophes, spreadsheet XML escapes,
// quotes, separators, line breaks and any other character, in any order.
const hostileUnit = fc.oneof(
  fc.constantFrom(
    "=",
    "+",
    "-",
    "@",
    "'",
    "\t",
    "\r",
    "\n",
    " ",
    '"',
    ",",
    ";",
    "\uFF1D",
    "\uFF0B",
    "\uFF0D",
    "\uFF20",
    "\uFF07",
    "_x0041_",
    "_x005F_",
    "_X000d_",
    "<",
    "&amp;",
  ),
  fc.string({ unit: "grapheme", minLength: 1, maxLength: 1 }),
);
const hostile = fc.string({ unit: hostileUnit, maxLength: 12 });
// The import trims and unescapes; what it produces is what an export later writes out.
const storedValues = fc.array(hostile.map(imported), { minLength: 1, maxLength: 30 });

describe("formula-safe cells", () => {
  it.each(["＝1+1", "＋1", "－1", "＠SUM(A1)"])("neutralises the full-width formula-looking %j", (v) =>
    expect(safeCell(v)).toBe(`'${v}`),
  );
  it.each(NAMED)("%j: exported, it does not start a formula", (v) =>
    expect(String(safeCell(v))).not.toMatch(FORMULA_START),
  );
});

describe("an unchanged export imports back to the same data", () => {
  it("the named cases, through .xlsx, as item fields and as bin codes", async () => {
    const back = await xlsxBack(NAMED);
    expect(back.map(imported)).toEqual(NAMED);
    expect(back.map(importedBin)).toEqual(NAMED);
  });

  it("the named cases, through CSV", async () => {
    const back = await csvBack(NAMED);
    expect(back.map(imported)).toEqual(NAMED);
  });

  it("a cell the export escaped loses exactly the apostrophe it added, and nothing else", () => {
    for (const v of NAMED) expect(imported(String(safeCell(v)))).toBe(v);
    // Apostrophes a person typed before ordinary text are theirs.
    expect(imported("'quoted")).toBe("'quoted");
  });

  it("hostile strings through .xlsx (fast-check): same value back, never a formula", async () => {
    await fc.assert(
      fc.asyncProperty(storedValues, async (values) => {
        for (const v of values) expect(String(safeCell(v))).not.toMatch(FORMULA_START);
        const back = await xlsxBack(values);
        expect(back.map(imported)).toEqual(values);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  }, 120_000);

  it("hostile strings through CSV (fast-check): same value back", async () => {
    // A CSV file holding a NUL byte is refused as not text, so NUL is left out here.
    const csvValues = fc.array(hostile.filter((s) => !s.includes("\u0000")).map(imported), {
      minLength: 1,
      maxLength: 30,
    });
    await fc.assert(
      fc.asyncProperty(csvValues, async (values) => {
        const back = await csvBack(values);
        expect(back.map(imported)).toEqual(values);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  }, 120_000);
});
