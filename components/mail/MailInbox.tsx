"use client";

import useSWR from "swr";
import { useState } from "react";
import { swrFetcher } from "@/lib/client/fetch-json";
import { linkParts } from "@/lib/mail/link-text";
import type { SinkMessage } from "@/lib/contracts/mail";
import type { OutboxRow } from "@/lib/contracts/mail";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime } from "@/lib/format/dates";

type OutboxState = Omit<OutboxRow, "text" | "html">;

function MessageText({ text }: { text: string }) {
  // Plain text only, never the message's HTML; http(s) links become links.
  return (
    <pre className="whitespace-pre-wrap break-words font-sans">
      {linkParts(text).map((p, i) =>
        p.kind === "text" ? (
          <span key={i}>{p.text}</span>
        ) : (
          <a key={i} href={p.href} className="underline" rel="noreferrer">
            {p.href}
          </a>
        ),
      )}
    </pre>
  );
}

export function MailInbox() {
  const style = useDateStyle();
  const when = (iso: string) => formatDateTime(iso, style);
  const { data, error, isLoading } = useSWR<{ messages: SinkMessage[]; outbox: OutboxState[] }>(
    "/api/mail",
    swrFetcher,
    { refreshInterval: 3000 },
  );
  const [openId, setOpenId] = useState<number | null>(null);

  if (error)
    return (
      <p role="alert" className="notice-error">
        {(error as Error).message}
      </p>
    );
  if (isLoading || !data) return <p>Loading mail…</p>;

  const open = data.messages.find((m) => m.id === openId) ?? null;
  const waiting = data.outbox.filter((o) => o.status !== "sent");

  return (
    <div className="space-y-6">
      {waiting.length > 0 && (
        <section className="card" aria-labelledby="outbox-title">
          <h2 id="outbox-title" className="mb-2">
            Not sent yet
          </h2>
          <ul className="space-y-1 text-sm">
            {waiting.map((o) => (
              <li key={o.id}>
                <strong>{o.status === "failed" ? "Gave up" : "Waiting"}</strong>: “{o.subject}” to {o.to}, {o.attempts}{" "}
                attempt(s)
                {o.status === "pending" && o.attempts > 0 ? `, next try ${when(o.nextAttemptAt)}` : ""}
                {o.lastError ? ` (last error: ${o.lastError})` : ""}
              </li>
            ))}
          </ul>
        </section>
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <section aria-labelledby="received-title">
          <h2 id="received-title" className="mb-2">
            Received ({data.messages.length})
          </h2>
          {data.messages.length === 0 ? (
            <p className="text-ink-soft">
              No mail yet. Invite a user or ask for a password reset, and it shows here within seconds.
            </p>
          ) : (
            <ul className="divide-y divide-paper-sunk rounded-md border border-paper-sunk">
              {data.messages.map((m) => (
                <li key={m.id}>
                  <button
                    type="button"
                    onClick={() => setOpenId(m.id)}
                    aria-current={m.id === openId ? "true" : undefined}
                    className={`block min-h-tap w-full px-3 py-2 text-left hover:bg-paper-sunk ${m.id === openId ? "bg-paper-sunk" : ""}`}
                  >
                    <span className="block text-sm text-ink-soft">{when(m.receivedAt)}</span>
                    <span className="block font-semibold">{m.subject || "(no subject)"}</span>
                    <span className="block text-sm">to {m.to || m.envelopeTo.join(", ")}</span>
                  </button>
                </li>
              ))}
            </ul>
          )}
        </section>

        <section aria-label="Message" className="card min-h-40">
          {open ? (
            <article className="space-y-3">
              <h2>{open.subject || "(no subject)"}</h2>
              <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
                <dt className="font-semibold">From</dt>
                <dd>{open.from}</dd>
                <dt className="font-semibold">To</dt>
                <dd>{open.to}</dd>
                <dt className="font-semibold">Received</dt>
                <dd>{when(open.receivedAt)}</dd>
              </dl>
              <MessageText text={open.text ?? ""} />
            </article>
          ) : (
            <p className="text-ink-soft">Choose a message to read it.</p>
          )}
        </section>
      </div>
    </div>
  );
}
