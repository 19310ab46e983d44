// Routing benchmark: npx tsx scripts/bench.ts [--write]  (--write also saves docs/benchmarks.md).
// Timings are wall-clock on whatever else the machine is doing; run it on an idle machine.
import { execSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import loadHighs from "highs";
import {
  buildGraph,
  EXACT_LIMIT,
  floydWarshall,
  generateWarehouse,
  heldKarp,
  heldKarpBytes,
  localSearch,
  mulberry32,
  parseTsplib,
  planPick,
  randomBatch,
  walkLength,
  type CostMatrix,
} from "../lib/routing";
import { accessCostMatrix } from "../lib/routing/plan";
import { nodeAccessPoint } from "../lib/routing/graph";

const rows: string[][] = [];
const row = (...cells: (string | number)[]) => {
  rows.push(cells.map(String));
  console.error(cells.join(" | "));
};
const ms = (t0: number) => performance.now() - t0;
const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x.toFixed(2));
const mb = (bytes: number) => `${(bytes / 2 ** 20).toFixed(0)} MiB`;
const peakRss = () => mb(process.resourceUsage().maxRSS * 1024);

function randomMatrix(n: number, seed: number): CostMatrix {
  const rand = mulberry32(seed);
  const cost = new Int32Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) cost[i * n + j] = i === j ? 0 : 1 + Math.floor(rand() * 99_999);
  return { n, cost };
}
const stopsOf = (m: number) => Array.from({ length: m }, (_, i) => i + 2);

function mtzLp(cm: CostMatrix, stops: number[]): string {
  const m = stops.length;
  const arcs: [number, number][] = [];
  for (const i of [0, ...stops]) for (const j of [...stops, 1]) if (i !== j && !(i === 0 && j === 1)) arcs.push([i, j]);
  const x = (i: number, j: number) => `x_${i}_${j}`;
  const out = ["Minimize", " obj:", ...arcs.map(([i, j]) => ` + ${cm.cost[i * cm.n + j]} ${x(i, j)}`), "Subject To"];
  for (const i of [0, ...stops])
    out.push(
      ` o${i}: ${arcs
        .filter(([a]) => a === i)
        .map(([a, b]) => x(a, b))
        .join(" + ")} = 1`,
    );
  for (const j of [...stops, 1])
    out.push(
      ` i${j}: ${arcs
        .filter(([, b]) => b === j)
        .map(([a, b]) => x(a, b))
        .join(" + ")} = 1`,
    );
  for (const i of stops)
    for (const j of stops) if (i !== j) out.push(` m${i}_${j}: u${i} - u${j} + ${m} ${x(i, j)} <= ${m - 1}`);
  out.push(
    "Bounds",
    ...stops.map((i) => ` 1 <= u${i} <= ${m}`),
    "Binaries",
    ...arcs.map(([i, j]) => ` ${x(i, j)}`),
    "End",
  );
  return out.join("\n");
}

function bruteForce(cm: CostMatrix, stops: number[]): number {
  let best = Infinity;
  const perm = stops.slice();
  const rec = (k: number) => {
    if (k === perm.length) {
      best = Math.min(best, walkLength(cm, 0, perm, 1));
      return;
    }
    for (let i = k; i < perm.length; i++) {
      [perm[k], perm[i]] = [perm[i] as number, perm[k] as number];
      rec(k + 1);
      [perm[k], perm[i]] = [perm[i] as number, perm[k] as number];
    }
  };
  rec(0);
  return best;
}

