"use client";

import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";

/** How far the picker is with this batch, refreshed while the wave is out on the floor. */
export function BatchLiveStatus({ waveId, number, live }: { waveId: number; number: number; live: boolean }) {
  const { data } = useSWR<{ batches: BatchSummaryDTO[] }>(`/api/waves/${waveId}`, swrFetcher, {
    refreshInterval: live ? 5000 : 0,
  });
  const b = data?.batches.find((x) => x.number === number);
  if (!b) return null;
  const done = b.pickedLines + b.shortLines;
  return (
    <p className="notice-info mb-4" role="status" aria-live="polite">
      {b.status === "done"
        ? "✓ Picked and on its way to the drop-off."
        : done > 0
          ? `Being picked: ${done} of ${b.lineCount} lines confirmed.`
          : b.status === "released"
            ? "Released, not started yet."
            : "Planned, not released yet."}
      {b.shortLines > 0 && ` ⚠ ${b.shortLines} short pick${b.shortLines === 1 ? "" : "s"}.`}
    </p>
  );
}
