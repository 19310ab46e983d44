import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { isDuplicateKey } from "./rows";
import { headerText, InvalidAddressError, isValidAddress } from "@/lib/mail/headers";
import type { OutboxRow, OutboxStatus } from "@/lib/contracts/mail";

export type OutgoingMail = {
  /** One logical message, one key: queueing the same key twice keeps the first and sends it once. */
  dedupeKey: string;
  to: string;
  toName?: string | null;
  subject: string;
  text: string;
  html?: string | null;
  /** Not before this time (default: now). */
  notBefore?: Date;
};

type Row = {
  id: number;
  dedupe_key: string;
  to_address: string;
  to_name: string | null;
  subject: string;
  text_body: string;
  html_body: string | null;
  status: OutboxStatus;
  attempts: number;
  next_attempt_at: Date;
  last_error: string | null;
  created_at: Date;
  sent_at: Date | null;
};

const toDTO = (r: Row): OutboxRow => ({
  id: r.id,
  dedupeKey: r.dedupe_key,
  to: r.to_address,
  toName: r.to_name,
  subject: r.subject,
  text: r.text_body,
  html: r.html_body,
  status: r.status,
  attempts: r.attempts,
  nextAttemptAt: r.next_attempt_at.toISOString(),
  lastError: r.last_error,
  createdAt: r.created_at.toISOString(),
  sentAt: r.sent_at ? r.sent_at.toISOString() : null,
});

/**
 * Queues a message inside the caller's transaction, so it is sent only if the change that caused it
 * commits. Header fields lose any line breaks here, whatever the caller passed; an address that is not
 * plain local@domain is refused outright. Returns false when the dedupe key was already queued.
 */
export async function enqueueMail(trx: Knex.Transaction, msg: OutgoingMail): Promise<boolean> {
  const to = msg.to.trim().toLowerCase();
  if (!isValidAddress(to)) throw new InvalidAddressError(msg.to);
  const name = msg.toName ? headerText(msg.toName, 120) : "";
  try {
    await trx("outbox").insert({
      dedupe_key: msg.dedupeKey.slice(0, 191),
      to_address: to,
      to_name: name || null,
      subject: headerText(msg.subject, 200),
      text_body: msg.text,
      html_body: msg.html ?? null,
      next_attempt_at: msg.notBefore ?? new Date(),
    });
    return true;
  } catch (e) {
    // A duplicate key fails only this statement in MariaDB; the caller's transaction goes on.
    if (isDuplicateKey(e)) return false;
    throw e;
  }
}

/** Ids of rows due at `now`, oldest first; `ids` narrows the search (tests drive one message). */
export async function dueMailIds(now: Date, limit: number, ids?: number[]): Promise<number[]> {
  const q = db()("outbox")
    .select("id")
    .where({ status: "pending" })
    .andWhere("next_attempt_at", "<=", now)
    .orderBy("next_attempt_at")
    .limit(limit);
  if (ids) q.whereIn("id", ids);
  return (await q).map((r: { id: number }) => r.id);
}

/**
 * Takes one row for this sender. The conditional UPDATE is atomic, so of two senders racing for the
 * same row exactly one sees an affected row; the other moves on.
 */
export async function claimMail(id: number, now: Date): Promise<OutboxRow | null> {
  const n = await db()("outbox").where({ id, status: "pending" }).update({ status: "sending", claimed_at: now });
  if (n !== 1) return null;
  const row = (await db()("outbox").where({ id }).first()) as Row | undefined;
  return row ? toDTO(row) : null;
}

/**
 * A sent row keeps its envelope and subject for the record but loses its body: bodies hold one-time
 * links whose tokens the database otherwise keeps only as hashes.
 */
export async function markSent(id: number, now: Date): Promise<void> {
  await db()("outbox")
    .where({ id, status: "sending" })
    .update({
      status: "sent",
      sent_at: now,
      attempts: db().raw("attempts + 1"),
      last_error: null,
      text_body: "",
      html_body: null,
    });
}

export async function markAttemptFailed(
  id: number,
  attempts: number,
  error: string,
  next: { status: "pending"; nextAttemptAt: Date } | { status: "failed" },
): Promise<void> {
  await db()("outbox")
    .where({ id, status: "sending" })
    .update({
      status: next.status,
      attempts,
      last_error: error.slice(0, 500),
      ...(next.status === "pending" ? { next_attempt_at: next.nextAttemptAt } : {}),
    });
}

/**
 * A sender that died mid-send leaves its rows in "sending". After a generous grace they go back to
 * pending: the rare cost is a second copy of a message whose send was cut off, never a lost one.
 */
export async function releaseStaleClaims(olderThan: Date): Promise<number> {
  return db()("outbox")
    .where({ status: "sending" })
    .andWhere("claimed_at", "<", olderThan)
    .update({ status: "pending", claimed_at: null });
}

export async function getOutboxMail(id: number): Promise<OutboxRow | null> {
  const row = (await db()("outbox").where({ id }).first()) as Row | undefined;
  return row ? toDTO(row) : null;
}

export async function getOutboxMailByKey(dedupeKey: string): Promise<OutboxRow | null> {
  const row = (await db()("outbox").where({ dedupe_key: dedupeKey }).first()) as Row | undefined;
  return row ? toDTO(row) : null;
}

export async function listOutbox(limit: number): Promise<OutboxRow[]> {
  const rows = (await db()("outbox").orderBy("id", "desc").limit(limit)) as Row[];
  return rows.map(toDTO);
}
