import "server-only";
import { db } from "./knex";
import type { SinkMessage } from "@/lib/contracts/mail";

// The local SMTP sink's store: scripts/mail-sink.ts writes, the admin mail page and the tests read.

export type SinkMessageInput = {
  envelopeFrom: string | null;
  envelopeTo: string[];
  messageId: string | null;
  fromHeader: string | null;
  toHeader: string | null;
  subject: string | null;
  text: string | null;
  raw: string;
};

type Row = {
  id: number;
  received_at: Date;
  envelope_from: string | null;
  envelope_to: string;
  message_id: string | null;
  from_header: string | null;
  to_header: string | null;
  subject: string | null;
  text_body: string | null;
  raw: string;
};

const toDTO = (r: Row): SinkMessage => ({
  id: r.id,
  receivedAt: r.received_at.toISOString(),
  envelopeFrom: r.envelope_from,
  envelopeTo: r.envelope_to ? r.envelope_to.split(",") : [],
  messageId: r.message_id,
  from: r.from_header,
  to: r.to_header,
  subject: r.subject,
  text: r.text_body,
});

const cap = (s: string | null, n: number) => (s === null ? null : s.slice(0, n));

export async function storeSinkMessage(m: SinkMessageInput): Promise<number> {
  const [id] = await db()("mail_sink_messages").insert({
    envelope_from: cap(m.envelopeFrom, 254),
    envelope_to: m.envelopeTo.join(",").slice(0, 1000),
    message_id: cap(m.messageId, 254),
    from_header: cap(m.fromHeader, 500),
    to_header: cap(m.toHeader, 1000),
    subject: cap(m.subject, 500),
    text_body: m.text,
    raw: m.raw,
  });
  return Number(id);
}

/** Newest first. */
export async function listSinkMessages(limit: number): Promise<SinkMessage[]> {
  const rows = (await db()("mail_sink_messages").orderBy("id", "desc").limit(limit)) as Row[];
  return rows.map(toDTO);
}

/** Messages whose envelope went to `address`, newest first (what a test polls for). */
export async function sinkMessagesTo(address: string): Promise<SinkMessage[]> {
  const rows = (await db()("mail_sink_messages")
    .where("envelope_to", "like", `%${address.replace(/[%_\\]/g, "\\$&")}%`)
    .orderBy("id", "desc")) as Row[];
  return rows.filter((r) => r.envelope_to.split(",").includes(address)).map(toDTO);
}

export async function sinkMessagesWithId(messageId: string): Promise<(SinkMessage & { raw: string })[]> {
  const rows = (await db()("mail_sink_messages").where({ message_id: messageId }).orderBy("id")) as Row[];
  return rows.map((r) => ({ ...toDTO(r), raw: r.raw }));
}
