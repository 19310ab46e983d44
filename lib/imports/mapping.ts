import type { RowProblem } from "@/lib/sheets/columns";
import { unescapeFormula } from "@/lib/sheets/formula-escape";
import type { FieldDef } from "./fields";

/** Where each field sits in the sheet: a header index, or null for "not in this sheet". */
export type ColumnMapping = Record<string, number | null>;

const norm = (s: string) => s.toLowerCase().replace(/[\s_\-]+/g, "");

/** The mapping guessed from the header row by each field's aliases; each header is used at most once. */
export function guessMapping(header: readonly string[], fields: readonly FieldDef[]): ColumnMapping {
  const seen = header.map(norm);
  const used = new Set<number>();
  const out: ColumnMapping = Object.create(null);
  for (const f of fields) {
    const at = seen.findIndex((h, i) => !used.has(i) && h !== "" && f.aliases.some((a) => norm(a) === h));
    out[f.key] = at >= 0 ? at : null;
    if (at >= 0) used.add(at);
  }
  return out;
}

/**
 * The person's choices laid over the guess. Only the kind's own field names are read (so a key like
 * "__proto__" in the request is ignored), and an index must point at a header that exists.
 */
export function resolveMapping(
  header: readonly string[],
  fields: readonly FieldDef[],
  chosen: unknown,
): { mapping: ColumnMapping; problems: RowProblem[] } {
  const mapping = guessMapping(header, fields);
  const problems: RowProblem[] = [];
  if (chosen !== undefined && chosen !== null) {
    if (typeof chosen !== "object" || Array.isArray(chosen)) {
      problems.push({ row: 1, message: "The column mapping could not be read. Choose the columns again." });
    } else {
      for (const f of fields) {
        if (!Object.prototype.hasOwnProperty.call(chosen, f.key)) continue;
        const v = (chosen as Record<string, unknown>)[f.key];
        if (v === null) mapping[f.key] = null;
        else if (typeof v === "number" && Number.isInteger(v) && v >= 0 && v < header.length) mapping[f.key] = v;
        else
          problems.push({
            row: 1,
            message: `The column chosen for “${f.label}” is not a column of this sheet. Choose it again.`,
          });
      }
    }
  }
  const byColumn = new Map<number, string>();
  for (const f of fields) {
    const at = mapping[f.key];
    if (at === null || at === undefined) {
      if (f.required)
        problems.push({
          row: 1,
          message: `No column for “${f.label}”: add a column headed “${f.aliases[0]}” or choose which column holds it.`,
        });
      continue;
    }
    const other = byColumn.get(at);
    if (other)
      problems.push({
        row: 1,
        message: `Column “${header[at] ?? at + 1}” is chosen for both “${other}” and “${f.label}”. Choose one column per field.`,
      });
    else byColumn.set(at, f.label);
  }
  return { mapping, problems };
}

/**
 * A row's cell for a field, trimmed, without the apostrophe an export put before formula-like text;
 * empty when the field is not mapped.
 */
export function cell(row: readonly string[], mapping: ColumnMapping, key: string): string {
  const at = mapping[key];
  return at === null || at === undefined ? "" : unescapeFormula((row[at] ?? "").trim());
}

export const isBlankRow = (row: readonly string[]) => row.every((c) => c.trim() === "");

/** Calls `visit` with each data row that is not blank and its sheet row number (the header is row 1). */
export function eachDataRow(body: readonly string[][], visit: (r: readonly string[], row: number) => void): void {
  body.forEach((r, i) => {
    if (!isBlankRow(r)) visit(r, i + 2);
  });
}

/** The row `key` was first seen on, or undefined when this is the first time (and `row` is noted for it). */
export function firstRowOf(firstRows: Map<string, number>, key: string, row: number): number | undefined {
  const first = firstRows.get(key);
  if (first === undefined) firstRows.set(key, row);
  return first;
}
