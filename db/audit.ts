import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";

export type AuditEvent =
  | "sign_in.success"
  | "sign_in.failure"
  | "sign_in.throttled"
  | "sign_out"
  | "session.expired"
  | "session.refused"
  | "access.anonymous"
  | "access.denied"
  | "origin.refused"
  | "user.created"
  | "user.changed"
  | "site.changed"
  | "user.invited"
  | "password.set"
  | "password.set_refused"
  | "password.reset_requested"
  | "password.reset_throttled"
  | "layout.publish_started"
  | "layout.published"
  | "floor_plan.saved"
  | "wave.created"
  | "wave.plan_started"
  | "wave.plans_compared"
  | "wave.plan_kept"
  | "wave.released"
  | "wave.discarded"
  | "wave.edited"
  | "wave.orders_changed"
  | "batch.recalled"
  | "batch.printed"
  | "batch.taken"
  | "batch.given-back"
  | "batch.assigned"
  | "batch.taken-back"
  | "batch.moved"
  | "pick.confirmed"
  | "pick.short"
  | "shortpick.followed_up"
  | "replenishment.cleared";

export type AuditEntry = {
  event: AuditEvent;
  actorUserId?: string | null;
  subject?: string | null;
  ip?: string | null;
  detail?: unknown;
};

/** Writes one audit row; inside `trx` when given, so that it commits (or not) with the change it records. */
export async function audit(entry: AuditEntry, trx?: Knex.Transaction): Promise<void> {
  await (trx ?? db())("audit_log").insert({
    event: entry.event,
    actor_user_id: entry.actorUserId ?? null,
    subject: entry.subject?.slice(0, 254) ?? null,
    ip: entry.ip?.slice(0, 64) ?? null,
    detail: entry.detail === undefined ? null : JSON.stringify(entry.detail),
  });
}

export type AuditDTO = {
  id: number;
  at: string;
  event: string;
  actorUserId: string | null;
  subject: string | null;
  ip: string | null;
};

export async function latestAudit(limit: number, event?: AuditEvent): Promise<AuditDTO[]> {
  const q = db()("audit_log").orderBy("id", "desc").limit(limit);
  if (event) q.where({ event });
  const rows = await q;
  return rows.map(
    (r: {
      id: number;
      at: Date;
      event: string;
      actor_user_id: string | null;
      subject: string | null;
      ip: string | null;
    }) => ({
      id: Number(r.id),
      at: r.at.toISOString(),
      event: r.event,
      actorUserId: r.actor_user_id,
      subject: r.subject,
      ip: r.ip,
    }),
  );
}
