import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import { metres } from "@/lib/format/units";

/** Usual walk against planned walk per batch: the grey bar is what the site would walk, the green what it will. */
export function SavingsChart({ batches }: { batches: BatchSummaryDTO[] }) {
  const shown = batches.slice(0, 60);
  const max = Math.max(1, ...shown.map((b) => b.baselineMm));
  // Wide bars for a handful of batches, thin ones for many, so the chart keeps a readable width.
  const w = Math.max(10, Math.min(44, Math.floor(640 / Math.max(1, shown.length))));
  const h = 140;
  return (
    <figure className="card overflow-x-auto">
      <figcaption className="mb-2 font-semibold">
        Walk per batch: <span className="inline-block h-3 w-3 bg-rack-light align-middle" aria-hidden="true" /> usual
        order, <span className="inline-block h-3 w-3 bg-trail align-middle" aria-hidden="true" /> planned route
        {batches.length > shown.length ? ` (first ${shown.length} of ${batches.length})` : ""}
      </figcaption>
      <svg
        width={shown.length * w + 40}
        height={h + 24}
        role="img"
        aria-label={`Bar chart of ${shown.length} batches: usual walk against planned walk`}
      >
        <text x={0} y={10} className="fill-ink-soft text-[10px]">
          {metres(max)}
        </text>
        {shown.map((b, i) => {
          const x = 36 + i * w;
          const base = (b.baselineMm / max) * h;
          const plan = (b.distanceMm / max) * h;
          return (
            <g key={b.id}>
              <title>{`Batch ${b.number}: planned ${metres(b.distanceMm)}, usual ${metres(b.baselineMm)}`}</title>
              <rect x={x} y={h - base + 12} width={w - 3} height={base} fill="#dfe4ea" />
              <rect
                x={x + Math.floor(w / 5)}
                y={h - plan + 12}
                width={Math.max(2, w - 3 - 2 * Math.floor(w / 5))}
                height={plan}
                fill="#0e6b58"
              />
            </g>
          );
        })}
        <line x1={34} x2={36 + shown.length * w} y1={h + 12} y2={h + 12} stroke="#3b4a57" />
      </svg>
    </figure>
  );
}
