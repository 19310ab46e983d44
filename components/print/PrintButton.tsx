"use client";

import { useState } from "react";
import { postJson } from "@/lib/client/fetch-json";

/** Records the print (so the next one says "reprint"), then opens the browser's print dialog. */
export function PrintButton({ waveId, numbers, canRecord }: { waveId: number; numbers: number[]; canRecord: boolean }) {
  const [error, setError] = useState<string | null>(null);
  async function print() {
    if (canRecord) {
      const r = await postJson(`/api/waves/${waveId}/printed`, { numbers });
      if (!r.ok) return setError(r.message);
    }
    window.print();
  }
  return (
    <div className="mb-6 flex flex-wrap items-center gap-3 print:hidden">
      <button type="button" className="btn-primary" onClick={print}>
        Print {numbers.length === 1 ? "this pick list" : `${numbers.length} pick lists`}
      </button>
      <span className="text-sm text-ink-soft">Fits A4 and Letter; each batch starts on a new page.</span>
      {error && (
        <p role="alert" className="notice-error">
          {error}
        </p>
      )}
    </div>
  );
}
