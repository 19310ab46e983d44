// Corridor sweep DP timings: npx tsx scripts/bench/corridor.ts [batches per row, default 10] [aisles, default 10]
// Wall-clock on whatever else the machine is doing. Goal: ≤3 cross aisles at 150 stops under 50 ms,
// 4 under 250 ms, 5 under 1 s.
import { performance } from "node:perf_hooks";
import {
  buildGraph,
  floydWarshall,
  generateWarehouse,
  nodeAccessPoint,
  randomBatch,
  type AccessPoint,
} from "../../lib/routing";
import { corridorFrontWidth, corridorSweep } from "../../lib/routing/corridor-dp";

const batches = Number(process.argv[2] ?? 10);
const AISLES = Number(process.argv[3] ?? 10);
const POSITIONS = 30;

console.log(`warehouse: ${AISLES} aisles × ${POSITIONS} positions, depot → drop-off, ${batches} batches per row`);
console.log("cross aisles | nodes | edges | front | stops | mean ms | max ms");
for (const crossAisles of [2, 3, 4, 5]) {
  const graph = buildGraph(generateWarehouse({ aisles: AISLES, positions: POSITIONS, levels: 2, crossAisles }));
  floydWarshall(graph);
  const front = corridorFrontWidth(graph);
  const byCode = new Map(graph.bins.map((b) => [b.code, b.accessPoint]));
  const start = nodeAccessPoint(graph, graph.depots[0]!.node);
  const end = nodeAccessPoint(graph, graph.dropoffs[0]!.node);
  for (const n of [30, 60, 150]) {
    const times: number[] = [];
    for (let b = 0; b < batches; b++) {
      const stops = randomBatch(graph, n, 7919 * crossAisles + 31 * n + b).map(
        (c) => graph.accessPoints[byCode.get(c)!] as AccessPoint,
      );
      const t0 = performance.now();
      const r = corridorSweep({ graph, start, end, stops });
      times.push(performance.now() - t0);
      if ("skipped" in r) throw new Error(`skipped: ${r.skipped}`);
    }
    const mean = times.reduce((a, b) => a + b, 0) / times.length;
    const max = Math.max(...times);
    console.log(
      `${crossAisles} | ${graph.nodes.length} | ${graph.edges.length} | ${front} | ${n} | ${mean.toFixed(1)} | ${max.toFixed(1)}`,
    );
  }
}
