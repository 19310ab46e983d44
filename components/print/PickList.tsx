import { FloorPlanView } from "@/components/floor/FloorPlanView";
import type { PickListData } from "@/lib/contracts/print";
import { kilograms, metres, minutes } from "@/lib/format/units";
import { routeCertificateLine } from "@/lib/format/route-certificate";

export type PickListProps = PickListData;

const HEAVY_LINE_G = 15_000;

/** One batch on paper: barcode, totes, stops in walking order with tick boxes, map, cautions. */
export function PickList({
  label,
  barcodeSvg,
  waveName,
  batch,
  printedBefore,
  seconds,
  estimateNote,
  document,
  routeCells,
  dropoff,
  highLevels,
}: PickListProps) {
  const lines = batch.stops.flatMap((s) => s.lines.map((l) => ({ ...l, seq: s.seq })));
  const totes = [...new Map(lines.map((l) => [l.tote, l.orderNumber])).entries()].sort((a, b) => a[0] - b[0]);
  const heavy = lines.some((l) => l.unitWeightG * l.quantity >= HEAVY_LINE_G);
  const high = lines.some((l) => highLevels.has(l.binCode));
  return (
    <article
      className="pick-list mb-10 break-after-page bg-paper-raised p-6 text-ink print:mb-0 print:p-0"
      aria-label={`Pick list ${label}`}
    >
      <header className="flex flex-wrap items-start justify-between gap-4 border-b-2 border-ink pb-3">
        <div>
          <p className="text-sm">{waveName}</p>
          <h2 className="text-3xl font-bold">Batch {batch.number}</h2>
          {printedBefore > 0 && (
            <p className="mt-1 inline-block border-2 border-ink px-2 font-bold uppercase">
              Reprint ({printedBefore + 1}. print)
            </p>
          )}
          <p className="mt-2 text-sm">
            {batch.stops.length} stops · {batch.lineCount} lines · {batch.toteCount} totes · {kilograms(batch.weightG)}{" "}
            · walk {metres(batch.distanceMm)} · about {minutes(seconds)}
            {estimateNote && <span className="block text-xs">Estimated {estimateNote}.</span>}
          </p>
          <p className="mt-1 text-sm" data-testid="route-certificate">
            <span className="font-semibold">Route:</span> {routeCertificateLine(batch)}.
          </p>
        </div>
        <div className="w-64 max-w-full" data-testid="batch-barcode" dangerouslySetInnerHTML={{ __html: barcodeSvg }} />
      </header>
      <section className="mt-3">
        <h3 className="font-semibold">Cart</h3>
        <table className="mt-1 text-sm">
          <tbody>
            {totes.map(([tote, order]) => (
              <tr key={tote}>
                <td className="pr-3 font-semibold">Tote {tote}</td>
                <td>{order}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <table className="mt-4 w-full border-collapse text-left text-sm">
        <thead>
          <tr className="border-b-2 border-ink">
            {["Stop", "Location", "SKU", "Description", "Qty", "Unit", "Tote", "✓"].map((h) => (
              <th key={h} scope="col" className="py-1 pr-2">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {lines.map((l, i) => (
            <tr
              key={`${l.seq}-${l.orderNumber}-${l.sku}-${i}`}
              className="border-b border-rack break-inside-avoid"
              data-testid="pick-line"
            >
              <td className="py-1 pr-2 font-bold">{l.seq}</td>
              <td className="py-1 pr-2 font-mono font-bold">
                {l.binCode}
                {highLevels.has(l.binCode) ? " ▲" : ""}
              </td>
              <td className="py-1 pr-2 font-mono">{l.sku}</td>
              <td className="py-1 pr-2">
                {l.description}
                {l.unitWeightG * l.quantity >= HEAVY_LINE_G ? " (heavy)" : ""}
              </td>
              <td className="py-1 pr-2 text-right font-bold">{l.quantity}</td>
              <td className="py-1 pr-2">{l.uom}</td>
              <td className="py-1 pr-2 text-center font-bold">{l.tote}</td>
              <td className="py-1">
                <span className="inline-block h-5 w-5 border-2 border-ink" aria-label="tick when picked" />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-sm font-semibold">Then take the cart to {dropoff}.</p>
      <div className="mt-3 grid grid-cols-[2fr_3fr] gap-4 break-inside-avoid">
        <FloorPlanView
          document={document}
          route={{ cells: routeCells, stops: batch.stops.map((s) => ({ x: s.x, y: s.y, label: String(s.seq) })) }}
          label={`Route of batch ${batch.number}`}
        />
        <ul className="list-disc space-y-1 pl-5 text-sm">
          {high && <li>▲ High level: use a step or ladder as your site rules say; never climb the racking.</li>}
          {heavy && <li>Heavy lines: lift at waist height or with two people.</li>}
          <li>One-way and forklift aisles: follow the site&apos;s traffic rules; they come before this route.</li>
        </ul>
      </div>
    </article>
  );
}
