"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import type { FloorBatchDTO, FloorPickerDTO } from "@/lib/contracts/shift";

type Props = {
  /** The batch as it was when the supervisor chose it: its version goes with the change. */
  batch: FloorBatchDTO;
  /** The same batch in the latest update, to say when it changed meanwhile. */
  current: FloorBatchDTO | null;
  pickers: FloorPickerDTO[];
  cap: number;
  onClose: () => void;
  onChanged: () => Promise<void>;
};

/** Assign a waiting batch, move a held one (started or not) to another picker, or take it back into the pool. */
export function AssignPanel({ batch, current, pickers, cap, onClose, onChanged }: Props) {
  const choices = pickers.filter((p) => p.id !== batch.pickerId);
  const [pickerId, setPickerId] = useState(choices[0]?.id ?? "");
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [done, setDone] = useState<string | null>(null);
  // After a change, the latest update says where the batch is now; before it, what was chosen.
  const now = done && current ? current : batch;
  const started = batch.doneLines > 0 || batch.status === "picking";
  const changed = current !== null && current.version !== batch.version && !done;

  async function send(to: string | null) {
    setBusy(true);
    setFailure(null);
    const r = await postJson<{ message: string }>(`/api/floor/batches/${batch.id}/assign`, {
      pickerId: to,
      version: batch.version,
    });
    setBusy(false);
    if (r.ok) setDone(r.data.message);
    else setFailure(r);
    await onChanged();
  }

  return (
    <section aria-labelledby="assign-title" className="card space-y-3 border-2 border-trail">
      <h2 id="assign-title">
        Batch #{batch.number} of {batch.waveName}
      </h2>
      <p>
        {now.pickerName ? `Held by ${now.pickerName}` : "Waiting for a picker"}: {now.doneLines} of {now.lineCount}{" "}
        lines done.
      </p>
      {changed && (
        <p className="notice-info">
          This batch changed since you chose it (
          {current!.pickerName ? `now held by ${current!.pickerName}` : "nobody holds it now"}, {current!.doneLines} of{" "}
          {current!.lineCount} lines done). A change sent now is refused; close this and choose the batch again.
        </p>
      )}
      {started && batch.pickerName && !done && (
        <p className="notice-info font-semibold">
          ⚠ {batch.pickerName} has started this batch. The lines they confirmed stay confirmed; their handheld tells
          them at once that the batch is no longer theirs. Tell them where to leave the cart, and the next picker where
          to find it: the trip goes on from the first open line.
        </p>
      )}
      <FailureNotice failure={failure} />
      {done && (
        <p className="notice-info" role="status">
          {done}
        </p>
      )}
      {!done && (
        <div className="flex flex-wrap items-end gap-3">
          <div className="min-w-64">
            <label className="label" htmlFor="assign-picker">
              {batch.pickerId ? "Move to" : "Assign to"}
            </label>
            <select id="assign-picker" className="field" value={pickerId} onChange={(e) => setPickerId(e.target.value)}>
              {choices.length === 0 && <option value="">No other active picker at this site</option>}
              {choices.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name} — holds {p.openBatches} of {cap}
                  {p.openBatches >= cap ? " (full)" : ""}
                  {p.onShift ? "" : " · not signed in"}
                </option>
              ))}
            </select>
          </div>
          <button
            type="button"
            className="btn-primary"
            disabled={busy || !pickerId}
            onClick={() => void send(pickerId)}
          >
            {batch.pickerId ? "Move the batch" : "Assign the batch"}
          </button>
          {batch.pickerId && (
            <button type="button" className="btn-danger" disabled={busy} onClick={() => void send(null)}>
              Take it back into the pool
            </button>
          )}
        </div>
      )}
      <button type="button" className="btn-quiet" onClick={onClose}>
        Close
      </button>
    </section>
  );
}
