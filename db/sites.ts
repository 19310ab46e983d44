import "server-only";
import { db } from "./knex";

export type SiteDTO = {
  id: number;
  code: string;
  name: string;
  timezone: string;
  walkingSpeedMmPerS: number;
  secondsPerLine: number;
  maxOpenBatchesPerPicker: number;
};

/** The load run's handhelds each hold more carts than a person would: it raises the cap on its own database. */
export async function setMaxOpenBatchesPerPicker(n: number): Promise<void> {
  await db()("sites").update({ max_open_batches_per_picker: n });
}

export async function getSite(id: number): Promise<SiteDTO | null> {
  const r = await db()("sites").where({ id }).first();
  return r
    ? {
        id: r.id,
        code: r.code,
        name: r.name,
        timezone: r.timezone,
        walkingSpeedMmPerS: r.walking_speed_mm_s,
        secondsPerLine: r.seconds_per_line,
        maxOpenBatchesPerPicker: Number(r.max_open_batches_per_picker),
      }
    : null;
}