async function main() {
  // Held–Karp scaling on random asymmetric costs.
  for (const m of [12, 16, 18, 20, 22]) {
    const cm = randomMatrix(m + 2, m);
    const t0 = performance.now();
    heldKarp(cm, 0, 1, stopsOf(m));
    row(
      `Held–Karp, ${m} stops`,
      `${fmt(ms(t0))} ms`,
      `DP table ${mb(heldKarpBytes(m))}; process peak RSS so far ${peakRss()}`,
    );
  }

  // HiGHS and brute force against the DP on the same instances.
  const highs = await loadHighs();
  const cm10 = randomMatrix(12, 1010);
  let t0 = performance.now();
  const hk10 = heldKarp(cm10, 0, 1, stopsOf(10));
  const hkMs = ms(t0);
  t0 = performance.now();
  const sol = highs.solve(mtzLp(cm10, stopsOf(10)), { output_flag: false, mip_rel_gap: 0 });
  const highsMs = ms(t0);
  row(
    "HiGHS MILP (MTZ), 10 stops",
    `${fmt(highsMs)} ms`,
    `Held–Karp ${fmt(hkMs)} ms on the same instance, ratio ${fmt(highsMs / hkMs)}×; optima ${Math.round(sol.ObjectiveValue)} vs ${hk10.length}`,
  );
  const cm9 = randomMatrix(11, 909);
  t0 = performance.now();
  const hk9 = heldKarp(cm9, 0, 1, stopsOf(9));
  const hk9Ms = ms(t0);
  t0 = performance.now();
  const bf9 = bruteForce(cm9, stopsOf(9));
  const bfMs = ms(t0);
  row(
    "Brute force, 9 stops (9! orders)",
    `${fmt(bfMs)} ms`,
    `Held–Karp ${fmt(hk9Ms)} ms, ratio ${fmt(bfMs / hk9Ms)}×; optima ${bf9} vs ${hk9.length}`,
  );

  // Heuristic against the exact optimum on warehouse batches (8 aisles, 2 cross aisles).
  const small = buildGraph(generateWarehouse({ aisles: 8, positions: 20, levels: 4, crossAisles: 2 }));
  const smallDm = floydWarshall(small);
  const batchMatrix = (codes: string[]) => {
    const aps = [...new Set(codes.map((c) => small.bins.find((b) => b.code === c)?.accessPoint as number))];
    const depot = nodeAccessPoint(small, small.depots[0]?.node as number);
    const drop = nodeAccessPoint(small, small.dropoffs[0]?.node as number);
    return accessCostMatrix(small, smallDm, [depot, drop, ...aps.map((a) => small.accessPoints[a]!)]);
  };
  for (const [m, batches] of [
    [15, 100],
    [20, 20],
  ] as const) {
    let gap = 0;
    let worst = 0;
    let hMs = 0;
    let eMs = 0;
    for (let s = 1; s <= batches; s++) {
      const cm = batchMatrix(randomBatch(small, m, 7000 + s));
      t0 = performance.now();
      const exact = heldKarp(cm, 0, 1, stopsOf(m));
      eMs += ms(t0);
      t0 = performance.now();
      const h = localSearch(cm, 0, 1, stopsOf(m), { seed: s });
      hMs += ms(t0);
      const g = h.length / exact.length - 1;
      gap += g;
      worst = Math.max(worst, g);
    }
    row(
      `Heuristic, ${m} stops (${batches} warehouse batches)`,
      `${fmt(hMs / batches)} ms mean`,
      `mean gap ${((100 * gap) / batches).toFixed(2)}%, worst ${(100 * worst).toFixed(2)}%; Held–Karp ${fmt(eMs / batches)} ms mean`,
    );
  }
  {
    // Uniform random directed costs have no aisle structure, so they are harder for local search.
    let gap = 0;
    let hMs = 0;
    for (let s = 1; s <= 100; s++) {
      const cm = randomMatrix(17, 6000 + s);
      const exact = heldKarp(cm, 0, 1, stopsOf(15));
      t0 = performance.now();
      const h = localSearch(cm, 0, 1, stopsOf(15), { seed: s });
      hMs += ms(t0);
      gap += h.length / exact.length - 1;
    }
    row(
      "Heuristic, 15 stops (100 random asymmetric instances)",
      `${fmt(hMs / 100)} ms mean`,
      `mean gap ${((100 * gap) / 100).toFixed(2)}%`,
    );
  }
  const big = buildGraph(generateWarehouse({ aisles: 20, positions: 50, levels: 5, crossAisles: 3 }));
  const bigDm = floydWarshall(big);
  for (const m of [60, 150]) {
    let total = 0;
    for (let s = 1; s <= 5; s++) {
      const plan = () =>
        planPick(
          big,
          bigDm,
          { from: "D1", to: "P1", binCodes: randomBatch(big, m, 8000 + s) },
          { heuristic: { seed: s } },
        );
      t0 = performance.now();
      plan();
      total += ms(t0);
    }
    row(
      `Heuristic, ${m} stops (10,000-bin layout, 5 batches)`,
      `${fmt(total / 5)} ms mean`,
      "whole planPick: stop matrix, local search, baseline",
    );
  }

  // Baseline (serpentine by location code) against the optimum.
  for (const [m, batches] of [
    [10, 100],
    [20, 20],
  ] as const) {
    let saving = 0;
    for (let s = 1; s <= batches; s++) {
      const p = planPick(small, smallDm, { from: "D1", to: "P1", binCodes: randomBatch(small, m, 9000 + s) });
      saving += p.savingMm / p.baselineMm;
    }
    row(
      `Baseline vs optimal, ${m} stops (${batches} batches, 8 aisles, 2 cross aisles)`,
      `${((100 * saving) / batches).toFixed(1)}% shorter`,
      "mean saving of the optimal walk over the serpentine walk",
    );
  }

  // Publish cost: grid → graph and Floyd–Warshall.
  for (const spec of [
    { aisles: 10, positions: 20, levels: 5, crossAisles: 3 },
    { aisles: 20, positions: 50, levels: 5, crossAisles: 3 },
    { aisles: 60, positions: 120, levels: 5, crossAisles: 9 },
  ]) {
    t0 = performance.now();
    const d = generateWarehouse(spec);
    const g = buildGraph(d);
    const buildMs = ms(t0);
    t0 = performance.now();
    floydWarshall(g);
    row(
      `Floyd–Warshall, ${d.bins.length} bins (${d.width}×${d.height} cells)`,
      `${fmt(ms(t0))} ms`,
      `${g.nodes.length} nodes, ${g.edges.length} edges, ${g.accessPoints.length} access points; grid → graph ${fmt(buildMs)} ms`,
    );
  }

  // gr24 needs 23 exact stops: beyond the default limit, so it is checked here rather than in tests.
  const gr24 = parseTsplib(readFileSync(path.join(__dirname, "../tests/fixtures/tsplib/gr24.tsp"), "utf8"));
  t0 = performance.now();
  const tour = heldKarp(
    gr24,
    0,
    0,
    Array.from({ length: 23 }, (_, i) => i + 1),
  );
  row(
    "gr24 closed tour, Held–Karp, 23 stops",
    `${fmt(ms(t0))} ms`,
    `length ${tour.length} (published optimum 1272, TSPLIB, Reinelt 1991); DP table ${mb(heldKarpBytes(23))}; peak RSS ${peakRss()}`,
  );

  const cpu =
    /model name\s*:\s*(.*)/.exec(readFileSync("/proc/cpuinfo", "utf8"))?.[1] ?? os.cpus()[0]?.model ?? "unknown";
  const nproc = execSync("nproc").toString().trim();
  const table = ["| case | time | notes |", "|---|---|---|", ...rows.map((r) => `| ${r.join(" | ")} |`)].join("\n");
  const header = `Machine: ${nproc} cores (nproc), ${cpu}, Node ${process.version}, load average at end ${os
    .loadavg()
    .map((l) => l.toFixed(2))
    .join(" ")}.`;
  console.log(`${header}\n\n${table}`);
  if (process.argv.includes("--write")) {
    const doc = `# Routing benchmarks

Produced by \`npx tsx scripts/bench.ts --write\` (\`npm run bench\` prints the same table).
${header}

${table}

Exact limit: \`EXACT_LIMIT = ${EXACT_LIMIT}\` stops (lib/routing/sequence.ts). Each subset's row of
the DP table holds only the stops inside it, 2·m·2^m bytes: 40 MiB at 20 stops, 176 MiB at 22; time
roughly doubles per extra stop. Above the limit planPick proves routes by the corridor sweep or the
LP with subtour cuts (see "Exact routes at cart size"); the local-search rows here are the search alone.
Callers can raise the limit per request (\`exactLimit\`, at most ${24}) when they accept the time and memory.

Random instances: uniform asymmetric costs 1–99,999 (seeded). Warehouse batches: distinct
access points drawn (seeded) from \`generateWarehouse\` layouts, depot top-left, drop-off top-right.
`;
    // Only this table's section is rewritten; the sections after it come from the other benches.
    const file = path.join(__dirname, "../docs/benchmarks.md");
    const old = readFileSync(file, "utf8");
    const rest = old.indexOf("\n## ");
    writeFileSync(file, rest < 0 ? doc : doc + old.slice(rest));
  }
}

void main();
