import type { CostMatrix } from "./cost-matrix";
import { walkLength } from "./cost-matrix";
import type { PathResult } from "./held-karp";
import type { HeuristicOptions } from "./local-search";
import { localSearch } from "./local-search";
import { oneWayChains } from "./lp/arcs";
import type { StopSegment } from "./segments";

/**
 * Local search that walks each one-way run of stops as one piece. Some shortest order takes the
 * stops of a one-way edge in a row, first to last (lib/routing/lp/arcs.ts says why), yet moves
 * that split such a run rarely pay back at once, so plain local search tends to leave them split.
 * Each run becomes one super-stop: entered like its first stop, left like its last; its inside
 * length is the same in every order, so it is left out of the search and counted on expansion.
 */
export function chainedLocalSearch(
  cm: CostMatrix,
  start: number,
  end: number,
  stops: readonly number[],
  segments: readonly StopSegment[],
  opts: HeuristicOptions = {},
): PathResult {
  const unique = [...new Set(stops)];
  const chains = oneWayChains(unique, segments);
  const inChain = new Set(chains.flat());
  const groups = [...chains, ...unique.filter((s) => !inChain.has(s)).map((s) => [s])];
  if (groups.length === unique.length) return localSearch(cm, start, end, unique, opts);

  // Reduced matrix: 0 = start, 1 = end, 2.. = groups.
  const g = groups.length + 2;
  const first = (i: number) => (i === 0 ? start : i === 1 ? end : ((groups[i - 2] as number[])[0] as number));
  const last = (i: number) => {
    if (i < 2) return i === 0 ? start : end;
    const grp = groups[i - 2] as number[];
    return grp[grp.length - 1] as number;
  };
  const cost = new Int32Array(g * g);
  for (let a = 0; a < g; a++)
    for (let b = 0; b < g; b++) if (a !== b) cost[a * g + b] = cm.cost[last(a) * cm.n + first(b)] as number;
  const r = localSearch(
    { n: g, cost },
    0,
    1,
    Array.from({ length: groups.length }, (_, i) => i + 2),
    opts,
  );
  const order = r.order.flatMap((i) => groups[i - 2] as number[]);
  return { order, length: walkLength(cm, start, order, end) };
}
