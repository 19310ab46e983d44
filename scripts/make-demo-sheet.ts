// Writes the demo order sheet a planner can import to try Trailbin: Saturday's invented orders for
// the invented Fennick Supply Co., in the order lines template's columns.
//   npx tsx scripts/make-demo-sheet.ts
import { writeFileSync } from "node:fs";
import { bramblegateDocument } from "../db/seeds/demo/floor-plan";
import { demoItems, demoOrders } from "../db/seeds/demo/orders";

const items = demoItems(bramblegateDocument());
const orders = demoOrders(items, { days: 1, perDay: 40, seed: 28, startDate: "2026-11-28" });
// Bramblegate keeps Europe/London time, which is UTC in November: the UTC clock time is the local one.
const local = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") : "");
const quote = (s: string) => (/[",]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
const rows = [["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority", "Customer reference"]];
for (const o of orders)
  o.lines.forEach((l, i) =>
    rows.push([
      o.orderNumber,
      String(i + 1),
      l.sku,
      String(l.quantity),
      local(o.cutoffAt),
      String(o.priority),
      `${o.customer} / ${o.customerRef}`,
    ]),
  );
writeFileSync(
  "public/demo/bramblegate-orders-2026-11-28.csv",
  rows.map((r) => r.map(quote).join(",")).join("\r\n") + "\r\n",
);
console.log(`${orders.length} orders, ${rows.length - 1} lines`);
