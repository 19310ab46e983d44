import { pieceCounts, type Use } from "./edge-options";
import type { CorridorInstance } from "./instance";

/**
 * Turns the chosen edge uses into a walk: an Euler path (Hierholzer) from start to end over the
 * pieces between nodes and stops, each stop taken at its first passage. Returns the stop order
 * and the walk's length, which the caller checks against the sweep's cost.
 */
export function walkStops(inst: CorridorInstance, uses: Uint8Array): { order: number[]; lengthMm: number } {
  // Points: nodes first, then one per distinct stop offset inside each edge.
  const firstStopPoint: number[] = [];
  let points = inst.nodeCount;
  for (const e of inst.edges) {
    firstStopPoint.push(points);
    points += e.stops.length;
  }
  const ends: number[] = [];
  let lengthMm = 0;
  inst.edges.forEach((e, i) => {
    const counts = pieceCounts(e, uses[i] as Use);
    const at = (j: number) => (j === 0 ? e.u : j === e.stops.length + 1 ? e.v : (firstStopPoint[i] as number) + j - 1);
    const offset = (j: number) => (j === 0 ? 0 : j === e.stops.length + 1 ? e.lengthMm : (e.stops[j - 1] as number));
    counts.forEach((c, j) => {
      for (let k = 0; k < c; k++) ends.push(at(j), at(j + 1));
      lengthMm += c * (offset(j + 1) - offset(j));
    });
  });

  const adj: number[][] = Array.from({ length: points }, () => []);
  for (let k = 0; k < ends.length; k += 2) {
    adj[ends[k] as number]?.push(k >> 1);
    adj[ends[k + 1] as number]?.push(k >> 1);
  }
  const usedLink = new Uint8Array(ends.length >> 1);
  const cursor = new Int32Array(points);
  const stack = [inst.start];
  const reversed: number[] = [];
  while (stack.length > 0) {
    const x = stack[stack.length - 1] as number;
    const links = adj[x] as number[];
    let c = cursor[x] as number;
    while (c < links.length && usedLink[links[c] as number]) c++;
    cursor[x] = c;
    if (c === links.length) {
      reversed.push(stack.pop() as number);
      continue;
    }
    const link = links[c] as number;
    usedLink[link] = 1;
    stack.push(ends[2 * link] === x ? (ends[2 * link + 1] as number) : (ends[2 * link] as number));
  }
  const path = reversed.reverse();
  if (usedLink.some((u) => u === 0) || path[path.length - 1] !== inst.end) {
    throw new Error("corridor sweep chose edge uses that do not form one walk from start to end");
  }

  const pointOfStop = inst.places.map((pl) =>
    "node" in pl
      ? pl.node
      : (firstStopPoint[pl.edge] as number) + (inst.edges[pl.edge]?.stops.indexOf(pl.offsetMm) ?? 0),
  );
  const stopsAt = new Map<number, number[]>();
  pointOfStop.forEach((p, s) => {
    if (!stopsAt.has(p)) stopsAt.set(p, []);
    stopsAt.get(p)?.push(s);
  });
  const order: number[] = [];
  for (const p of path) {
    const here = stopsAt.get(p);
    if (here) {
      order.push(...here);
      stopsAt.delete(p);
    }
  }
  return { order, lengthMm };
}
