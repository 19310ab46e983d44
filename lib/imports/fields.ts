/*
 * The two spreadsheets a planner imports and their columns. The first alias of each field is the
 * template's header; the others are headers other systems commonly write, matched ignoring case,
 * spaces, "_" and "-". Pure: no database, no Next, so unit tests and the client can use it.
 */
export const IMPORT_KINDS = ["items", "orders"] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];

export type FieldDef<K extends string = string> = {
  key: K;
  label: string;
  required: boolean;
  aliases: readonly string[];
};

export const ITEM_FIELDS = [
  {
    key: "sku",
    label: "SKU",
    required: true,
    aliases: ["SKU", "item", "item code", "item number", "article", "product code"],
  },
  {
    key: "description",
    label: "Description",
    required: true,
    aliases: ["Description", "item description", "name", "item name"],
  },
  { key: "uom", label: "Unit of measure", required: true, aliases: ["Unit of measure", "uom", "unit", "units"] },
  {
    key: "unitWeightG",
    label: "Unit weight (g)",
    required: true,
    aliases: ["Unit weight (g)", "unit weight", "weight", "weight (g)", "weight g", "grams"],
  },
  {
    key: "bins",
    label: "Pick bins",
    required: true,
    aliases: ["Pick bins", "pick bin", "bins", "bin", "location", "locations", "location code"],
  },
] as const satisfies readonly FieldDef[];

export const ORDER_FIELDS = [
  {
    key: "orderNumber",
    label: "Order number",
    required: true,
    aliases: ["Order number", "order", "order no", "order #", "order id"],
  },
  { key: "lineNo", label: "Line", required: true, aliases: ["Line", "line no", "line number", "order line"] },
  {
    key: "sku",
    label: "SKU",
    required: true,
    aliases: ["SKU", "item", "item code", "item number", "article", "product code"],
  },
  { key: "quantity", label: "Quantity", required: true, aliases: ["Quantity", "qty", "quantity ordered", "units"] },
  {
    key: "cutoff",
    label: "Cut-off",
    required: false,
    aliases: ["Cut-off", "cutoff", "cut-off time", "cutoff time", "ship by", "collection time"],
  },
  { key: "priority", label: "Priority", required: false, aliases: ["Priority", "prio"] },
  {
    key: "customerRef",
    label: "Customer reference",
    required: false,
    aliases: ["Customer reference", "customer ref", "customer po", "po number", "reference"],
  },
] as const satisfies readonly FieldDef[];

export type ItemField = (typeof ITEM_FIELDS)[number]["key"];
export type OrderField = (typeof ORDER_FIELDS)[number]["key"];

export function fieldsOf(kind: ImportKind): readonly FieldDef[] {
  return kind === "items" ? ITEM_FIELDS : ORDER_FIELDS;
}

export function isImportKind(s: string): s is ImportKind {
  return (IMPORT_KINDS as readonly string[]).includes(s);
}

/** Bin codes in one cell: separated by ";" (or a line break, which a spreadsheet cell may hold). */
export const BIN_SEPARATOR = ";";
