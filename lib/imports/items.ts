import type { RowProblem } from "@/lib/sheets/columns";
import { BIN_SEPARATOR } from "./fields";
import { cell, eachDataRow, firstRowOf, type ColumnMapping } from "./mapping";

export type ItemRecord = {
  row: number;
  sku: string;
  description: string;
  uom: string;
  unitWeightG: number;
  bins: string[];
};

/** Bin codes of the chosen layout version, looked up ignoring case (MariaDB compares them that way). */
export type BinLookup = ReadonlyMap<string, string>;

export const binLookup = (codes: Iterable<string>): BinLookup => new Map([...codes].map((c) => [c.toUpperCase(), c]));

// The schema's column sizes (migrations/20261202000200_items_orders_waves.ts).
const MAX = { sku: 64, description: 200, uom: 16, bin: 32 } as const;
const MAX_WEIGHT_G = 4_000_000_000;

/** Grams as typed: digits with an optional decimal point; fractions are rounded to a whole gram. */
function grams(text: string): number | null {
  if (!/^\d+(\.\d+)?$/.test(text)) return null;
  const g = Math.round(Number(text));
  return g <= MAX_WEIGHT_G ? g : null;
}

/**
 * Data rows (sheet row 2 onwards) → item records. Every problem is reported with its sheet row
 * number; the caller writes nothing unless `problems` is empty.
 */
export function validateItemRows(
  body: readonly string[][],
  mapping: ColumnMapping,
  bins: BinLookup,
): { items: ItemRecord[]; problems: RowProblem[] } {
  const items: ItemRecord[] = [];
  const problems: RowProblem[] = [];
  const firstRowOfSku = new Map<string, number>();
  eachDataRow(body, (r, row) => {
    const messages: string[] = [];
    const sku = cell(r, mapping, "sku");
    const description = cell(r, mapping, "description");
    const uom = cell(r, mapping, "uom");
    const weightText = cell(r, mapping, "unitWeightG");
    const binText = cell(r, mapping, "bins");

    if (!sku) messages.push("The SKU is empty.");
    else if (sku.length > MAX.sku) messages.push(`SKU “${sku.slice(0, 20)}…” is longer than ${MAX.sku} characters.`);
    if (!description) messages.push("The description is empty.");
    else if (description.length > MAX.description)
      messages.push(`The description is longer than ${MAX.description} characters.`);
    if (!uom) messages.push("The unit of measure is empty (e.g. EA, BOX, PK).");
    else if (uom.length > MAX.uom)
      messages.push(`Unit of measure “${uom.slice(0, 20)}” is longer than ${MAX.uom} characters.`);
    const unitWeightG = weightText ? grams(weightText) : null;
    if (!weightText) messages.push("The unit weight is empty: give it in grams (0 if it does not matter).");
    else if (unitWeightG === null)
      messages.push(`Unit weight “${weightText}” is not a number of grams (digits only, e.g. 1250 or 12.5).`);

    const codes: string[] = [];
    const unknown: string[] = [];
    for (const raw of binText.split(new RegExp(`[${BIN_SEPARATOR}\\r\\n]`))) {
      const code = raw.trim();
      if (!code) continue;
      const known = bins.get(code.toUpperCase());
      if (!known) unknown.push(code);
      else if (!codes.includes(known)) codes.push(known);
    }
    if (unknown.length) {
      const shown = unknown
        .slice(0, 5)
        .map((c) => `“${c.slice(0, MAX.bin)}”`)
        .join(", ");
      messages.push(
        `${unknown.length === 1 ? "Bin" : "Bins"} ${shown}${unknown.length > 5 ? ` and ${unknown.length - 5} more` : ""} ${unknown.length === 1 ? "is" : "are"} not in the chosen layout version.`,
      );
    } else if (codes.length === 0)
      messages.push(`No pick bin: give at least one bin code (several separated by “${BIN_SEPARATOR}”).`);

    if (sku && sku.length <= MAX.sku) {
      const first = firstRowOf(firstRowOfSku, sku.toUpperCase(), row);
      if (first !== undefined) messages.push(`SKU ${sku} is listed twice in this file (first on row ${first}).`);
    }

    if (messages.length) problems.push({ row, message: messages.join(" ") });
    else items.push({ row, sku, description, uom, unitWeightG: unitWeightG!, bins: codes });
  });
  if (items.length === 0 && problems.length === 0)
    problems.push({ row: 2, message: "The sheet has a header row but no items below it." });
  return { items, problems };
}
