import "server-only";
import { db } from "./knex";
import { audit } from "./audit";
import { BATCH_WAVE_COLUMNS, OPEN_STATUSES, shortLinesColumn, toBatchWave } from "./batch-columns";
import { iso } from "./rows";
import type { FloorBatchDTO, HandoverKind } from "@/lib/contracts/shift";

/** Statuses the floor shows; anything else (planned, or a status added later) is not out on the floor. */
const FLOOR_BATCH_STATUSES = ["released", "picking", "done"] as const;

/** The stored part of a floor batch: the contract's fields that come straight from the row, and its walk. */
export type FloorBatchRow = Pick<
  FloorBatchDTO,
  | "id"
  | "waveId"
  | "waveName"
  | "number"
  | "status"
  | "version"
  | "pickerId"
  | "pickerName"
  | "takenAt"
  | "startedAt"
  | "finishedAt"
  | "lineCount"
  | "doneLines"
  | "shortLines"
> & { distanceMm: number };

export type HandoverRow = {
  batchId: number;
  kind: HandoverKind;
  fromUser: string | null;
  toUser: string | null;
  byUser: string | null;
  byName: string | null;
  toName: string | null;
  at: string;
};

/**
 * Every batch of a wave that is out on the floor: a wave with a batch still to finish, or one that
 * finished within the last day, so the shift sees what it did without the list growing for ever.
 */
export async function floorBatches(siteId: number): Promise<FloorBatchRow[]> {
  const rows = await db()("batches as b")
    .join("waves as w", "w.id", "b.wave_id")
    .leftJoin("users as u", "u.id", "b.assigned_to")
    .where("w.site_id", siteId)
    .where("w.status", "released")
    .whereIn("b.status", FLOOR_BATCH_STATUSES)
    .whereExists(function () {
      this.from("batches as o")
        .whereRaw("o.wave_id = w.id")
        .where((q) => q.whereIn("o.status", OPEN_STATUSES).orWhereRaw("o.finished_at > now(3) - interval 24 hour"));
    })
    .select(
      ...BATCH_WAVE_COLUMNS,
      "b.assigned_to",
      "u.display_name as picker_name",
      "b.taken_at",
      "b.started_at",
      "b.finished_at",
      "b.line_count",
      "b.distance_mm",
      db().raw(
        "(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status <> 'open') as done_lines",
      ),
      shortLinesColumn(),
    )
    .orderBy([{ column: "w.released_at" }, { column: "b.wave_id" }, { column: "b.number" }]);
  return rows.map((r: Record<string, unknown>) => ({
    ...toBatchWave(r),
    pickerId: (r.assigned_to as string | null) ?? null,
    pickerName: (r.picker_name as string | null) ?? null,
    takenAt: iso(r.taken_at as Date | null),
    startedAt: iso(r.started_at as Date | null),
    finishedAt: iso(r.finished_at as Date | null),
    lineCount: Number(r.line_count),
    doneLines: Number(r.done_lines),
    shortLines: Number(r.short_lines),
    distanceMm: Number(r.distance_mm),
  }));
}

const handoverQuery = () =>
  db()("batch_handovers as h")
    .leftJoin("users as by", "by.id", "h.by_user")
    .leftJoin("users as to", "to.id", "h.to_user")
    .select(
      "h.batch_id",
      "h.kind",
      "h.from_user",
      "h.to_user",
      "h.by_user",
      "by.display_name as by_name",
      "to.display_name as to_name",
      "h.at",
    )
    .orderBy([
      { column: "h.at", order: "desc" },
      { column: "h.id", order: "desc" },
    ]);

const toHandover = (r: Record<string, unknown>): HandoverRow => ({
  batchId: Number(r.batch_id),
  kind: r.kind as HandoverKind,
  fromUser: (r.from_user as string | null) ?? null,
  toUser: (r.to_user as string | null) ?? null,
  byUser: (r.by_user as string | null) ?? null,
  byName: (r.by_name as string | null) ?? null,
  toName: (r.to_name as string | null) ?? null,
  at: iso(r.at as Date)!,
});

/** The latest handover of each of these batches. */
export async function lastHandovers(batchIds: number[]): Promise<Map<number, HandoverRow>> {
  const out = new Map<number, HandoverRow>();
  if (batchIds.length === 0) return out;
  for (const r of await handoverQuery().whereIn("h.batch_id", batchIds)) {
    const h = toHandover(r);
    if (!out.has(h.batchId)) out.set(h.batchId, h);
  }
  return out;
}

/**
 * The handover that took this batch away from the user, if the last one touching them did: the
 * handheld of a picker who lost the batch says who moved it and when.
 */
export async function handoverAwayFrom(batchId: number, userId: string): Promise<HandoverRow | null> {
  const r = await handoverQuery()
    .where("h.batch_id", batchId)
    .where((q) => q.where("h.from_user", userId).orWhere("h.to_user", userId))
    .first();
  const h = r ? toHandover(r) : null;
  return h && h.fromUser === userId ? h : null;
}

