import "server-only";
import { db } from "@/db/knex";
import { DuplicateImportError, findImport, recordImport, type ImportRecordDTO } from "@/db/imports";
import { upsertItems } from "@/db/items";
import { countsOfImport, insertOrders, OrderNumberTakenError } from "@/db/orders";
import { HttpError } from "@/lib/http/errors";
import type { Analysis } from "./analyse";
import type { AlreadyImported, ImportCounts } from "@/lib/contracts/imports";
import type { ImportRequest } from "./request";

export async function alreadyImported(record: ImportRecordDTO): Promise<AlreadyImported> {
  const c = await countsOfImport(record.id);
  return {
    alreadyImported: true,
    importedAt: record.importedAt,
    filename: record.filename,
    counts: { rows: record.rowCount, ...c },
  };
}

/** Writes a checked import in one transaction: all of it, or (on any failure) none of it. */
export async function commitImport(
  siteId: number,
  userId: string,
  r: ImportRequest,
  a: Analysis,
): Promise<{ counts: ImportCounts } | AlreadyImported> {
  try {
    return await db().transaction(async (trx) => {
      const fileId = await recordImport(trx, {
        siteId,
        kind: r.kind,
        sha256: r.sha256,
        filename: r.filename,
        rowCount: a.counts.rows,
        userId,
      });
      if (r.kind === "items") {
        const c = await upsertItems(trx, siteId, a.items);
        return { counts: { rows: a.counts.rows, items: a.items.length, inserted: c.inserted, updated: c.updated } };
      }
      const c = await insertOrders(trx, siteId, fileId, a.orders);
      return { counts: { rows: a.counts.rows, orders: c.orders, lines: c.lines } };
    });
  } catch (e) {
    if (e instanceof DuplicateImportError) {
      // The same file committed meanwhile (a double submit): answer as for any repeat.
      const record = await findImport(siteId, r.kind, r.sha256);
      if (record) return alreadyImported(record);
    }
    if (e instanceof OrderNumberTakenError)
      throw new HttpError(
        409,
        "Another import added one of these order numbers a moment ago; nothing was imported. Preview the file again to see which rows.",
      );
    throw e;
  }
}
