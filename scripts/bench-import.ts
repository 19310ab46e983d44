// Import of a 20,000-line order sheet through the same code as the import route: read the sheet in
// its sandboxed worker, check every row against the item master and the layout, write it in one
// transaction. Run by scripts/bench.sh against its own MariaDB.
import { createHash } from "node:crypto";
import { analyseImport } from "../lib/imports/analyse";
import { commitImport } from "../lib/imports/commit";
import { closeDb, db } from "../db/knex";

const LINES = 20_000;

async function main() {
  const site = await db()("sites").first("id");
  const user = await db()("users").where({ role: "planner" }).first("id");
  const version = await db()("layout_versions").orderBy("id").first("id");
  const skus: string[] = await db()("items").where({ site_id: site.id }).orderBy("sku").pluck("sku");
  // Invented orders over the demo item master: 4 lines each, cut-offs through one day.
  const rows = ["Order number,Line,SKU,Quantity,Cut-off,Priority,Customer reference"];
  for (let i = 0; i < LINES; i++) {
    const order = Math.floor(i / 4);
    rows.push(
      `BENCH-${String(order).padStart(6, "0")},${(i % 4) + 1},${skus[(i * 7919) % skus.length]},${1 + (i % 5)},2026-12-07 ${["10:00", "12:00", "14:30", "16:30"][order % 4]},${1 + (order % 3)},Bench customer ${order % 50}`,
    );
  }
  const bytes = new TextEncoder().encode(rows.join("\n") + "\n");
  const request = {
    kind: "orders" as const,
    bytes,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    filename: "bench.csv",
    layoutVersionId: version.id,
    mapping: undefined,
  };
  const t0 = performance.now();
  const analysis = await analyseImport(site.id, request);
  const t1 = performance.now();
  if (analysis.problems.length)
    throw new Error(`bench sheet has problems: ${JSON.stringify(analysis.problems.slice(0, 3))}`);
  const result = await commitImport(site.id, user.id, request, analysis);
  const t2 = performance.now();
  const ms = (a: number, b: number) => `${(b - a).toFixed(0)} ms`;
  console.log("| order sheet import | time | notes |");
  console.log("|---|---|---|");
  console.log(
    `| read + check ${LINES.toLocaleString("en")} lines (${(bytes.length / 1024).toFixed(0)} KiB CSV) | ${ms(t0, t1)} | sandboxed sheet worker, every row against item master and layout version |`,
  );
  console.log(
    `| write in one transaction | ${ms(t1, t2)} | ${JSON.stringify("counts" in result ? result.counts : result)} |`,
  );
  console.log(`| total | ${ms(t0, t2)} | |`);
}

main()
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
