import type { RowProblem } from "@/lib/sheets/columns";
import { parseCutoff } from "./cutoff";
import { cell, eachDataRow, firstRowOf, type ColumnMapping } from "./mapping";

export type OrderLineRecord = { row: number; lineNo: number; itemId: number; sku: string; quantity: number };
export type OrderRecord = {
  firstRow: number;
  orderNumber: string;
  customerRef: string | null;
  priority: number;
  cutoffAt: Date | null;
  lines: OrderLineRecord[];
};

/** What the database knows about the SKUs and order numbers the file names (keys upper-cased). */
export type OrderLookups = {
  timeZone: string;
  items: ReadonlyMap<string, { itemId: number; binsInVersion: number }>;
  existingOrders: ReadonlySet<string>;
};

const MAX = { orderNumber: 64, sku: 64, customerRef: 120 } as const;
const MAX_QUANTITY = 1_000_000;
const MAX_LINE = 100_000;
export const DEFAULT_PRIORITY = 2;

/** The SKUs and order numbers a file mentions, so the caller can look them all up at once. */
export function referencedKeys(
  body: readonly string[][],
  mapping: ColumnMapping,
): { skus: string[]; orderNumbers: string[] } {
  const skus = new Set<string>();
  const orderNumbers = new Set<string>();
  for (const r of body) {
    const sku = cell(r, mapping, "sku");
    const order = cell(r, mapping, "orderNumber");
    if (sku && sku.length <= MAX.sku) skus.add(sku);
    if (order && order.length <= MAX.orderNumber) orderNumbers.add(order);
  }
  return { skus: [...skus], orderNumbers: [...orderNumbers] };
}

const wholeNumber = (t: string, max: number) =>
  /^\d+$/.test(t) && Number(t) >= 1 && Number(t) <= max ? Number(t) : null;

/**
 * Order-line rows (sheet row 2 onwards) → orders with their lines. Every bad row is reported with its
 * sheet row number; the caller writes nothing unless `problems` is empty.
 */
export function validateOrderRows(
  body: readonly string[][],
  mapping: ColumnMapping,
  look: OrderLookups,
): { orders: OrderRecord[]; problems: RowProblem[]; lineCount: number } {
  const orders = new Map<string, OrderRecord>();
  const problems: RowProblem[] = [];
  const lineRows = new Map<string, number>();
  let lineCount = 0;
  eachDataRow(body, (r, row) => {
    const messages: string[] = [];
    const orderNumber = cell(r, mapping, "orderNumber");
    const lineText = cell(r, mapping, "lineNo");
    const sku = cell(r, mapping, "sku");
    const qtyText = cell(r, mapping, "quantity");
    const cutoffText = cell(r, mapping, "cutoff");
    const priorityText = cell(r, mapping, "priority");
    const customerRef = cell(r, mapping, "customerRef") || null;

    if (!orderNumber) messages.push("The order number is empty.");
    else if (orderNumber.length > MAX.orderNumber)
      messages.push(`Order number “${orderNumber.slice(0, 20)}…” is longer than ${MAX.orderNumber} characters.`);
    else if (look.existingOrders.has(orderNumber.toUpperCase()))
      messages.push(`Order ${orderNumber} already exists (imported from another file). Give new orders new numbers.`);

    const lineNo = lineText ? wholeNumber(lineText, MAX_LINE) : null;
    if (!lineText) messages.push("The line number is empty.");
    else if (lineNo === null)
      messages.push(`Line “${lineText}” is not a whole number from 1 to ${MAX_LINE.toLocaleString("en")}.`);

    let item: { itemId: number; binsInVersion: number } | undefined;
    if (!sku) messages.push("The SKU is empty.");
    else if (!(item = look.items.get(sku.toUpperCase())))
      messages.push(`SKU ${sku.slice(0, MAX.sku)} is not in the item master. Import it with the item master first.`);
    else if (item.binsInVersion === 0)
      messages.push(`SKU ${sku} has no pick bin in the chosen layout version. Give it a bin in the item master.`);

    const quantity = qtyText ? wholeNumber(qtyText, MAX_QUANTITY) : null;
    if (!qtyText) messages.push("The quantity is empty.");
    else if (quantity === null)
      messages.push(`Quantity “${qtyText}” is not a whole number from 1 to ${MAX_QUANTITY.toLocaleString("en")}.`);

    let cutoffAt: Date | null = null;
    if (cutoffText) {
      const c = parseCutoff(cutoffText, look.timeZone);
      if (c.ok) cutoffAt = c.utc;
      else messages.push(c.message);
    }

    let priority = DEFAULT_PRIORITY;
    if (priorityText) {
      if (/^[123]$/.test(priorityText)) priority = Number(priorityText);
      else messages.push(`Priority “${priorityText}” is not 1, 2 or 3 (1 is most urgent; leave it empty for 2).`);
    }
    if (customerRef && customerRef.length > MAX.customerRef)
      messages.push(`The customer reference is longer than ${MAX.customerRef} characters.`);

    const key = orderNumber.toUpperCase();
    const order = orderNumber ? orders.get(key) : undefined;
    if (order && messages.length === 0) {
      // One order has one cut-off, priority and customer: its rows must say the same.
      const at = `row ${order.firstRow} of the same order`;
      if ((order.cutoffAt?.getTime() ?? null) !== (cutoffAt?.getTime() ?? null))
        messages.push(`The cut-off differs from ${at}.`);
      if (order.priority !== priority) messages.push(`The priority differs from ${at}.`);
      if (order.customerRef !== customerRef) messages.push(`The customer reference differs from ${at}.`);
    }
    if (orderNumber && lineNo !== null) {
      const first = firstRowOf(lineRows, `${key}\u0000${lineNo}`, row);
      if (first !== undefined)
        messages.push(`Order ${orderNumber} line ${lineNo} is listed twice (first on row ${first}).`);
    }

    if (messages.length) {
      problems.push({ row, message: messages.join(" ") });
      return;
    }
    const line = { row, lineNo: lineNo!, itemId: item!.itemId, sku, quantity: quantity! };
    lineCount++;
    if (order) order.lines.push(line);
    else orders.set(key, { firstRow: row, orderNumber, customerRef, priority, cutoffAt, lines: [line] });
  });
  if (lineCount === 0 && problems.length === 0)
    problems.push({ row: 2, message: "The sheet has a header row but no order lines below it." });
  return { orders: [...orders.values()], problems, lineCount };
}
