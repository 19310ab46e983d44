// Wave batching benchmark: npx tsx scripts/bench-waves.ts — prints a markdown table on stdout.
// Timings are wall-clock on whatever else the machine is doing; run it on an idle machine.
import os from "node:os";
import { bramblegateDocument } from "../db/seeds/demo/floor-plan";
import { buildLayout } from "../lib/layout-versions/build";
import { loadHighs } from "../lib/routing/lp/highs";
import { batchOrders, type BatchingMethod, type SavingsOptions } from "../lib/batching";
import { DEMO_CART_LIMITS, demoItems, demoOrders } from "../db/seeds/demo/orders";

const m = (mm: number) => (mm / 1000).toFixed(0);
const pct = (part: number, whole: number) => (whole === 0 ? "–" : `${((100 * part) / whole).toFixed(1)} %`);

async function main(): Promise<void> {
  await loadHighs();
  const doc = bramblegateDocument();
  const { graph, matrix } = await buildLayout(doc);
  const items = demoItems(doc);
  const limits = DEMO_CART_LIMITS;
  const rows: string[] = [];
  // The last case is the wave of the size: 1,000 orders of exactly 5 lines (5,000 lines),
  // the demo orders' lines topped up or cut from the item master in a fixed pattern.
  const fiveLines = (o: ReturnType<typeof demoOrders>[number], k: number) => ({
    ...o,
    lines: Array.from({ length: 5 }, (_, i) => {
      const it = items[((k * 5 + i) * 7) % items.length]!;
      return (
        o.lines[i] ?? {
          lineId: 1_000_000 + o.orderId * 10 + i,
          sku: it.sku,
          binCode: it.binCode,
          quantity: 1 + (i % 3),
          unitWeightG: it.unitWeightG,
        }
      );
    }),
  });
  const cases = [
    { count: 200, orders: demoOrders(items, { days: 5, perDay: 40, seed: 1 }) },
    { count: 1000, orders: demoOrders(items, { days: 5, perDay: 200, seed: 1 }) },
    { count: 1000, orders: demoOrders(items, { days: 5, perDay: 200, seed: 1 }).map(fiveLines) },
  ];
  for (const { count, orders } of cases) {
    // Five demo days; the per-day count sets how many orders share each carrier cut-off.
    let firstComeMm = 0;
    // The last variant pools a day's cut-offs (10:00 to 16:30) into one window, to show what the
    // default same-cut-off rule gives up for keeping carts in carrier order.
    const variants: { label: string; method: BatchingMethod; savings?: SavingsOptions }[] = [
      { label: "first-come", method: "first-come" },
      { label: "savings", method: "savings" },
      { label: "savings, 6.5 h cut-off slack", method: "savings", savings: { cutoffSlackMinutes: 390 } },
    ];
    for (const { label, method, savings } of variants) {
      const t0 = performance.now();
      const r = batchOrders(graph, matrix, orders, limits, { method, from: "D1", to: "P1", savings });
      const seconds = (performance.now() - t0) / 1000;
      const walk = r.batches.reduce((s, b) => s + b.route.lengthMm, 0);
      const baseline = r.batches.reduce((s, b) => s + b.route.baselineMm, 0);
      const proved = r.batches.filter((b) => b.route.optimal).length;
      if (method === "first-come") firstComeMm = walk;
      const less =
        method === "first-come" ? "–" : `${m(firstComeMm - walk)} m (${pct(firstComeMm - walk, firstComeMm)})`;
      rows.push(
        `| ${count} | ${orders.reduce((n, o) => n + o.lines.length, 0)} | ${label} | ${seconds.toFixed(1)} s | ${r.batches.length} (${proved} proved shortest) | ${m(walk)} m | ${m(baseline)} m | ${pct(baseline - walk, baseline)} | ${less} |`,
      );
    }
  }
  const cpu = os.cpus()[0]?.model ?? "unknown CPU";
  console.log(
    `Load average ${os
      .loadavg()
      .map((l) => l.toFixed(2))
      .join(" / ")} (1 / 5 / 15 min).`,
  );
  console.log("");
  console.log(`### Wave batching on the demo Bramblegate layout (${graph.accessPoints.length} access points)`);
  console.log("");
  console.log(
    `Invented Fennick demo orders (seed 1, five days), cart of ${limits.totesPerCart} totes, ${limits.maxLines} lines, ${limits.maxWeightG / 1000} kg; ` +
      `depot D1 to packing P1. Time includes planPick for every batch (the fastest method that proves the route: Held–Karp, ` +
      `the corridor sweep or the LP with subtour cuts), ` +
      `which is most of it. ${os.cpus().length} × ${cpu}, Node ${process.version}.`,
  );
  console.log("");
  console.log(
    "| orders | lines | method | time | batches | planned walk | baseline walk | saved vs baseline | less than first-come |",
  );
  console.log("|---:|---:|---|---:|---:|---:|---:|---:|---:|");
  for (const r of rows) console.log(r);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
