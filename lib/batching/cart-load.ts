import type { PreparedOrder } from "./prepare";
import type { CartLimits } from "./types";
import { InsertionRoute, type WalkCosts } from "./walk-costs";

/** A batch being filled: its orders, running totals and a cheap estimate of its walk. */
export class CartLoad {
  readonly orders: PreparedOrder[] = [];
  lineCount = 0;
  weightG = 0;
  readonly route: InsertionRoute;

  constructor(
    costs: WalkCosts,
    private readonly limits: CartLimits,
  ) {
    this.route = new InsertionRoute(costs);
  }

  /** Within every cart limit if this order were added (the walk is checked separately). */
  fits(o: PreparedOrder): boolean {
    return (
      this.orders.length < this.limits.totesPerCart &&
      this.lineCount + o.lineCount <= this.limits.maxLines &&
      this.weightG + o.weightG <= this.limits.maxWeightG
    );
  }

  get full(): boolean {
    return this.orders.length >= this.limits.totesPerCart;
  }

  add(o: PreparedOrder): void {
    this.orders.push(o);
    this.lineCount += o.lineCount;
    this.weightG += o.weightG;
    this.route.add(o.points);
  }
}
