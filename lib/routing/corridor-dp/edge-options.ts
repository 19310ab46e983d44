import type { SweepEdge } from "./instance";

/**
 * How a walk can use one edge (Ratliff–Rosenthal's aisle choices): not at all, end to end once or
 * twice, in and back from one end to the farthest stop, or in and back from both ends leaving
 * out the largest gap between stops. With each piece walked at most twice, every stop visited
 * and no piece cut off from both ends, these are the only patterns worth keeping.
 */
export const Use = { None: 0, Once: 1, Twice: 2, FromU: 3, FromV: 4, Gap: 5 } as const;
export type Use = (typeof Use)[keyof typeof Use];

export interface EdgeOption {
  use: Use;
  costMm: number;
  /** Degree the option adds at u and at v. */
  du: number;
  dv: number;
  /** Whether the option joins u and v. */
  joins: boolean;
}

function largestInnerGap(stops: readonly number[]): { at: number; mm: number } {
  let at = -1;
  let mm = -1;
  for (let i = 0; i + 1 < stops.length; i++) {
    const g = (stops[i + 1] as number) - (stops[i] as number);
    if (g > mm) {
      mm = g;
      at = i;
    }
  }
  return { at, mm };
}

export function edgeOptions(e: SweepEdge): EdgeOption[] {
  const L = e.lengthMm;
  const once: EdgeOption = { use: Use.Once, costMm: L, du: 1, dv: 1, joins: true };
  const twice: EdgeOption = { use: Use.Twice, costMm: 2 * L, du: 2, dv: 2, joins: true };
  const k = e.stops.length;
  if (k === 0) return [{ use: Use.None, costMm: 0, du: 0, dv: 0, joins: false }, once, twice];
  const out: EdgeOption[] = [
    once,
    twice,
    { use: Use.FromU, costMm: 2 * (e.stops[k - 1] as number), du: 2, dv: 0, joins: false },
    { use: Use.FromV, costMm: 2 * (L - (e.stops[0] as number)), du: 0, dv: 2, joins: false },
  ];
  if (k >= 2) out.push({ use: Use.Gap, costMm: 2 * L - 2 * largestInnerGap(e.stops).mm, du: 2, dv: 2, joins: false });
  return out;
}

/**
 * Times each piece of the edge is walked under `use`; piece i runs between consecutive points of
 * [u, ...stops, v].
 */
export function pieceCounts(e: SweepEdge, use: Use): number[] {
  const k = e.stops.length;
  const counts = new Array<number>(k + 1).fill(use === Use.None ? 0 : use === Use.Once ? 1 : 2);
  if (use === Use.FromU) counts[k] = 0;
  else if (use === Use.FromV) counts[0] = 0;
  else if (use === Use.Gap) counts[largestInnerGap(e.stops).at + 1] = 0;
  return counts;
}
