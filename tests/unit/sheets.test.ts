import { describe, expect, it } from "vitest";
import * as XLSX from "xlsx";
import { readSheet, sniffSheet, SheetError, MAX_UNPACKED_BYTES, MAX_ROWS } from "@/lib/sheets/read";
import { zipUnpackedBytes } from "@/lib/sheets/zip-size";
import { csvText, safeCell } from "@/lib/sheets/write";
import { mapColumns } from "@/lib/sheets/columns";

function workbook(rows: (string | number)[][]): Uint8Array {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(rows), "S");
  return new Uint8Array(XLSX.write(book, { type: "buffer", bookType: "xlsx", compression: true }) as Buffer);
}

describe("reading spreadsheets", () => {
  it("reads an .xlsx into rows of strings", async () => {
    const r = await readSheet(
      workbook([
        ["a", "b"],
        [1, "x"],
      ]),
    );
    expect(r).toEqual({
      kind: "xlsx",
      rows: [
        ["a", "b"],
        ["1", "x"],
      ],
    });
  });
  it("reads UTF-8 CSV", async () => {
    expect((await readSheet(new TextEncoder().encode("\uFEFFcode,qty\nÅ-1,007\n"))).rows).toEqual([
      ["code", "qty"],
      ["Å-1", "007"],
    ]);
  });
  it("refuses binary that is not a workbook", () => {
    expect(() => sniffSheet(new Uint8Array([0x7f, 0x45, 0x4c, 0x46, 0, 0]))).toThrow(SheetError);
  });
  it("refuses an empty file", async () => {
    await expect(readSheet(new Uint8Array())).rejects.toMatchObject({ status: 400 });
  });
  it("a crafted header row cannot pollute Object.prototype", async () => {
    const r = await readSheet(new TextEncoder().encode("__proto__,constructor,polluted\n1,2,3\n"));
    expect(r.rows[0]).toEqual(["__proto__", "constructor", "polluted"]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

describe("zip size before unpacking", () => {
  it("sums what the workbook would unpack to", () => {
    const bytes = workbook([["x".repeat(1000)]]);
    const unpacked = zipUnpackedBytes(bytes)!;
    expect(unpacked).toBeGreaterThan(1000);
  });
  it("reads a forged huge size from the central directory and the reader refuses it", async () => {
    const bytes = workbook([["a"]]);
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    // Find the first central directory header and claim 4 GiB unpacked.
    for (let i = 0; i < bytes.length - 4; i++) {
      if (view.getUint32(i, true) === 0x02014b50) {
        view.setUint32(i + 24, 0xffffffff, true);
        break;
      }
    }
    expect(zipUnpackedBytes(bytes)).toBeGreaterThan(MAX_UNPACKED_BYTES);
    await expect(readSheet(bytes)).rejects.toMatchObject({ status: 413 });
  });
  it("says null for a zip without a directory", () =>
    expect(zipUnpackedBytes(new Uint8Array([0x50, 0x4b, 3, 4, 0, 0]))).toBeNull());
});

describe("writing spreadsheets", () => {
  it.each(["=1+1", "+1", "-1", "@SUM(A1)", "\tx", "\rx"])("neutralises the formula-looking %j", (v) =>
    expect(safeCell(v)).toBe(`'${v}`),
  );
  it("leaves ordinary text and numbers alone", () => {
    expect(safeCell("A-01-1")).toBe("A-01-1");
    expect(safeCell(-3)).toBe(-3);
  });
  it("quotes CSV cells that need it", () =>
    expect(csvText([["a,b", 'say "hi"', "=x"]])).toBe('"a,b","say ""hi""",\'=x\r\n'));
});

describe("header mapping", () => {
  it("matches headers ignoring case, spaces and dashes, and names the missing ones", () => {
    const { columns, problems } = mapColumns(
      ["Location-Code", "QTY"],
      { code: ["Location code"], qty: ["Quantity", "qty"], sku: ["SKU"] },
      ["code", "qty", "sku"],
    );
    expect(columns).toEqual({ code: 0, qty: 1 });
    expect(problems).toEqual([{ row: 1, message: "No column “SKU” in the header row." }]);
  });
});

describe("row numbers", () => {
  it("keep blank rows, so a problem on sheet row 5 is reported as row 5", async () => {
    const { rows } = await readSheet(new TextEncoder().encode("a,b\n1,2\n,\n\n3,4\n"));
    expect(rows.findIndex((r) => r[0] === "3") + 1).toBe(5);
  });
});

describe("row cap", () => {
  const csv = (dataRows: number) =>
    new TextEncoder().encode("n\n" + Array.from({ length: dataRows }, (_, i) => String(i)).join("\n") + "\n");
  it(`reads a sheet of exactly ${MAX_ROWS.toLocaleString("en")} data rows below its header`, async () => {
    const { rows } = await readSheet(csv(MAX_ROWS));
    expect(rows).toHaveLength(MAX_ROWS + 1);
    expect(rows.at(-1)).toEqual([String(MAX_ROWS - 1)]);
  });
  it("refuses one row more, saying to split the file", async () => {
    await expect(readSheet(csv(MAX_ROWS + 1))).rejects.toMatchObject({
      status: 413,
      message: expect.stringMatching(/Split it/),
    });
  });
});
