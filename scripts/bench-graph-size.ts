// Floyd–Warshall time and memory against junction count, and what open-floor compression saves: the
// figures behind MAX_JUNCTIONS (lib/routing/limits.ts, docs/benchmarks.md). Printed by npm run bench.
//   npx tsx scripts/bench-graph-size.ts [side…]   each size runs in a fresh process, so its peak RSS is its own.
import { execFileSync } from "node:child_process";
import {
  buildGraph,
  emptyDrawing,
  floydWarshall,
  junctionCount,
  MAX_JUNCTIONS,
  type GridDrawing,
} from "../lib/routing";

/** A hall with a building column on every other cell both ways: nothing to compress, ((side + 1) / 2)² junctions. */
function pillarHall(side: number): GridDrawing {
  const d = emptyDrawing(side, side, 1000);
  for (let y = 1; y < side; y += 2) for (let x = 1; x < side; x += 2) d.cells[y * side + x] = "blocked";
  d.depots = [{ id: "D1", x: 0, y: 0 }];
  d.dropoffs = [{ id: "P1", x: side - 1, y: 0 }];
  return d;
}

/** 200 × 200 m of open floor in 500 mm cells around a block of `aisles` one-cell aisles, 150 bays deep, 4 levels. */
function openHall(aisles: number): GridDrawing {
  const side = 400;
  const d = emptyDrawing(side, side, 500);
  for (let a = 0; a < aisles; a++) {
    for (let y = 100; y < 250; y++) {
      for (const [x, facing] of [
        [100 + 3 * a, "E"],
        [102 + 3 * a, "W"],
      ] as const) {
        d.cells[y * side + x] = "rack";
        d.facing[y * side + x] = facing;
        for (let level = 1; level <= 4; level++)
          d.bins.push({ code: `${a}-${x}-${y}-${level}`, aisle: a + 1, bay: y, level, x, y });
      }
    }
  }
  d.depots = [{ id: "D1", x: 0, y: side - 1 }];
  d.dropoffs = [{ id: "P1", x: side - 1, y: side - 1 }];
  return d;
}

function one(side: number): void {
  const g = buildGraph(pillarHall(side));
  const t0 = performance.now();
  floydWarshall(g);
  const ms = performance.now() - t0;
  console.log(
    JSON.stringify({
      nodes: g.nodes.length,
      ms,
      peakRssMiB: process.resourceUsage().maxRSS / 1024,
      matricesMiB: (8 * g.nodes.length ** 2) / 2 ** 20,
    }),
  );
}

function compressionTable(): void {
  console.log(
    "| 200 × 200 m floor (400 × 400 cells of 500 mm) | junctions, every cell | junctions, compressed | grid → graph |",
  );
  console.log("|---|---:|---:|---:|");
  for (const aisles of [0, 20, 60]) {
    const d = openHall(aisles);
    const t0 = performance.now();
    const g = buildGraph(d);
    const ms = performance.now() - t0;
    console.log(
      `| open floor${aisles ? `, block of ${aisles} aisles (${d.bins.length.toLocaleString("en-US")} bins)` : ", depot and drop-off only"} | ${junctionCount(d, { compress: false }).toLocaleString("en-US")} | ${g.nodes.length.toLocaleString("en-US")} | ${ms.toFixed(0)} ms |`,
    );
  }
}

function main(): void {
  const sides = process.argv.slice(2).map(Number);
  console.log("| junctions | Floyd–Warshall | two n × n Int32 matrices | process peak RSS |");
  console.log("|---:|---:|---:|---:|");
  for (const side of sides.length ? sides : [45, 63, 77, 89, 101]) {
    const r = JSON.parse(
      execFileSync(process.execPath, ["--import", "tsx", __filename, "--one", String(side)]).toString(),
    );
    console.log(
      `| ${r.nodes.toLocaleString("en-US")} | ${(r.ms / 1000).toFixed(1)} s | ${r.matricesMiB.toFixed(0)} MiB | ${r.peakRssMiB.toFixed(0)} MiB |`,
    );
  }
  console.log(`\nLimit: MAX_JUNCTIONS = ${MAX_JUNCTIONS.toLocaleString("en-US")}.\n`);
  compressionTable();
}

if (process.argv[2] === "--one") one(Number(process.argv[3]));
else if (process.argv[2] === "--compression") compressionTable();
else main();
