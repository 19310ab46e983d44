import "server-only";
import { db } from "./knex";
import type { DateStyle } from "@/lib/format/dates";

export type SiteDTO = {
  id: number;
  code: string;
  name: string;
  timezone: string;
  walkingSpeedMmPerS: number;
  secondsPerLine: number;
  maxOpenBatchesPerPicker: number;
  /** How every screen, mail and print writes this site's dates and times. */
  dateStyle: DateStyle;
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
        dateStyle: { timeZone: r.timezone, dateOrder: r.date_order ?? "dmy", clock: r.clock ?? "24h" },
      }
    : null;
}
