/**
 * What every route carries: its length, a lower bound on the shortest possible walk, and the method
 * that produced the order. A route is proved shortest when the bound reaches its length; otherwise
 * the bound states how far from the shortest it can at most be. No route leaves without one.
 */

export type RouteMethod = "held-karp" | "corridor-dp" | "lp-cuts" | "local-search";

export const METHOD_NAMES: Record<RouteMethod, string> = {
  "held-karp": "Held–Karp",
  "corridor-dp": "the corridor sweep",
  "lp-cuts": "linear programming with subtour cuts",
  "local-search": "local search",
};

export interface RouteCertificate {
  method: RouteMethod;
  lengthMm: number;
  /** Never above the shortest possible walk; equal to lengthMm when the route is proved shortest. */
  lowerBoundMm: number;
}

export function isProved(c: Pick<RouteCertificate, "lengthMm" | "lowerBoundMm">): boolean {
  return c.lowerBoundMm >= c.lengthMm;
}

/**
 * How much longer than the shortest possible walk the route can at most be, in percent, rounded up
 * to one decimal so the stated figure is never smaller than the truth. Infinity without a bound.
 */
export function gapPercent(c: Pick<RouteCertificate, "lengthMm" | "lowerBoundMm">): number {
  if (isProved(c)) return 0;
  if (!(c.lowerBoundMm > 0)) return Infinity;
  return Math.ceil((1000 * (c.lengthMm - c.lowerBoundMm)) / c.lowerBoundMm) / 10;
}

/** The certificate in plain words, as the wave page, the batch page and the pick list print it. */
export function certificateText(c: RouteCertificate): string {
  // A heuristic route can be proved too, when its length meets the bound; the bound is then the proof.
  if (isProved(c))
    return c.method === "local-search"
      ? "shortest — its length meets a proved lower bound"
      : `shortest — proved by ${METHOD_NAMES[c.method]}`;
  const gap = gapPercent(c);
  if (gap === Infinity) return `found by ${METHOD_NAMES[c.method]}; no bound on how far from the shortest it is`;
  return `at most ${gap.toLocaleString("en-GB")} % above the shortest possible walk (found by ${METHOD_NAMES[c.method]})`;
}
