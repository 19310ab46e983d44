import { describe, expect, it } from "vitest";
import { ITEM_FIELDS, ORDER_FIELDS } from "@/lib/imports/fields";
import { guessMapping, resolveMapping } from "@/lib/imports/mapping";

describe("column mapping", () => {
  it("finds the template's headers and common other names, ignoring case and spacing", () => {
    expect(guessMapping(["SKU", "Description", "UOM", "unit_weight", "Location"], ITEM_FIELDS)).toEqual({
      sku: 0,
      description: 1,
      uom: 2,
      unitWeightG: 3,
      bins: 4,
    });
    expect(guessMapping(["order no", "LINE", "item code", "qty"], ORDER_FIELDS)).toMatchObject({
      orderNumber: 0,
      lineNo: 1,
      sku: 2,
      quantity: 3,
      cutoff: null,
      priority: null,
    });
  });

  it("names each required field it cannot find, on row 1", () => {
    const { problems } = resolveMapping(["Artikel", "Text"], ITEM_FIELDS, undefined);
    expect(problems.map((p) => p.row)).toEqual([1, 1, 1, 1, 1]);
    expect(problems[0]!.message).toMatch(/“SKU”/);
  });

  it("takes the person's choices over the guess and refuses indexes outside the sheet", () => {
    const header = ["Artikel", "Text", "ME", "Gewicht", "Platz"];
    const ok = resolveMapping(header, ITEM_FIELDS, { sku: 0, description: 1, uom: 2, unitWeightG: 3, bins: 4 });
    expect(ok.problems).toEqual([]);
    const bad = resolveMapping(header, ITEM_FIELDS, { sku: 0, description: 1, uom: 2, unitWeightG: 3, bins: 9 });
    expect(bad.problems.some((p) => /Pick bins/.test(p.message))).toBe(true);
  });

  it("refuses one column for two fields", () => {
    const { problems } = resolveMapping(["SKU", "Description", "UOM", "Weight", "Bins"], ITEM_FIELDS, {
      description: 0,
    });
    expect(problems.some((p) => /both/.test(p.message))).toBe(true);
  });

  it("ignores keys that are not fields, such as __proto__, and pollutes nothing", () => {
    const chosen = JSON.parse('{"__proto__": {"polluted": 1}, "constructor": 3, "sku": 0}');
    const { mapping } = resolveMapping(["SKU", "Description", "UOM", "Weight", "Bins"], ITEM_FIELDS, chosen);
    expect(Object.keys(mapping).sort()).toEqual(["bins", "description", "sku", "unitWeightG", "uom"]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});
