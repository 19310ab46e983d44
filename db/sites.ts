import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { audit } from "./audit";
import type { SiteChange, SiteDTO } from "@/lib/contracts/site";

export type { SiteDTO } from "@/lib/contracts/site";

/** The load run's handhelds each hold more carts than a person would: it raises the cap on its own database. */
export async function setMaxOpenBatchesPerPicker(n: number): Promise<void> {
  await db()("sites").update({ max_open_batches_per_picker: n });
}

type SiteRow = Record<string, unknown>;

function toDTO(r: SiteRow): SiteDTO {
  const dateOrder = (r.date_order as SiteDTO["dateOrder"] | undefined) ?? "dmy";
  const clock = (r.clock as SiteDTO["clock"] | undefined) ?? "24h";
  const timezone = String(r.timezone);
  return {
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    timezone,
    walkingSpeedMmPerS: Number(r.walking_speed_mm_s),
    secondsPerLine: Number(r.seconds_per_line),
    setupSecondsPerBatch: Number(r.setup_seconds_per_batch ?? 120),
    maxOpenBatchesPerPicker: Number(r.max_open_batches_per_picker),
    dateOrder,
    clock,
    units: (r.units as SiteDTO["units"] | undefined) ?? "metric",
    dateStyle: { timeZone: timezone, dateOrder, clock },
    version: Number(r.version ?? 1),
  };
}

export async function getSite(id: number): Promise<SiteDTO | null> {
  const r = await db()("sites").where({ id }).first();
  return r ? toDTO(r) : null;
}

const COLUMNS: Record<Exclude<keyof SiteChange, "walkingSpeedMPerS">, string> = {
  name: "name",
  timezone: "timezone",
  secondsPerLine: "seconds_per_line",
  setupSecondsPerBatch: "setup_seconds_per_batch",
  maxOpenBatchesPerPicker: "max_open_batches_per_picker",
  dateOrder: "date_order",
  clock: "clock",
  units: "units",
};

export type SiteSaved =
  | { ok: true; site: SiteDTO; changed: string[] }
  | { ok: false; reason: "missing" }
  | { ok: false; reason: "stale"; site: SiteDTO };

/**
 * Saves an admin's change under a row lock when the version they saw is still the stored one; the
 * audit line commits with it. A stale version changes nothing and hands back what is stored now.
 */
export async function updateSite(
  siteId: number,
  version: number,
  change: SiteChange,
  who: { userId: string; ip: string },
): Promise<SiteSaved> {
  return db().transaction(async (trx: Knex.Transaction) => {
    const row = await trx("sites").where({ id: siteId }).forUpdate().first();
    if (!row) return { ok: false, reason: "missing" } as const;
    const before = toDTO(row);
    if (before.version !== version) return { ok: false, reason: "stale", site: before } as const;
    const update: Record<string, unknown> = {};
    for (const [key, column] of Object.entries(COLUMNS)) {
      const v = change[key as keyof typeof COLUMNS];
      if (v !== undefined) update[column] = v;
    }
    if (change.walkingSpeedMPerS !== undefined) update.walking_speed_mm_s = Math.round(change.walkingSpeedMPerS * 1000);
    const changed = Object.keys(update).filter((c) => String(row[c]) !== String(update[c]));
    await trx("sites")
      .where({ id: siteId })
      .update({ ...update, version: before.version + 1 });
    const after = toDTO((await trx("sites").where({ id: siteId }).first())!);
    await audit(
      {
        event: "site.changed",
        actorUserId: who.userId,
        subject: `site ${siteId}`,
        ip: who.ip,
        detail: { changed: Object.fromEntries(changed.map((c) => [c, { from: row[c], to: update[c] }])) },
      },
      trx,
    );
    return { ok: true, site: after, changed } as const;
  });
}
