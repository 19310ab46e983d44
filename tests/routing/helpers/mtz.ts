import type { CostMatrix } from "../../../lib/routing";

/**
 * The walk start → every stop once → end as an integer program in CPLEX LP format, with
 * Miller–Tucker–Zemlin order variables u_i (Miller, Tucker & Zemlin 1960) removing subtours.
 * start === end gives the closed tour.
 */
export function mtzLp(cm: CostMatrix, start: number, end: number, stops: readonly number[]): string {
  const m = stops.length;
  const tails = [start, ...stops];
  const heads = start === end ? [start, ...stops] : [...stops, end];
  const arcs: [number, number][] = [];
  for (const i of tails) for (const j of heads) if (i !== j && !(m > 0 && i === start && j === end)) arcs.push([i, j]);
  const x = (i: number, j: number) => `x_${i}_${j}`;
  const lines: string[] = ["Minimize", " obj:"];
  for (const [i, j] of arcs) lines.push(` + ${cm.cost[i * cm.n + j]} ${x(i, j)}`);
  lines.push("Subject To");
  for (const i of tails)
    lines.push(
      ` out_${i}: ${arcs
        .filter(([a]) => a === i)
        .map(([a, b]) => x(a, b))
        .join(" + ")} = 1`,
    );
  for (const j of heads)
    lines.push(
      ` in_${j}: ${arcs
        .filter(([, b]) => b === j)
        .map(([a, b]) => x(a, b))
        .join(" + ")} = 1`,
    );
  for (const i of stops) {
    for (const j of stops) {
      if (i !== j) lines.push(` mtz_${i}_${j}: u_${i} - u_${j} + ${m} ${x(i, j)} <= ${m - 1}`);
    }
  }
  lines.push("Bounds");
  for (const i of stops) lines.push(` 1 <= u_${i} <= ${m}`);
  lines.push("Binaries");
  for (const [i, j] of arcs) lines.push(` ${x(i, j)}`);
  lines.push("End");
  return lines.join("\n");
}
