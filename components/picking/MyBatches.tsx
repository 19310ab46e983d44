"use client";

import { useState } from "react";
import Link from "next/link";
import useSWR from "swr";
import { postJson, swrFetcher } from "@/lib/client/fetch-json";
import { ProgressBar } from "@/components/ProgressBar";
import type { MyBatchDTO } from "@/lib/contracts/picking";
import { useDateStyle } from "@/components/SiteFormat";
import { formatWhen } from "@/lib/format/dates";

type Answer = { batches: MyBatchDTO[]; next: MyBatchDTO | null };

/** The picker's batches with their progress, and the button that takes the next one off the wave. */
export function MyBatches({ initial }: { initial: Answer }) {
  const { data, mutate } = useSWR<Answer>("/api/my-batches", swrFetcher, {
    fallbackData: initial,
    // Often enough that a batch a supervisor assigns shows up while the picker looks.
    refreshInterval: 10_000,
  });
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: "error" | "info"; text: string } | null>(null);
  const { batches, next } = data ?? initial;
  const dateStyle = useDateStyle();

  async function takeNext() {
    if (!next) return;
    setBusy(true);
    setMessage(null);
    const r = await postJson<{ batch: { number: number; waveName: string } }>(`/api/batches/${next.id}/take`, {
      version: next.version,
    });
    setBusy(false);
    if (r.ok) setMessage({ kind: "info", text: `Batch ${r.data.batch.number} of ${r.data.batch.waveName} is yours.` });
    else setMessage({ kind: "error", text: r.message });
    await mutate();
  }

  async function giveBack(b: MyBatchDTO) {
    setBusy(true);
    setMessage(null);
    const r = await postJson<unknown>(`/api/batches/${b.id}/give-back`, { version: b.version });
    setBusy(false);
    if (r.ok)
      setMessage({
        kind: "info",
        text: `Batch ${b.number} is back in the pool for the next picker.${b.lineCount > b.openLines ? " Leave the cart at the depot with its totes as they are: the lines you picked stay picked." : ""}`,
      });
    else setMessage({ kind: "error", text: r.message });
    await mutate();
  }

  return (
    <div className="space-y-4">
      {message && (
        <p
          role={message.kind === "error" ? "alert" : "status"}
          className={message.kind === "error" ? "notice-error" : "notice-info"}
        >
          {message.text}
        </p>
      )}
      {batches.length === 0 ? (
        <div className="rounded-lg border-2 border-dashed border-rack bg-paper-raised px-6 py-8 text-center">
          <p className="text-lg font-semibold">No batches for you right now</p>
          <p className="mt-2 text-ink-soft">Take the next batch below, or ask your planner if you expected one.</p>
        </div>
      ) : (
        <ul className="space-y-3" aria-label="My batches">
          {batches.map((b) => {
            const done = b.lineCount - b.openLines;
            return (
              <li key={b.id} className="card p-4" data-testid="my-batch">
                <p className="flex items-baseline justify-between gap-3">
                  <span className="text-xl font-bold">Batch {b.number}</span>
                  <span className="text-sm text-ink-soft">{b.status === "picking" ? "being picked" : "ready"}</span>
                </p>
                <p className="text-sm text-ink-soft">{b.waveName}</p>
                {b.assignedBy && (
                  <p className="text-sm font-semibold" data-testid="assigned-by">
                    Assigned to you by {b.assignedBy.name} at {formatWhen(b.assignedBy.at, dateStyle)}
                  </p>
                )}
                <p className="mt-1">
                  {b.stopCount} stops, {b.lineCount} lines: {done} of {b.lineCount} done
                  {b.shortLines ? `, ${b.shortLines} short` : ""}
                </p>
                <ProgressBar className="mt-2" label={`Batch ${b.number} progress`} value={done} max={b.lineCount} />
                <Link className="btn-primary mt-3 w-full" href={`/pick/${b.id}`}>
                  {b.status === "picking" ? "Continue picking" : "Start picking"} batch {b.number}
                </Link>
                <button
                  type="button"
                  className="btn-quiet mt-2 w-full"
                  onClick={() => void giveBack(b)}
                  disabled={busy}
                >
                  Give back batch {b.number}
                </button>
              </li>
            );
          })}
        </ul>
      )}
      <div className="card p-4">
        {next ? (
          <>
            <p>
              Next waiting: batch {next.number} of {next.waveName}, {next.stopCount} stops, {next.lineCount} lines.
            </p>
            <button type="button" className="btn-quiet mt-3 w-full" onClick={takeNext} disabled={busy}>
              {busy ? "Taking…" : "Take the next batch"}
            </button>
          </>
        ) : (
          <p className="text-ink-soft">No released batches are waiting to be taken.</p>
        )}
      </div>
    </div>
  );
}
