/**
 * One layer of sweep states: the cheapest cost per front state, keyed by two 30-bit halves of the
 * encoded front, with the back-pointer (state index in the previous layer) and the edge use taken.
 * Open addressing on typed arrays: a Map with float keys was the hot spot.
 */
export class StateLayer {
  size = 0;
  lo: Int32Array;
  hi: Int32Array;
  cost: Float64Array;
  parent: Int32Array;
  use: Uint8Array;
  private slots: Int32Array;

  constructor(atLeast = 64) {
    // A power of two, so the slot mask works.
    const capacity = 2 ** Math.ceil(Math.log2(Math.max(2, atLeast)));
    this.lo = new Int32Array(capacity);
    this.hi = new Int32Array(capacity);
    this.cost = new Float64Array(capacity);
    this.parent = new Int32Array(capacity);
    this.use = new Uint8Array(capacity);
    this.slots = new Int32Array(capacity * 2).fill(-1);
  }

  offer(lo: number, hi: number, cost: number, parent: number, use: number): void {
    const mask = this.slots.length - 1;
    let h = Math.imul(lo ^ Math.imul(hi, 0x9e3779b1), 0x85ebca6b);
    h ^= h >>> 15;
    let slot = h & mask;
    while (true) {
      const at = this.slots[slot] as number;
      if (at < 0) break;
      if (this.lo[at] === lo && this.hi[at] === hi) {
        if (cost < (this.cost[at] as number)) {
          this.cost[at] = cost;
          this.parent[at] = parent;
          this.use[at] = use;
        }
        return;
      }
      slot = (slot + 1) & mask;
    }
    if (this.size === this.lo.length) {
      this.grow();
      this.offer(lo, hi, cost, parent, use);
      return;
    }
    const at = this.size++;
    this.slots[slot] = at;
    this.lo[at] = lo;
    this.hi[at] = hi;
    this.cost[at] = cost;
    this.parent[at] = parent;
    this.use[at] = use;
  }

  private grow(): void {
    const cap = this.lo.length * 2;
    const copy = <T extends Int32Array | Float64Array | Uint8Array>(a: T, make: new (n: number) => T): T => {
      const b = new make(cap);
      b.set(a);
      return b;
    };
    this.lo = copy(this.lo, Int32Array);
    this.hi = copy(this.hi, Int32Array);
    this.cost = copy(this.cost, Float64Array);
    this.parent = copy(this.parent, Int32Array);
    this.use = copy(this.use, Uint8Array);
    this.slots = new Int32Array(cap * 2).fill(-1);
    const mask = this.slots.length - 1;
    for (let at = 0; at < this.size; at++) {
      let h = Math.imul((this.lo[at] as number) ^ Math.imul(this.hi[at] as number, 0x9e3779b1), 0x85ebca6b);
      h ^= h >>> 15;
      let slot = h & mask;
      while ((this.slots[slot] as number) >= 0) slot = (slot + 1) & mask;
      this.slots[slot] = at;
    }
  }
}
