// Exact routes at cart size: npx tsx scripts/bench-exact.ts — prints a markdown table on stdout.
// Every batch goes through planPick, so the figures are what a wave pays per batch: the method
// planPick chose, how often the route came out proved shortest, and the largest certified gap.
// Timings are wall-clock on whatever else the machine is doing; the load is printed with them.
import os from "node:os";
import { buildGraph, floydWarshall, generateWarehouse, planPick, randomBatch } from "../lib/routing";
import { gapPercent } from "../lib/routing/certificate";
import { loadHighs } from "../lib/routing/lp/highs";

interface Case {
  label: string;
  crossAisles: number;
  oneWay: boolean;
  stops: number[];
  goal: string;
}

const CASES: Case[] = [
  { label: "two-way", crossAisles: 2, oneWay: false, stops: [30, 60, 150], goal: "proved, < 50 ms" },
  { label: "two-way", crossAisles: 3, oneWay: false, stops: [30, 60, 150], goal: "proved, < 50 ms" },
  { label: "two-way", crossAisles: 4, oneWay: false, stops: [60, 150], goal: "proved, < 250 ms" },
  { label: "two-way", crossAisles: 5, oneWay: false, stops: [60, 150], goal: "proved, < 1 s" },
  { label: "one-way", crossAisles: 3, oneWay: true, stops: [25, 60], goal: "proved, < 200 ms" },
  { label: "one-way", crossAisles: 3, oneWay: true, stops: [150], goal: "proved < 1 s, or gap ≤ 1 %" },
];
const BATCHES = Number(process.env.BENCH_BATCHES ?? 8);

const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x.toFixed(2));

async function main(): Promise<void> {
  await loadHighs();
  const load = os.loadavg().map((l) => l.toFixed(2));
  console.log(`### Exact routes per batch (planPick), ${BATCHES} seeded batches a row`);
  console.log();
  console.log(`Machine: ${os.availableParallelism()} cores, load average ${load.join(" / ")} (1 / 5 / 15 min).`);
  console.log();
  console.log("| layout | cross-aisles | stops | methods used | proved | worst gap | mean ms | max ms | goal |");
  console.log("|---|---|---|---|---|---|---|---|---|");
  for (const c of CASES) {
    // 12 aisles × 40 positions: 480 distinct access points, room for 150-stop batches.
    const graph = buildGraph(
      generateWarehouse({ aisles: 12, positions: 40, levels: 2, crossAisles: c.crossAisles, oneWayAisles: c.oneWay }),
    );
    const dm = floydWarshall(graph);
    for (const m of c.stops) {
      const methods = new Map<string, number>();
      let proved = 0;
      let worstGap = 0;
      let total = 0;
      let max = 0;
      for (let b = 0; b < BATCHES; b++) {
        const binCodes = randomBatch(graph, m, 7_000 + 131 * m + b);
        const t0 = performance.now();
        const plan = planPick(graph, dm, { from: "D1", to: "P1", binCodes });
        const t = performance.now() - t0;
        total += t;
        max = Math.max(max, t);
        methods.set(plan.method, (methods.get(plan.method) ?? 0) + 1);
        if (plan.optimal) proved++;
        worstGap = Math.max(worstGap, gapPercent(plan));
      }
      const used = [...methods].map(([k, v]) => `${k} ×${v}`).join(", ");
      const gap = worstGap === Infinity ? "no bound" : `${worstGap.toFixed(1)} %`;
      console.log(
        `| ${c.label} | ${c.crossAisles} | ${m} | ${used} | ${proved}/${BATCHES} | ${gap} | ${fmt(total / BATCHES)} | ${fmt(max)} | ${c.goal} |`,
      );
    }
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
