"use client";

import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import type { WavePreviewDTO } from "@/lib/contracts/waves";

const n = (x: number) => x.toLocaleString("en-GB");

/** How many orders the wave will take with the filter as it stands, and which lines the layout version cannot reach. */
export function WavePreview({
  query,
  layoutLabel,
  noCutoff,
  includeNoCutoff = false,
  onIncludeNoCutoff,
}: {
  query: string | null;
  layoutLabel: string;
  noCutoff: boolean;
  /** With a cut-off set: whether the orders that have none are taken too, and the choice to change it. */
  includeNoCutoff?: boolean;
  onIncludeNoCutoff?: (include: boolean) => void;
}) {
  const { data, error, isLoading } = useSWR<WavePreviewDTO>(query ? `/api/waves/preview?${query}` : null, swrFetcher, {
    keepPreviousData: true,
  });
  if (!query)
    return (
      <p className="notice-error" role="status">
        Tick at least one priority: a wave takes orders of the priorities ticked.
      </p>
    );
  if (error)
    return (
      <p className="notice-error" role="status">
        Could not count the orders: {(error as Error).message}
      </p>
    );
  if (!data)
    return (
      <p role="status" className="text-ink-soft">
        {isLoading ? "Counting the open orders…" : ""}
      </p>
    );
  const off = data.offLayout;
  return (
    <div className="space-y-2" role="status" aria-live="polite" data-testid="wave-preview">
      <p className={data.orders === 0 ? "notice-error" : "notice-info"}>
        {data.orders === 0
          ? "No open order matches: every matching order is already in a wave, or none was imported. Widen the cut-off or priorities."
          : `This wave will take ${n(data.orders)} open ${data.orders === 1 ? "order" : "orders"} (${n(data.lines)} order lines) that no other wave holds.`}
        {data.orders > 0 &&
          noCutoff &&
          ` No cut-off is set, so that is every open order of the ticked priorities${data.ordersWithoutCutoff > 0 ? `, ${n(data.ordersWithoutCutoff)} of them without any cut-off` : ""}.`}
      </p>
      {!noCutoff && data.ordersWithoutCutoff > 0 && (
        <div className="notice-info" data-testid="no-cutoff-orders">
          <p>
            {n(data.ordersWithoutCutoff)} open {data.ordersWithoutCutoff === 1 ? "order has" : "orders have"} no
            cut-off.{" "}
            {includeNoCutoff
              ? "They are included in this wave's count above."
              : "A cut-off filter leaves them out: they are not in the count above."}
          </p>
          {onIncludeNoCutoff && (
            <label className="mt-2 flex min-h-tap items-center gap-2">
              <input
                type="checkbox"
                className="h-5 w-5"
                checked={includeNoCutoff}
                onChange={(e) => onIncludeNoCutoff(e.target.checked)}
              />
              Include the {n(data.ordersWithoutCutoff)} {data.ordersWithoutCutoff === 1 ? "order" : "orders"} without a
              cut-off
            </label>
          )}
        </div>
      )}
      {off.lines > 0 && (
        <div className="notice-error">
          <p className="font-semibold">
            ⚠ {n(off.lines)} {off.lines === 1 ? "line" : "lines"} of {n(off.orders)}{" "}
            {off.orders === 1 ? "order picks" : "orders pick"} from bins that are not on {layoutLabel}.
          </p>
          <p>
            {off.orders === 1 ? "That order" : "Those orders"} cannot be batched on this layout version. If you release
            the wave as planned, {off.orders === 1 ? "it goes" : "they go"} back to open orders. Correct the item
            master&apos;s bins or choose a layout version that has them. For example:
          </p>
          <ul className="list-disc pl-5">
            {off.examples.map((e, i) => (
              <li key={`${e.orderNumber}-${e.sku}-${i}`}>
                Order <span className="font-semibold">{e.orderNumber}</span>: {e.sku}{" "}
                {e.binCodes.length ? `is in ${e.binCodes.join(" or ")}` : "has no pick bin in the item master"}
              </li>
            ))}
            {off.lines > off.examples.length && <li>and {n(off.lines - off.examples.length)} more</li>}
          </ul>
        </div>
      )}
    </div>
  );
}
