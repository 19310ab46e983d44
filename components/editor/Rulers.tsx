import type { EditorDocument } from "@/lib/floor-plan/document";

/** Width of the ruler bands along the top and left edge, in screen pixels. */
export const RULER_PX = 28;
const STEPS_M = [0.5, 1, 2, 5, 10, 20, 50, 100];

/** Metre rulers in the margin of the editor's SVG (which is drawn in cell units). */
export function Rulers({ doc, cellPx }: { doc: EditorDocument; cellPx: number }) {
  const m = RULER_PX / cellPx;
  const cellM = doc.cellMm / 1000;
  // Labels at least ~56 px apart, on round metre values.
  const stepM = STEPS_M.find((s) => (s / cellM) * cellPx >= 56) ?? 100;
  const stepCells = stepM / cellM;
  const font = 11 / cellPx;
  const ticks = (n: number) => Array.from({ length: Math.floor(n / stepCells) + 1 }, (_v, i) => i * stepCells);
  const label = (v: number) => `${Number((v * cellM).toFixed(1))}`;
  return (
    <g aria-hidden="true" pointerEvents="none" fontSize={font} fill="#16212b">
      <rect x={-m} y={-m} width={doc.width + m} height={m} fill="#f7f5f0" />
      <rect x={-m} y={-m} width={m} height={doc.height + m} fill="#f7f5f0" />
      {ticks(doc.width).map((x) => (
        <g key={`x${x}`}>
          <line x1={x} y1={-m * 0.35} x2={x} y2={0} stroke="#3b4a57" strokeWidth={1 / cellPx} />
          <text x={x + 2 / cellPx} y={-m * 0.45}>
            {label(x)}
          </text>
        </g>
      ))}
      {ticks(doc.height).map((y) => (
        <g key={`y${y}`}>
          <line x1={-m * 0.35} y1={y} x2={0} y2={y} stroke="#3b4a57" strokeWidth={1 / cellPx} />
          <text x={-m + 2 / cellPx} y={y + font + 1 / cellPx}>
            {label(y)}
          </text>
        </g>
      ))}
      <text x={-m + 2 / cellPx} y={-m * 0.45} fontWeight={700}>
        m
      </text>
    </g>
  );
}
