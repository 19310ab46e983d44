import "server-only";
import { db } from "./knex";

/**
 * Tables that change on requests that alter nothing a person made, so a "nothing was written"
 * check leaves them out. Each entry says why; anything not listed here is compared.
 */
export const SNAPSHOT_EXCLUDED: Record<string, string> = {
  // Every signed-in request may slide a session's idle expiry (lucia), and signing in makes a row.
  sessions: "sessions slide their idle expiry on any signed-in request",
  // Refused requests are audited on purpose (access.denied, origin.refused, password.set_refused).
  audit_log: "refusals are audited by design",
  // Sign-in and reset attempts are counted before they are answered, wrong ones included (lib/auth/throttle.ts).
  throttle_counters: "attempts are counted by the throttles by design",
  // The outbox sender and the SMTP sink run on their own clock: mail queued by an earlier request is
  // claimed, sent and received while other requests come in.
  outbox: "the mail sender updates it in the background",
  mail_sink_messages: "the local SMTP sink stores what the sender delivers, in the background",
};

export type TableState = { rows: number; checksum: string };

/** Row count and CHECKSUM TABLE of every table of the database (but the excluded), by name. */
export async function databaseSnapshot(
  excluded: readonly string[] = Object.keys(SNAPSHOT_EXCLUDED),
): Promise<Record<string, TableState>> {
  const k = db();
  const [tables] = (await k.raw(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
  )) as [{ name: string }[]];
  const out: Record<string, TableState> = {};
  for (const { name } of tables) {
    if (excluded.includes(name)) continue;
    const count = await k(name).count({ n: "*" }).first();
    const [sums] = (await k.raw("CHECKSUM TABLE ??", [name])) as [{ Checksum: string | number | null }[]];
    out[name] = { rows: Number(count?.n ?? 0), checksum: String(sums[0]?.Checksum ?? "") };
  }
  return out;
}
