import { maxFlow } from "./max-flow";

/** Arc i → j of the LP on the local numbering (0 = start and end merged). */
export interface LpArc {
  from: number;
  to: number;
}

/** A violated subtour cut reads: the arcs entering `set` (which never holds node 0) carry at least 1. */
export type CutSet = number[];

const VIOLATION = 1e-6;

function cutKey(set: readonly number[]): string {
  return [...set].sort((a, b) => a - b).join(",");
}

/**
 * Subtour cuts violated by the LP point x (one value per arc). First the weakly connected
 * components of the support graph: a component without node 0 has (almost) nothing entering it.
 * When the support is connected, a maximum flow from 0 to each node t finds any set around t
 * that less than 1 enters, which is exactly a violated cut (min-cut separation).
 */
export function violatedCuts(k: number, arcs: readonly LpArc[], x: ArrayLike<number>, support = 1e-9): CutSet[] {
  const cap = new Float64Array(k * k);
  const nbr: number[][] = Array.from({ length: k }, () => []);
  const root = Int32Array.from({ length: k }, (_, i) => i);
  const find = (a: number): number => {
    while (root[a] !== a) a = root[a] = root[root[a] as number] as number;
    return a;
  };
  arcs.forEach((arc, c) => {
    const v = x[c] as number;
    if (v <= support) return;
    if ((cap[arc.from * k + arc.to] as number) === 0 && (cap[arc.to * k + arc.from] as number) === 0) {
      (nbr[arc.from] as number[]).push(arc.to);
      (nbr[arc.to] as number[]).push(arc.from);
    }
    cap[arc.from * k + arc.to] = (cap[arc.from * k + arc.to] as number) + v;
    root[find(arc.from)] = find(arc.to);
  });

  const groups = new Map<number, number[]>();
  for (let i = 0; i < k; i++) {
    const r = find(i);
    const g = groups.get(r) ?? [];
    g.push(i);
    groups.set(r, g);
  }
  if (groups.size > 1) return [...groups.values()].filter((g) => !g.includes(0));

  const cuts = new Map<string, CutSet>();
  const covered = new Uint8Array(k);
  for (let t = 1; t < k; t++) {
    // A node already inside a cut found this round rarely yields a different one; skip it.
    if (covered[t]) continue;
    const { value, sourceSide } = maxFlow(k, cap, nbr, 0, t);
    if (value >= 1 - VIOLATION) continue;
    const set: number[] = [];
    for (let i = 0; i < k; i++) if (!sourceSide[i]) set.push(i);
    for (const i of set) covered[i] = 1;
    cuts.set(cutKey(set), set);
  }
  return [...cuts.values()];
}

/** Cycles of an integral point (each node's single outgoing arc), the one through 0 first. */
export function integerCycles(k: number, arcs: readonly LpArc[], x: ArrayLike<number>): number[][] {
  const succ = new Int32Array(k).fill(-1);
  arcs.forEach((arc, c) => {
    if ((x[c] as number) > 0.5) succ[arc.from] = arc.to;
  });
  const seen = new Uint8Array(k);
  const cycles: number[][] = [];
  for (let s = 0; s < k; s++) {
    if (seen[s]) continue;
    const cyc: number[] = [];
    for (let v = s; v >= 0 && !seen[v]; v = succ[v] as number) {
      seen[v] = 1;
      cyc.push(v);
    }
    cycles.push(cyc);
  }
  return cycles;
}
