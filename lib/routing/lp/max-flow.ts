/**
 * Edmonds–Karp maximum flow on a small dense network (capacities cap[u * n + v]), enough for
 * the LP's support graphs: a few hundred nodes, fractional capacities summing to about n.
 * Returns the flow value and the nodes still reachable from the source in the residual network;
 * the rest hold the sink and form a minimum cut's sink side.
 */
export function maxFlow(
  n: number,
  cap: Float64Array,
  neighbours: readonly number[][],
  source: number,
  sink: number,
  eps = 1e-9,
): { value: number; sourceSide: Uint8Array } {
  const res = Float64Array.from(cap);
  const parent = new Int32Array(n);
  const queue = new Int32Array(n);
  let value = 0;
  const sourceSide = new Uint8Array(n);
  while (true) {
    parent.fill(-1);
    sourceSide.fill(0);
    parent[source] = source;
    sourceSide[source] = 1;
    let head = 0;
    let tail = 0;
    queue[tail++] = source;
    while (head < tail && parent[sink] === -1) {
      const u = queue[head++] as number;
      for (const v of neighbours[u] as number[]) {
        if (parent[v] === -1 && (res[u * n + v] as number) > eps) {
          parent[v] = u;
          sourceSide[v] = 1;
          queue[tail++] = v;
        }
      }
    }
    if (parent[sink] === -1) return { value, sourceSide };
    let push = Infinity;
    for (let v = sink; v !== source; v = parent[v] as number) {
      const u = parent[v] as number;
      push = Math.min(push, res[u * n + v] as number);
    }
    for (let v = sink; v !== source; v = parent[v] as number) {
      const u = parent[v] as number;
      res[u * n + v] = (res[u * n + v] as number) - push;
      res[v * n + u] = (res[v * n + u] as number) + push;
    }
    value += push;
  }
}
