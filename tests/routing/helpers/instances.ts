import { mulberry32, type CostMatrix } from "../../../lib/routing";

/** Seeded random instance: symmetric from rounded Euclidean points, or asymmetric uniform costs. */
export function randomInstance(n: number, seed: number, symmetric: boolean): CostMatrix {
  const rand = mulberry32(seed);
  const cost = new Int32Array(n * n);
  if (symmetric) {
    const pts = Array.from({ length: n }, () => [rand() * 10000, rand() * 10000] as const);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const [a, b] = [pts[i]!, pts[j]!];
        cost[i * n + j] = i === j ? 0 : Math.round(Math.hypot(a[0] - b[0], a[1] - b[1]));
      }
    }
  } else {
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) cost[i * n + j] = i === j ? 0 : 1 + Math.floor(rand() * 9999);
  }
  return { n, cost };
}

export function permutations<T>(xs: readonly T[]): T[][] {
  if (xs.length <= 1) return [xs.slice()];
  const out: T[][] = [];
  xs.forEach((x, i) => {
    for (const rest of permutations([...xs.slice(0, i), ...xs.slice(i + 1)])) out.push([x, ...rest]);
  });
  return out;
}
