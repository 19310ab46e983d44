import "server-only";
import { db } from "./knex";

export type SiteDTO = { id: number; code: string; name: string; timezone: string; walkingSpeedMmPerS: number; secondsPerLine: number; maxOpenBatchesPerPicker: number };

export async function getSite(id: number): Promise<SiteDTO | null> {
  const r = await db()("sites").where({ id }).first();
  return r
    ? { id: r.id, code: r.code, name: r.name, timezone: r.timezone, walkingSpeedMmPerS: r.walking_speed_mm_s, secondsPerLine: r.seconds_per_line, maxOpenBatchesPerPicker: Number(r.max_open_batches_per_picker) }
    : null;
}
