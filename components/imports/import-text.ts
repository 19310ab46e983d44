import type { ImportKind } from "@/lib/imports/fields";
import type { ImportAnswer } from "@/lib/contracts/imports";
import { formatDateTime, type DateStyle } from "@/lib/format/dates";

export function importedSentence(kind: ImportKind, a: ImportAnswer, style?: DateStyle): string {
  const c = a.counts;
  if (a.alreadyImported) {
    return `This file was already imported on ${formatDateTime(a.importedAt, style)} (as “${a.filename}”, ${c.orders ?? 0} orders, ${c.lines ?? 0} lines). Nothing was added again.`;
  }
  if (kind === "items")
    return `Imported ${c.items ?? 0} SKUs: ${c.inserted ?? 0} new, ${c.updated ?? 0} updated (their bins replaced).`;
  return `Imported ${c.orders ?? 0} orders with ${c.lines ?? 0} order lines.`;
}

/** Spreadsheet column letters, so "Column C" matches what the person sees in their sheet. */
export function columnLetter(i: number): string {
  let s = "";
  for (let n = i + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}
