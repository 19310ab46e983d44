import "server-only";
import { db } from "./knex";

export type UploadDTO = { id: string; mime: string; bytes: number; purpose: string };

export async function recordUpload(u: UploadDTO & { siteId: number; userId: string }): Promise<void> {
  await db()("uploads").insert({
    id: u.id,
    site_id: u.siteId,
    purpose: u.purpose,
    mime: u.mime,
    bytes: u.bytes,
    created_by: u.userId,
  });
}

export async function getUpload(siteId: number, id: string): Promise<UploadDTO | null> {
  const r = await db()("uploads").where({ id, site_id: siteId }).first("id", "mime", "bytes", "purpose");
  return r ?? null;
}
