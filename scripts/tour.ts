// Solves a TSPLIB TSP/ATSP file as a closed tour from city 1 with the routing engine and prints
// one JSON line: name, n, length, optimal, method (which solver ordered the stops), lowerBound (never
// above the shortest tour; equal to length when optimal) and ms. Usage: npx tsx scripts/tour.ts FILE [--exact-limit N]
import { readFileSync } from "node:fs";
import { parseTsplib } from "../lib/routing/tsplib";
import { loadHighs } from "../lib/routing/lp/highs";
import { sequenceStops } from "../lib/routing/sequence";

const args = process.argv.slice(2);
const file = args.find((a) => !a.startsWith("--"));
const limitAt = args.indexOf("--exact-limit");
const exactLimit = limitAt >= 0 ? Number(args[limitAt + 1]) : undefined;
if (!file) {
  console.error("usage: npx tsx scripts/tour.ts FILE [--exact-limit N]");
  process.exit(2);
}
const inst = parseTsplib(readFileSync(file, "utf8"));
const stops = Array.from({ length: inst.n - 1 }, (_, i) => i + 1);
async function main(): Promise<void> {
  // Above the exact limit the LP with subtour cuts bounds (and often proves) the local-search tour.
  await loadHighs();
  const t0 = performance.now();
  const r = sequenceStops(inst, { start: 0, end: 0, stops, exactLimit });
  const ms = Math.round(performance.now() - t0);
  console.log(
    JSON.stringify({
      name: inst.name,
      n: inst.n,
      length: r.length,
      optimal: r.optimal,
      method: r.method,
      lowerBound: r.lowerBound,
      ms,
    }),
  );
}

void main();
