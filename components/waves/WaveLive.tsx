"use client";

import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import type { ShortPickDTO, WaveDTO } from "@/lib/contracts/waves";
import type { SiteTiming } from "@/lib/batching/estimate";
import { WaveResults } from "./WaveResults";

type WaveAnswer = { wave: WaveDTO; batches: BatchSummaryDTO[]; shortPicks: ShortPickDTO[] };

/** The batches table and short picks, refreshed every few seconds while pickers work a released wave. */
export function WaveLive({ initial, timing }: { initial: WaveAnswer; timing: SiteTiming }) {
  const { data } = useSWR<WaveAnswer>(`/api/waves/${initial.wave.id}`, swrFetcher, {
    fallbackData: initial,
    refreshInterval: initial.wave.status === "released" ? 5000 : 0,
  });
  const { batches, shortPicks } = data ?? initial;
  // A recalled batch stays listed as history but is no work for anyone.
  const live = batches.filter((b) => b.status !== "recalled");
  const picked = live.reduce((a, b) => a + b.pickedLines + b.shortLines, 0);
  const lines = live.reduce((a, b) => a + b.lineCount, 0);
  return (
    <>
      {initial.wave.status === "released" && (
        <p className="mb-3" role="status" aria-live="polite">
          Picked so far:{" "}
          <span className="font-semibold">
            {picked} of {lines} lines
          </span>{" "}
          ({live.filter((b) => b.status === "done").length} of {live.length} batches done). Updates by itself.
        </p>
      )}
      <WaveResults waveId={initial.wave.id} batches={batches} timing={timing} />
      {shortPicks.length > 0 && (
        <section className="mt-6" aria-labelledby="shorts-title">
          <h2 id="shorts-title" className="mb-2">
            ⚠ Short picks to follow up ({shortPicks.length})
          </h2>
          <div className="overflow-x-auto rounded-lg border border-rack-light bg-paper-raised">
            <table className="w-full text-left">
              <thead className="bg-paper-sunk">
                <tr>
                  {["Batch", "Order", "Bin", "SKU", "Ordered", "Found", "Reason"].map((h) => (
                    <th key={h} scope="col" className="px-3 py-2">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {shortPicks.map((s, i) => (
                  <tr key={`${s.batchNumber}-${s.orderNumber}-${s.sku}-${i}`} className="border-t border-rack-light">
                    <td className="px-3 py-2">#{s.batchNumber}</td>
                    <td className="px-3 py-2">{s.orderNumber}</td>
                    <td className="px-3 py-2 font-mono">{s.binCode}</td>
                    <td className="px-3 py-2 font-mono">{s.sku}</td>
                    <td className="px-3 py-2">{s.ordered}</td>
                    <td className="px-3 py-2 font-semibold">{s.picked}</td>
                    <td className="px-3 py-2">{s.reason ?? "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      )}
    </>
  );
}
