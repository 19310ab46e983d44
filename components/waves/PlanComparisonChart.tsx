import type { WavePlanDTO } from "@/lib/contracts/wave-plans";
import { metres, savingsPct } from "@/lib/format/units";

const BAR = 18;
const GAP = 4;
const LABEL_W = 150;
const WIDTH = 560;
const VALUE_W = 70;

/** Each plan's total walk between its two baselines: order by order above it, the usual walk of its batches below. */
export function PlanComparisonChart({ plans }: { plans: WavePlanDTO[] }) {
  const max = Math.max(
    1,
    ...plans.flatMap((p) => [p.summary.orderByOrderMm, p.summary.usualWalkMm, p.summary.distanceMm]),
  );
  const span = WIDTH - LABEL_W - VALUE_W;
  const group = 3 * (BAR + GAP) + 26;
  const height = plans.length * group + 8;
  const bars = (p: WavePlanDTO) => [
    { name: "Order by order", mm: p.summary.orderByOrderMm, fill: "#9a4d00", note: "baseline" },
    { name: "Usual walk", mm: p.summary.usualWalkMm, fill: "#dfe4ea", note: "baseline" },
    { name: "This plan", mm: p.summary.distanceMm, fill: "#0e6b58", note: "" },
  ];
  return (
    <figure className="card overflow-x-auto">
      <figcaption className="mb-2 font-semibold">
        Total walk of each plan against its two baselines:{" "}
        <span className="inline-block h-3 w-3 bg-signal align-middle" aria-hidden="true" /> order by order,{" "}
        <span className="inline-block h-3 w-3 bg-rack-light align-middle" aria-hidden="true" /> the usual walk,{" "}
        <span className="inline-block h-3 w-3 bg-trail align-middle" aria-hidden="true" /> the plan
      </figcaption>
      <svg
        width={WIDTH}
        height={height}
        viewBox={`0 0 ${WIDTH} ${height}`}
        role="img"
        aria-label={`Bar chart of ${plans.length} plans: total walk against order by order and against the usual walk`}
      >
        {plans.map((p, i) => {
          const top = i * group;
          return (
            <g key={p.id}>
              <text x={0} y={top + 14} className="fill-ink text-[13px] font-semibold">
                {`Plan ${i + 1}: ${p.label}`}
              </text>
              {bars(p).map((b, j) => {
                const y = top + 22 + j * (BAR + GAP);
                const w = Math.max(1, (b.mm / max) * span);
                const pct =
                  b.note === "baseline" && b.mm > 0 ? ` (plan ${savingsPct(p.summary.distanceMm, b.mm)} less)` : "";
                return (
                  <g key={b.name}>
                    <title>{`Plan ${i + 1}, ${b.name.toLowerCase()}${b.note ? " (baseline)" : ""}: ${metres(b.mm)}${pct}`}</title>
                    <text x={0} y={y + 13} className="fill-ink-soft text-[12px]">
                      {b.note ? `${b.name} (baseline)` : b.name}
                    </text>
                    <rect x={LABEL_W} y={y} width={w} height={BAR} fill={b.fill} />
                    <text x={LABEL_W + w + 6} y={y + 13} className="fill-ink text-[12px]">
                      {metres(b.mm)}
                    </text>
                  </g>
                );
              })}
            </g>
          );
        })}
      </svg>
    </figure>
  );
}
