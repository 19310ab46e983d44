import { describe, expect, it } from "vitest";
import { eachDataRow, firstRowOf } from "@/lib/imports/mapping";

describe("data rows", () => {
  it("numbers rows as the sheet does (the header is row 1) and passes by blank ones", () => {
    const seen: [string, number][] = [];
    eachDataRow([["a"], ["", "  "], ["b", ""], []], (r, row) => seen.push([r[0]!, row]));
    expect(seen).toEqual([
      ["a", 2],
      ["b", 4],
    ]);
  });

  it("points a repeated key back at the row it was first seen on", () => {
    const rows = new Map<string, number>();
    expect(firstRowOf(rows, "SKU-1", 2)).toBeUndefined();
    expect(firstRowOf(rows, "SKU-2", 3)).toBeUndefined();
    expect(firstRowOf(rows, "SKU-1", 5)).toBe(2);
    expect(firstRowOf(rows, "SKU-1", 7)).toBe(2);
  });
});
