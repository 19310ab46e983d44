import { documentBins } from "@/lib/floor-plan/bin-codes";
import type { EditorDocument } from "@/lib/floor-plan/document";
import { mulberry32, randomInt } from "@/lib/routing/random";
import { fennickCatalogue, type CatalogueItem } from "./catalogue";
import type { WaveOrder } from "../../../lib/batching/types";

/*
 * Invented demo data for the invented Fennick Supply Co. (see docs/design.md): an item master slotted into
 * the demo floor plan and a week of trade orders. Seeded, so the same seed gives the same data.
 */

export type DemoItem = CatalogueItem & { binCode: string };

export type DemoOrder = WaveOrder & {
  /** Invented trade customer. */
  customer: string;
  /** The customer's own purchase order reference. */
  customerRef: string;
};

export type DemoOrderOptions = {
  days?: number;
  perDay?: number;
  seed?: number;
  /** First day, YYYY-MM-DD; the default is a Monday. Days run on consecutively. */
  startDate?: string;
};

/** Heavier items go low so nobody lifts them from above shoulder height. */
function maxLevelFor(unitWeightG: number): number {
  if (unitWeightG >= 2000) return 1;
  if (unitWeightG >= 800) return 2;
  return Infinity;
}

function shuffled<T>(xs: readonly T[], rand: () => number): T[] {
  const out = [...xs];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [out[i], out[j]] = [out[j] as T, out[i] as T];
  }
  return out;
}

/** The item master: every catalogue SKU with one pick bin of the document, one SKU per bin. */
export function demoItems(doc: EditorDocument, seed = 7): DemoItem[] {
  const rand = mulberry32(seed);
  const free = shuffled(documentBins(doc), rand);
  const used = new Set<string>();
  return fennickCatalogue().map((it) => {
    const maxLevel = maxLevelFor(it.unitWeightG);
    const bin = free.find((b) => !used.has(b.code) && b.level <= maxLevel) ?? free.find((b) => !used.has(b.code));
    if (!bin) throw new RangeError(`the floor plan has fewer bins than the ${fennickCatalogue().length} demo SKUs`);
    used.add(bin.code);
    return { ...it, binCode: bin.code };
  });
}

const CUSTOMERS = [
  "Thistlecombe Joinery",
  "Brackwater Plumbing & Heating",
  "Oddley and Finch Builders",
  "Quenby Roofing",
  "Larkspur Fabrication",
  "Hobbcroft Electrical",
  "Wrenfield Kitchens",
  "Saltmarsh Fencing",
  "Pellow Groundworks",
  "Ashgrove Property Maintenance",
  "Corrin & Vale Shopfitters",
  "Millbeck Farm Supplies",
  "Tanseley Marine Services",
  "Hatherby School Estates",
  "Kestle Lane Hardware",
  "Dunmore Scaffold Hire",
];

/** Carrier collection times (UTC) an order must be packed by. */
const CUTOFFS = ["10:00", "12:00", "14:30", "16:30"];
/** Share of orders with 1..8 lines: most trade orders are small. */
const LINE_WEIGHTS = [30, 20, 15, 10, 8, 7, 5, 5];

function pick<T>(xs: readonly T[], weights: readonly number[], rand: () => number): T {
  const total = weights.reduce((s, w) => s + w, 0);
  let r = rand() * total;
  for (let i = 0; i < xs.length; i++) {
    r -= weights[i] as number;
    if (r < 0) return xs[i] as T;
  }
  return xs[xs.length - 1] as T;
}

function quantity(it: DemoItem, rand: () => number): number {
  switch (it.unitOfMeasure) {
    case "M":
      return randomInt(rand, 2, 25);
    case "BOX":
      return randomInt(rand, 1, 4);
    case "PK":
      return randomInt(rand, 1, 6);
    case "EA":
      return it.unitWeightG >= 2000 ? 1 : randomInt(rand, 1, 3);
  }
}

function addDays(ymd: string, days: number): Date {
  const d = new Date(`${ymd}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) throw new RangeError(`startDate ${ymd} is not YYYY-MM-DD`);
  return new Date(d.getTime() + days * 86_400_000);
}

/** A week (by default) of invented orders numbered FS-YYMMDD-NNNN, NNNN counting from 1 each day. */
export function demoOrders(items: readonly DemoItem[], options: DemoOrderOptions = {}): DemoOrder[] {
  const { days = 5, perDay = 60, seed = 1, startDate = "2026-11-23" } = options;
  if (items.length === 0) throw new RangeError("no items to order");
  const rand = mulberry32(seed);
  // A few SKUs sell far more than the rest (weight 1/rank), as in most item masters.
  const popularity = shuffled(items, rand).map((it, i) => ({ it, w: 1 / (i + 1) }));
  const orders: DemoOrder[] = [];
  let lineId = 1;
  for (let day = 0; day < days; day++) {
    const date = addDays(startDate, day);
    const ymd = date.toISOString().slice(0, 10);
    const stamp = ymd.slice(2).replaceAll("-", "");
    for (let k = 1; k <= perDay; k++) {
      const nLines = Math.min(items.length, pick([1, 2, 3, 4, 5, 6, 7, 8], LINE_WEIGHTS, rand));
      const chosen = new Set<DemoItem>();
      while (chosen.size < nLines)
        chosen.add(
          pick(
            popularity.map((p) => p.it),
            popularity.map((p) => p.w),
            rand,
          ),
        );
      // About one order in twelve is collected at the trade counter and has no carrier cut-off.
      const cutoff = rand() < 1 / 12 ? null : `${ymd}T${pick(CUTOFFS, [3, 3, 2, 2], rand)}:00.000Z`;
      const customer = CUSTOMERS[Math.floor(rand() * CUSTOMERS.length)] as string;
      orders.push({
        orderId: orders.length + 1,
        orderNumber: `FS-${stamp}-${String(k).padStart(4, "0")}`,
        cutoffAt: cutoff,
        priority: pick([1, 2, 3], [15, 35, 50], rand),
        customer,
        customerRef: `PO ${randomInt(rand, 10_000, 99_999)}`,
        lines: [...chosen].map((it) => ({
          lineId: lineId++,
          sku: it.sku,
          binCode: it.binCode,
          quantity: quantity(it, rand),
          unitWeightG: it.unitWeightG,
        })),
      });
    }
  }
  return orders;
}

/** A cart for the demo (invented figures): six totes, 30 lines, 150 kg. */
export const DEMO_CART_LIMITS = { totesPerCart: 6, maxLines: 30, maxWeightG: 150_000 } as const;
