import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { isDuplicateKey } from "./rows";
import type { ImportKind } from "@/lib/imports/fields";

export type ImportRecordDTO = {
  id: number;
  filename: string;
  rowCount: number;
  importedAt: string;
  importedBy: string | null;
};

const toDTO = (r: {
  id: number;
  filename: string;
  row_count: number;
  imported_at: Date;
  imported_by: string | null;
}): ImportRecordDTO => ({
  id: r.id,
  filename: r.filename,
  rowCount: r.row_count,
  importedAt: r.imported_at.toISOString(),
  importedBy: r.imported_by,
});

/** The earlier import of the same bytes at this site, if any. */
export async function findImport(
  siteId: number,
  kind: ImportKind,
  sha256: string,
  trx?: Knex,
): Promise<ImportRecordDTO | null> {
  const r = await (trx ?? db())("import_files").where({ site_id: siteId, kind, sha256 }).first();
  return r ? toDTO(r) : null;
}

export class DuplicateImportError extends Error {}

/**
 * Notes an accepted file. For orders the unique (site, kind, sha256) key makes a second, concurrent
 * import of the same file fail here, inside its transaction, so nothing of it is written. An item
 * master file may be applied again (it only updates the same SKUs): its record is refreshed.
 */
export async function recordImport(
  trx: Knex.Transaction,
  r: { siteId: number; kind: ImportKind; sha256: string; filename: string; rowCount: number; userId: string | null },
): Promise<number> {
  const row = {
    site_id: r.siteId,
    kind: r.kind,
    sha256: r.sha256,
    filename: r.filename,
    row_count: r.rowCount,
    imported_by: r.userId,
  };
  if (r.kind === "items") {
    await trx("import_files")
      .insert(row)
      .onConflict(["site_id", "kind", "sha256"])
      .merge({ filename: r.filename, row_count: r.rowCount, imported_by: r.userId, imported_at: trx.fn.now(3) });
    const got = await trx("import_files").where({ site_id: r.siteId, kind: r.kind, sha256: r.sha256 }).first("id");
    return got.id as number;
  }
  try {
    const [id] = await trx("import_files").insert(row);
    return id as number;
  } catch (e) {
    if (isDuplicateKey(e)) throw new DuplicateImportError("this file was imported already");
    throw e;
  }
}
