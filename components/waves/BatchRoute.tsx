"use client";

import { FloorPlanView } from "@/components/floor/FloorPlanView";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { BatchDetailDTO } from "@/lib/contracts/batches";
import { metres } from "@/lib/format/units";

type Props = {
  document: EditorDocument;
  cells: number[];
  stops: BatchDetailDTO["stops"];
  legsMm: number[];
  from: string;
  to: string;
};

/** The route drawn on the floor plan beside the numbered stop list a picker follows. */
export function BatchRoute({ document, cells, stops, legsMm, from, to }: Props) {
  const route = { cells, stops: stops.map((s) => ({ x: s.x, y: s.y, label: String(s.seq) })) };
  const heavy = stops.some((s) => s.lines.some((l) => l.unitWeightG * l.quantity >= 15_000));
  return (
    <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
      <div className="card p-2">
        <FloorPlanView document={document} route={route} label="Route of this batch" />
        <p className="mt-2 px-2 text-sm text-ink-soft">
          Numbered circles are the stops in walking order; arrows show the way along the corridors, from {from} to {to}.
        </p>
      </div>
      <ol className="space-y-3" aria-label="Stops in walking order">
        {stops.map((s, i) => (
          <li key={s.seq} className="card p-4">
            <p className="flex items-baseline justify-between gap-3">
              <span className="text-xl font-bold">Stop {s.seq}</span>
              <span className="text-sm text-ink-soft">
                {metres(legsMm[i] ?? 0)} from the {i === 0 ? "depot" : "previous stop"}
              </span>
            </p>
            <ul className="mt-2 space-y-1">
              {s.lines.map((l) => (
                <li key={`${l.orderNumber}-${l.sku}-${l.tote}`} className="grid grid-cols-[auto_1fr] gap-x-3">
                  <span className="font-mono font-semibold">{l.binCode}</span>
                  <span>
                    {l.quantity} {l.uom} <span className="font-semibold">{l.sku}</span> {l.description} → tote {l.tote}{" "}
                    <span className="text-ink-soft">({l.orderNumber})</span>
                  </span>
                </li>
              ))}
            </ul>
          </li>
        ))}
        <li className="card p-4 text-ink-soft">
          Then {metres(legsMm[stops.length] ?? 0)} to {to}.
        </li>
        {heavy && (
          <li className="notice-info text-sm">
            Heavy lines in this batch: lift at waist height or with two people, as your site rules say.
          </li>
        )}
      </ol>
    </div>
  );
}
