import { unescapeFormula } from "./formula-escape";

/** Column names a sheet may use for each field; matched ignoring case, spaces, "_" and "-". */
export type ColumnAliases<K extends string> = Record<K, readonly string[]>;

const norm = (s: string) => s.toLowerCase().replace(/[\s_\-]+/g, "");

export type RowProblem = { row: number; message: string };

/**
 * Where each wanted field sits in the header row. Missing required columns are one problem each on
 * row 1, named with the header to add, so the person can fix the sheet in one go.
 */
export function mapColumns<K extends string>(
  header: readonly string[],
  aliases: ColumnAliases<K>,
  required: readonly K[],
): { columns: Partial<Record<K, number>>; problems: RowProblem[] } {
  const columns: Partial<Record<K, number>> = {};
  const seen = header.map(norm);
  for (const key of Object.keys(aliases) as K[]) {
    const at = seen.findIndex((h) => aliases[key].some((a) => norm(a) === h));
    if (at >= 0) columns[key] = at;
  }
  const problems = required
    .filter((k) => columns[k] === undefined)
    .map((k) => ({ row: 1, message: `No column “${aliases[k][0]}” in the header row.` }));
  return { columns, problems };
}

/** The cell, trimmed, without the apostrophe an export put before formula-like text. */
export function cellOf<K extends string>(row: readonly string[], columns: Partial<Record<K, number>>, key: K): string {
  const i = columns[key];
  return i === undefined ? "" : unescapeFormula((row[i] ?? "").trim());
}