/** For each of these batches, who last assigned or moved it to the user (My batches says so). */
export async function handoversTo(userId: string, batchIds: number[]): Promise<Map<number, HandoverRow>> {
  const out = new Map<number, HandoverRow>();
  if (batchIds.length === 0) return out;
  for (const r of await handoverQuery().whereIn("h.batch_id", batchIds).where("h.to_user", userId)) {
    const h = toHandover(r);
    if (!out.has(h.batchId)) out.set(h.batchId, h);
  }
  return out;
}

export type FloorPickerRow = {
  id: string;
  name: string;
  openBatches: number;
  onShift: boolean;
  lastFinishedAt: string | null;
  lastLostAt: string | null;
  lastSignInAt: string | null;
};

/** Every picker account at the site that is not disabled, with what they hold and their latest moments. */
export async function floorPickers(siteId: number): Promise<FloorPickerRow[]> {
  const rows = await db()("users as u")
    .where({ "u.site_id": siteId, "u.role": "picker" })
    .whereNull("u.disabled_at")
    .select(
      "u.id",
      "u.display_name",
      "u.last_sign_in_at",
      db().raw(
        "(select count(*) from batches b where b.assigned_to = u.id and b.status in ('released', 'picking')) as open_batches",
      ),
      db().raw("exists (select 1 from sessions s where s.user_id = u.id and s.expires_at > now(3)) as on_shift"),
      db().raw(
        "(select max(b.finished_at) from batches b where b.assigned_to = u.id and b.status = 'done') as last_finished",
      ),
      db().raw("(select max(h.at) from batch_handovers h where h.from_user = u.id) as last_lost"),
    )
    .orderBy("u.display_name");
  return rows.map((r: Record<string, unknown>) => ({
    id: String(r.id),
    name: String(r.display_name),
    openBatches: Number(r.open_batches),
    onShift: Number(r.on_shift) === 1,
    lastFinishedAt: iso(r.last_finished as Date | null),
    lastLostAt: iso(r.last_lost as Date | null),
    lastSignInAt: iso(r.last_sign_in_at as Date | null),
  }));
}

/** Who may be given a batch: an active picker account at this site. */
export async function activePicker(siteId: number, userId: string): Promise<{ id: string; name: string } | null> {
  const r = await db()("users")
    .where({ id: userId, site_id: siteId, role: "picker" })
    .whereNull("disabled_at")
    .first("id", "display_name");
  return r ? { id: String(r.id), name: String(r.display_name) } : null;
}

export type AssignOutcome =
  | { kind: "changed"; handover: HandoverKind; from: string | null; to: string | null }
  | { kind: "missing" }
  | { kind: "stale" }
  | { kind: "not-on-floor"; status: string }
  | { kind: "same" }
  | { kind: "nobody" }
  | { kind: "target" }
  | { kind: "cap"; held: number };

/**
 * Gives the batch to `to` (or to nobody) if it is still at `version`. The target's user row is locked
 * first, as a picker's own take does, so an assignment and the picker's take are counted one after the
 * other and never pass the cap together; then the batch row. What was confirmed stays confirmed: only
 * the holder changes, and the version moves on, so the old holder's queued confirmations are refused.
 */
export async function assignBatch(
  siteId: number,
  batchId: number,
  version: number,
  to: string | null,
  by: { userId: string; ip: string },
  cap: number,
): Promise<AssignOutcome> {
  return db().transaction(async (trx) => {
    if (to !== null) {
      const target = await trx("users")
        .where({ id: to, site_id: siteId, role: "picker" })
        .whereNull("disabled_at")
        .forUpdate()
        .first("id");
      if (!target) return { kind: "target" as const };
    }
    const b = await trx("batches")
      .where({ id: batchId })
      .whereIn("wave_id", trx("waves").where({ site_id: siteId }).select("id"))
      .forUpdate()
      .first("status", "version", "assigned_to");
    if (!b) return { kind: "missing" as const };
    if (Number(b.version) !== version) return { kind: "stale" as const };
    if (!(OPEN_STATUSES as readonly string[]).includes(b.status))
      return { kind: "not-on-floor" as const, status: String(b.status) };
    const from = (b.assigned_to as string | null) ?? null;
    if (from === to) return to === null ? { kind: "nobody" as const } : { kind: "same" as const };
    if (to !== null) {
      const held = await trx("batches")
        .where({ assigned_to: to })
        .whereIn("status", OPEN_STATUSES)
        .count({ n: "*" })
        .first();
      if (Number(held?.n ?? 0) >= cap) return { kind: "cap" as const, held: Number(held?.n ?? 0) };
    }
    await trx("batches")
      .where({ id: batchId })
      .update({ assigned_to: to, taken_at: to === null ? null : trx.fn.now(3), version: version + 1 });
    const handover: HandoverKind = to === null ? "taken-back" : from === null ? "assigned" : "moved";
    await trx("batch_handovers").insert({
      batch_id: batchId,
      kind: handover,
      from_user: from,
      to_user: to,
      by_user: by.userId,
    });
    await audit(
      {
        event: `batch.${handover}`,
        actorUserId: by.userId,
        subject: `batch:${batchId}`,
        ip: by.ip,
        detail: { from, to },
      },
      trx,
    );
    return { kind: "changed" as const, handover, from, to };
  });
}
