import "server-only";
import { claimMail, dueMailIds, markAttemptFailed, markSent, releaseStaleClaims } from "@/db/outbox";
import type { OutboxRow } from "@/lib/contracts/mail";
import { afterFailure } from "./backoff";
import { appOrigin, MAIL_FROM } from "./config";
import { smtpTransport, type MailTransport } from "./transport";

const BATCH = 20;
const TICK_MS = 1000;
const STALE_CLAIM_MS = 10 * 60_000;

export type SendReport = { sent: number[]; failed: number[] };

function messageId(row: OutboxRow): string {
  let host = "trailbin.invalid";
  try {
    host = new URL(appOrigin()).hostname || host;
  } catch {}
  return `<outbox-${row.id}@${host}>`;
}

async function sendOne(transport: MailTransport, row: OutboxRow, now: Date): Promise<boolean> {
  try {
    await transport.sendMail({
      from: MAIL_FROM,
      // The object form keeps the name out of address parsing; enqueueMail already removed line breaks.
      to: row.toName ? { name: row.toName, address: row.to } : row.to,
      subject: row.subject,
      text: row.text,
      ...(row.html ? { html: row.html } : {}),
      messageId: messageId(row),
      // Only the one recipient: never the addresses nodemailer might find in other fields.
      envelope: { from: MAIL_FROM.address, to: [row.to] },
      disableFileAccess: true,
      disableUrlAccess: true,
    });
    await markSent(row.id, now);
    return true;
  } catch (e) {
    const attempts = row.attempts + 1;
    await markAttemptFailed(row.id, attempts, (e as Error).message || String(e), afterFailure(attempts, now));
    return false;
  }
}

/**
 * Sends every message due at `now` once: claims each row (so a second sender skips it), sends it,
 * and records the result: sent, or another try later with backoff, or failed after the last try.
 * The server's loop calls it every second; tests call it with their own clock, transport or rows.
 */
export async function sendDueMail(
  opts: { now?: Date; transport?: MailTransport; ids?: number[] } = {},
): Promise<SendReport> {
  const now = opts.now ?? new Date();
  const report: SendReport = { sent: [], failed: [] };
  const ids = await dueMailIds(now, BATCH, opts.ids);
  if (ids.length === 0) return report;
  const transport = opts.transport ?? smtpTransport();
  try {
    for (const id of ids) {
      const row = await claimMail(id, now);
      if (!row) continue;
      (await sendOne(transport, row, now)) ? report.sent.push(id) : report.failed.push(id);
    }
  } finally {
    if (!opts.transport) transport.close();
  }
  return report;
}

const globalForSender = globalThis as unknown as { trailbinOutboxSender?: ReturnType<typeof setInterval> };

/** Once per server process (instrumentation.ts): a tick a second, never two ticks at once. */
export async function startOutboxSender(): Promise<void> {
  if (globalForSender.trailbinOutboxSender) return;
  const released = await releaseStaleClaims(new Date(Date.now() - STALE_CLAIM_MS));
  if (released > 0) console.log(`outbox: ${released} message(s) left mid-send by an earlier run will be tried again`);
  let busy = false;
  globalForSender.trailbinOutboxSender = setInterval(() => {
    if (busy) return;
    busy = true;
    sendDueMail()
      .then((r) => {
        if (r.failed.length > 0) console.warn(`outbox: ${r.failed.length} message(s) could not be sent; will retry`);
      })
      .catch((e) => console.error("outbox: send loop failed:", (e as Error).message))
      .finally(() => {
        busy = false;
      });
  }, TICK_MS);
  globalForSender.trailbinOutboxSender.unref?.();
}
