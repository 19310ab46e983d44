/** One edge of the sweep: which front positions its ends take and which positions leave after it. */
export interface SweepStep {
  edge: number;
  /** Nodes at the working positions: the front before this edge, then the nodes it brings in. */
  work: number[];
  prevWidth: number;
  uPos: number;
  vPos: number;
  /** Working positions whose last edge this is, ascending. */
  leaving: number[];
}

export interface SweepPlan {
  steps: SweepStep[];
  /** Largest number of working positions at any step. */
  width: number;
  /** Sum over steps of working positions, a tie-break between orders of equal width. */
  load: number;
}

interface Ends {
  u: number;
  v: number;
}

/** Sweeps the edges in the order their later end appears in `rank` (edges within the front first). */
export function planFromRank(edges: readonly Ends[], include: readonly number[], rank: ArrayLike<number>): SweepPlan {
  const later = (i: number) => Math.max(rank[(edges[i] as Ends).u] as number, rank[(edges[i] as Ends).v] as number);
  const earlier = (i: number) => Math.min(rank[(edges[i] as Ends).u] as number, rank[(edges[i] as Ends).v] as number);
  const order = [...include].sort((a, b) => later(a) - later(b) || earlier(a) - earlier(b) || a - b);
  const lastStep = new Map<number, number>();
  order.forEach((ei, step) => {
    const e = edges[ei] as Ends;
    lastStep.set(e.u, step);
    lastStep.set(e.v, step);
  });
  let front: number[] = [];
  const steps: SweepStep[] = [];
  let width = 0;
  let load = 0;
  order.forEach((ei, step) => {
    const e = edges[ei] as Ends;
    const work = front.slice();
    for (const x of e.u === e.v ? [e.u] : [e.u, e.v]) if (!work.includes(x)) work.push(x);
    const uPos = work.indexOf(e.u);
    const vPos = work.indexOf(e.v);
    const leaving: number[] = [];
    work.forEach((x, p) => {
      if (lastStep.get(x) === step) leaving.push(p);
    });
    steps.push({ edge: ei, work, prevWidth: front.length, uPos, vPos, leaving });
    width = Math.max(width, work.length);
    load += work.length;
    front = work.filter((_, p) => !leaving.includes(p));
  });
  return { steps, width, load };
}

/** Greedy node order: each next node is the one that leaves the fewest nodes waiting on unswept edges. */
function greedyRank(nodeCount: number, edges: readonly Ends[], include: readonly number[], first: number): Int32Array {
  const adj: number[][] = Array.from({ length: nodeCount }, () => []);
  for (const i of include) {
    const e = edges[i] as Ends;
    adj[e.u]?.push(e.v);
    adj[e.v]?.push(e.u);
  }
  const rank = new Int32Array(nodeCount).fill(-1);
  // open[x] = neighbours of x not yet placed, for placed x.
  const open = new Int32Array(nodeCount);
  const candidates = new Set<number>([first]);
  let frontSize = 0;
  for (let r = 0; candidates.size > 0; r++) {
    let best = -1;
    let bestScore = Infinity;
    for (const c of candidates) {
      let closes = 0;
      let outside = 0;
      for (const y of adj[c] as number[]) {
        if ((rank[y] as number) >= 0) {
          if (open[y] === 1) closes++;
        } else outside++;
      }
      const score = frontSize - closes + (outside > 0 ? 1 : 0);
      if (score < bestScore || (score === bestScore && c < best)) {
        bestScore = score;
        best = c;
      }
    }
    candidates.delete(best);
    rank[best] = r;
    let outside = 0;
    for (const y of adj[best] as number[]) {
      if ((rank[y] as number) >= 0) {
        open[y] = (open[y] as number) - 1;
        if (open[y] === 0) frontSize--;
      } else {
        outside++;
        candidates.add(y);
      }
    }
    open[best] = outside;
    if (outside > 0) frontSize++;
  }
  let r = nodeCount;
  for (let x = 0; x < nodeCount; x++) if ((rank[x] as number) < 0) rank[x] = r++;
  return rank;
}

/**
 * The narrowest of a few sweep orders: by x then y, by y then x (both directions), and greedy
 * orders grown from the four extreme nodes.
 */
export function chooseSweep(
  nodeCount: number,
  xs: readonly number[],
  ys: readonly number[],
  edges: readonly Ends[],
  include: readonly number[],
): SweepPlan {
  const used = new Set<number>();
  for (const i of include) {
    used.add((edges[i] as Ends).u);
    used.add((edges[i] as Ends).v);
  }
  const nodes = [...used];
  const ranks: ArrayLike<number>[] = [];
  const sorted = (key: (a: number, b: number) => number) => {
    const rank = new Int32Array(nodeCount).fill(nodeCount);
    [...nodes].sort((a, b) => key(a, b) || a - b).forEach((x, r) => (rank[x] = r));
    return rank;
  };
  const x = (i: number) => xs[i] as number;
  const y = (i: number) => ys[i] as number;
  ranks.push(sorted((a, b) => x(a) - x(b) || y(a) - y(b)));
  ranks.push(sorted((a, b) => x(b) - x(a) || y(a) - y(b)));
  ranks.push(sorted((a, b) => y(a) - y(b) || x(a) - x(b)));
  ranks.push(sorted((a, b) => y(b) - y(a) || x(a) - x(b)));
  if (nodes.length > 0) {
    const extreme = (key: (i: number) => number) => nodes.reduce((b, i) => (key(i) < key(b) ? i : b));
    for (const k of [x, y, (i: number) => -x(i), (i: number) => -y(i)]) {
      ranks.push(greedyRank(nodeCount, edges, include, extreme(k)));
    }
  }
  let best: SweepPlan | null = null;
  for (const rank of ranks) {
    const plan = planFromRank(edges, include, rank);
    if (!best || plan.width < best.width || (plan.width === best.width && plan.load < best.load)) best = plan;
  }
  return best as SweepPlan;
}
