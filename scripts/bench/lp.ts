// LP bound and proof benchmark: npx tsx scripts/bench/lp.ts [batches]
// Wall-clock on whatever else the machine runs; figures are printed, never asserted.
import { localSearch } from "../../lib/routing/local-search";
import { chainedLocalSearch } from "../../lib/routing/chains";
import { loadHighs } from "../../lib/routing/lp/highs";
import { lpRoute } from "../../lib/routing/lp/solve";
import { warehouseBatch, warehouseLayout } from "../../tests/routing/helpers/warehouse-batch";

const batches = Number(process.argv[2] ?? 10);

function stats(xs: number[]): string {
  const mean = xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
  return `${mean.toFixed(1)}/${Math.max(0, ...xs).toFixed(1)}`;
}
const pct = (len: number, lb: number) => (100 * (len - lb)) / lb;

async function main(): Promise<void> {
  await loadHighs();
  const layout = {
    oneWay: warehouseLayout({ aisles: 12, positions: 40, crossAisles: 3, oneWay: true }),
    twoWay: warehouseLayout({ aisles: 12, positions: 40, crossAisles: 3, oneWay: false }),
  };
  // The WebAssembly code tiers up over the first solves; a long-lived worker has paid that already.
  for (let seed = 1; seed <= 3; seed++) {
    const b = warehouseBatch(layout.twoWay, 60, seed, false);
    lpRoute(b.cm, b, { upperOrder: localSearch(b.cm, b.start, b.end, b.stops).order });
  }
  console.log(`${batches} batches each; 12 aisles x 40 positions, 3 cross-aisles; figures mean/max`);
  console.log(
    "layout   stops  bound ms      proof ms (1 s cap)  proved  gap to bound: chained LS  plain LS   after proof  |  4-round bound ms  gap",
  );
  for (const [name, m] of [
    ["one-way", 25],
    ["one-way", 60],
    ["one-way", 150],
    ["two-way", 60],
    ["two-way", 150],
  ] as const) {
    const L = name === "one-way" ? layout.oneWay : layout.twoWay;
    const boundMs: number[] = [];
    const proofMs: number[] = [];
    const gapChained: number[] = [];
    const gapPlain: number[] = [];
    const certified: number[] = [];
    const quickMs: number[] = [];
    const quickGap: number[] = [];
    let proved = 0;
    for (let seed = 1; seed <= batches; seed++) {
      const b = warehouseBatch(L, m, 1000 * m + seed, seed % 2 === 0);
      const req = { start: b.start, end: b.end, stops: b.stops, segments: b.segments };
      const chained = chainedLocalSearch(b.cm, b.start, b.end, b.stops, b.segments);
      const plain = localSearch(b.cm, b.start, b.end, b.stops);
      const upper = chained.length <= plain.length ? chained : plain;
      let t = performance.now();
      const bound = lpRoute(b.cm, req, { upperOrder: upper.order, integer: false });
      boundMs.push(performance.now() - t);
      gapChained.push(pct(chained.length, bound.lowerBound));
      gapPlain.push(pct(plain.length, bound.lowerBound));
      t = performance.now();
      const full = lpRoute(b.cm, req, { upperOrder: upper.order, maxRounds: 200, integerTimeLimitMs: 1000 });
      proofMs.push(performance.now() - t);
      if (full.proved) proved++;
      certified.push(full.proved ? 0 : pct(upper.length, full.lowerBound));
      t = performance.now();
      const quick = lpRoute(b.cm, req, { upperOrder: upper.order, integer: false, maxRounds: 4 });
      quickMs.push(performance.now() - t);
      quickGap.push(pct(upper.length, quick.lowerBound));
    }
    console.log(
      `${name.padEnd(8)} ${String(m).padStart(5)}  ${stats(boundMs).padEnd(12)}  ${stats(proofMs).padEnd(13)}  ${((100 * proved) / batches).toFixed(0).padStart(4)} %  ${stats(gapChained).padStart(22)} %  ${stats(gapPlain).padStart(9)} %  ${stats(certified).padStart(10)} %  |  ${stats(quickMs).padStart(16)}  ${stats(quickGap)} %`,
    );
  }
}

void main();
