"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import type { RecallableBatchDTO } from "@/lib/contracts/wave-control";

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** Released batches nobody has started, each of which the planner may call back from the floor. */
export function RecallBatches({ waveId, batches }: { waveId: number; batches: RecallableBatchDTO[] }) {
  const [asking, setAsking] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  if (batches.length === 0) return null;

  async function recall(b: RecallableBatchDTO) {
    setBusy(true);
    setFailure(null);
    const r = await postJson(`/api/waves/${waveId}/batches/${b.number}/recall`, { version: b.version });
    if (r.ok) return window.location.reload();
    setBusy(false);
    setAsking(null);
    setFailure(r);
  }

  return (
    <section className="card mt-4 space-y-3" aria-labelledby="recall-title">
      <h2 id="recall-title">Not started yet</h2>
      <p className="text-sm text-ink-soft">
        A released batch nobody has confirmed a line of can be recalled: its orders leave the wave and go back to open,
        and whoever holds it loses it from their handheld. A started batch is reassigned on the floor instead.
      </p>
      <ul className="space-y-2">
        {batches.map((b) => (
          <li key={b.number} className="flex flex-wrap items-center gap-3 border-t border-rack-light pt-2">
            <span className="font-semibold">Batch #{b.number}</span>
            <span>
              {plural(b.orderCount, "order", "orders")}, {plural(b.lineCount, "line", "lines")};{" "}
              {b.heldBy ? `held by ${b.heldBy}` : "waiting to be taken"}
            </span>
            <button
              type="button"
              className="btn-danger"
              disabled={busy}
              onClick={() => setAsking(b.number)}
              aria-label={`Recall batch ${b.number}`}
            >
              Recall
            </button>
            {asking === b.number && (
              <div className="notice-info w-full space-y-3" role="alertdialog" aria-labelledby={`recall-q-${b.number}`}>
                <p id={`recall-q-${b.number}`}>
                  Recall batch {b.number}? Its {plural(b.orderCount, "order goes", "orders go")} back to open orders
                  {b.heldBy ? `, and ${b.heldBy} loses it from their handheld` : ""}. The batch stays in this wave as
                  recalled. If its pick list was printed, collect the paper.
                </p>
                <div className="flex flex-wrap gap-2">
                  <button type="button" className="btn-primary" onClick={() => recall(b)} disabled={busy}>
                    Yes, recall it
                  </button>
                  <button type="button" className="btn-quiet" onClick={() => setAsking(null)}>
                    Keep it
                  </button>
                </div>
              </div>
            )}
          </li>
        ))}
      </ul>
      <FailureNotice failure={failure} />
    </section>
  );
}
