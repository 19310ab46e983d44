import type { Knex } from "knex";

// What every db module does to rows: the mariadb driver hands JSON columns back as text (or parsed,
// by version) and DATETIMEs as Date; `in (…)` lists and multi-row inserts go in slices so no
// statement grows past max_allowed_packet or the placeholder limit.

export const json = <T>(v: unknown): T => (typeof v === "string" ? JSON.parse(v) : v) as T;

export const iso = (d: Date | string | null): string | null => (d ? new Date(d).toISOString() : null);

/** A unique index refused the row (MariaDB error 1062). */
export const isDuplicateKey = (e: unknown): boolean =>
  (e as { code?: string } | null)?.code === "ER_DUP_ENTRY" || (e as { errno?: number } | null)?.errno === 1062;

export const CHUNK_ROWS = 1000;

export function chunks<T>(a: readonly T[], size = CHUNK_ROWS): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < a.length; i += size) out.push(a.slice(i, i + size));
  return out;
}

export async function insertInChunks(
  trx: Knex.Transaction,
  table: string,
  rows: readonly Record<string, unknown>[],
): Promise<void> {
  for (const part of chunks(rows)) await trx(table).insert(part);
}
