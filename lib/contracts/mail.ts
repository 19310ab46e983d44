// The admin mail page's two lists: the outbox and the local SMTP sink. Types only.

export type OutboxStatus = "pending" | "sending" | "sent" | "failed";

export type OutboxRow = {
  id: number;
  dedupeKey: string;
  to: string;
  toName: string | null;
  subject: string;
  text: string;
  html: string | null;
  status: OutboxStatus;
  attempts: number;
  nextAttemptAt: string;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
};

export type SinkMessage = {
  id: number;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  messageId: string | null;
  from: string | null;
  to: string | null;
  subject: string | null;
  text: string | null;
};
