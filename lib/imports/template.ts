import "server-only";
import * as XLSX from "xlsx";
import { safeCell } from "@/lib/sheets/write";
import { BIN_SEPARATOR, ITEM_FIELDS, ORDER_FIELDS, type ImportKind } from "./fields";

export const TEMPLATE_SHEET: Record<ImportKind, string> = { items: "Items", orders: "Order lines" };

export const templateHeader = (kind: ImportKind): string[] =>
  (kind === "items" ? ITEM_FIELDS : ORDER_FIELDS).map((f) => f.aliases[0]);

// The item master export writes formula-like text this way (lib/sheets/formula-escape.ts).
const APOSTROPHE_NOTE =
  "Text that starts with = + - or @ is exported with an apostrophe in front, so the spreadsheet shows it as text instead of running it; the import takes that one apostrophe off. To import text that really starts with an apostrophe followed by one of these characters, write two apostrophes.";

const HOW_TO: Record<ImportKind, string[][]> = {
  items: [
    ["How to fill in the item master"],
    ["One row per SKU, below the header row of the first sheet. Keep the headers; columns may be in any order."],
    ["Column", "Required", "What to write", "Example"],
    [
      "SKU",
      "yes",
      "Your item code, up to 64 characters. Each SKU once per file. An existing SKU is updated and its bins replaced; a new one is added.",
      "HB-M8X50-Z",
    ],
    ["Description", "yes", "Up to 200 characters.", "M8 × 50 mm hex bolt, zinc, box of 100"],
    ["Unit of measure", "yes", "Up to 16 characters.", "BOX"],
    [
      "Unit weight (g)",
      "yes",
      "Grams per unit of measure, digits only (a decimal point is allowed; it is rounded to whole grams). 0 if unknown.",
      "2750",
    ],
    [
      "Pick bins",
      "yes",
      `One or more location codes of the chosen layout version, separated by “${BIN_SEPARATOR}”. The first is the main pick bin.`,
      `01-001-1${BIN_SEPARATOR} 01-002-1`,
    ],
    [],
    ["Nothing is imported until every row is right: Trailbin lists each row to fix with its row number."],
    [APOSTROPHE_NOTE],
  ],
  orders: [
    ["How to fill in order lines"],
    ["One row per order line, below the header row of the first sheet. Keep the headers; columns may be in any order."],
    ["Column", "Required", "What to write", "Example"],
    [
      "Order number",
      "yes",
      "Up to 64 characters. All lines of one order share it. An order number that was imported before cannot be used again.",
      "SO-104233",
    ],
    ["Line", "yes", "Line number within the order, a whole number from 1; each once per order.", "1"],
    ["SKU", "yes", "An SKU of the item master that has a pick bin in the chosen layout version.", "HB-M8X50-Z"],
    ["Quantity", "yes", "A whole number from 1, in the item's unit of measure.", "3"],
    [
      "Cut-off",
      "no",
      "When the order must be packed, in the site's local time as YYYY-MM-DD HH:MM (or ISO 8601 with an offset). Format this column as Text so the spreadsheet keeps it as typed. Same on every line of an order.",
      "2026-12-03 16:30",
    ],
    ["Priority", "no", "1 (most urgent), 2 or 3; empty means 2. Same on every line of an order.", "1"],
    [
      "Customer reference",
      "no",
      "The customer's own reference, up to 120 characters. Same on every line of an order.",
      "PO-88812",
    ],
    [],
    [
      "Nothing is imported until every row is right: Trailbin lists each row to fix with its row number. Importing the same file again changes nothing.",
    ],
    [APOSTROPHE_NOTE],
  ],
};

/** The template workbook: the header row to fill in, and a second sheet that says how. */
export function templateWorkbook(kind: ImportKind): Buffer {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet([templateHeader(kind)]), TEMPLATE_SHEET[kind]);
  XLSX.utils.book_append_sheet(
    book,
    XLSX.utils.aoa_to_sheet(HOW_TO[kind].map((r) => r.map(safeCell))),
    "How to fill in",
  );
  return XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
}
