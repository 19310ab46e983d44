import "server-only";
import { HttpError } from "@/lib/http/errors";
import { readSheet, SheetError } from "@/lib/sheets/read";
import type { RowProblem } from "@/lib/sheets/columns";
import { getLayoutVersionById, listLayoutBins } from "@/db/layout-versions";
import { getSite } from "@/db/sites";
import { itemsWithBinsInVersion } from "@/db/items";
import { existingOrderNumbers } from "@/db/orders";
import { findImport, type ImportRecordDTO } from "@/db/imports";
import { fieldsOf } from "./fields";
import { cell, isBlankRow, resolveMapping, type ColumnMapping } from "./mapping";
import { binLookup, validateItemRows, type ItemRecord } from "./items";
import { referencedKeys, validateOrderRows, type OrderRecord } from "./orders";
import type { ImportRequest } from "./request";
import type { ImportCounts } from "@/lib/contracts/imports";

export const PREVIEW_ROWS = 10;

export type Analysis = {
  headers: string[];
  mapping: ColumnMapping;
  fields: { key: string; label: string; required: boolean }[];
  preview: string[][];
  problems: RowProblem[];
  counts: ImportCounts;
  duplicate: ImportRecordDTO | null;
  items: ItemRecord[];
  orders: OrderRecord[];
};

/** Reads and checks an import without writing anything: what the preview shows and the import runs on. */
export async function analyseImport(siteId: number, r: ImportRequest): Promise<Analysis> {
  const version = await getLayoutVersionById(siteId, r.layoutVersionId);
  if (!version)
    throw new HttpError(400, "The chosen layout version does not exist at this site. Choose one from the list.");
  let rows: string[][];
  try {
    rows = (await readSheet(r.bytes)).rows;
  } catch (e) {
    if (e instanceof SheetError) throw new HttpError(e.status, e.message);
    throw e;
  }
  const fields = fieldsOf(r.kind);
  const [rawHeader, ...body] = rows;
  const headers = (rawHeader ?? []).map((h) => h.trim());
  const { mapping, problems } = resolveMapping(headers, fields, r.mapping);
  if (headers.every((h) => h === ""))
    problems.unshift({
      row: 1,
      message: "The sheet is empty: row 1 must hold the column headers (download the template).",
    });
  const filled = body.filter((row) => !isBlankRow(row));
  const preview = filled.slice(0, PREVIEW_ROWS).map((row) => fields.map((f) => cell(row, mapping, f.key)));
  const duplicate = await findImport(siteId, r.kind, r.sha256);
  const base = {
    headers,
    mapping,
    fields: fields.map(({ key, label, required }) => ({ key, label, required })),
    preview,
    duplicate,
    items: [],
    orders: [],
  };

  if (r.kind === "items") {
    const skus = new Set(filled.map((row) => cell(row, mapping, "sku").toUpperCase()).filter(Boolean));
    const counts = { rows: filled.length, items: skus.size };
    if (problems.length) return { ...base, problems, counts };
    const bins = binLookup((await listLayoutBins(version.id)).map((b) => b.code));
    const checked = validateItemRows(body, mapping, bins);
    return { ...base, problems: checked.problems, counts, items: checked.items };
  }

  const keys = referencedKeys(body, mapping);
  const counts = { rows: filled.length, orders: keys.orderNumbers.length, lines: filled.length };
  // The same bytes were imported already: importing them again changes nothing, so nothing to check.
  if (problems.length || duplicate) return { ...base, problems, counts };
  const site = await getSite(siteId);
  const [items, existingOrders] = await Promise.all([
    itemsWithBinsInVersion(siteId, version.id, keys.skus),
    existingOrderNumbers(siteId, keys.orderNumbers),
  ]);
  const checked = validateOrderRows(body, mapping, { timeZone: site?.timezone ?? "UTC", items, existingOrders });
  return { ...base, problems: checked.problems, counts, orders: checked.orders };
}
