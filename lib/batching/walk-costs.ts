import { accessDistance } from "@/lib/routing/access";
import { UNREACHABLE } from "@/lib/routing/constants";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { AccessPoint, CompactGraph } from "@/lib/routing/graph";
import { nodeAccessPoint } from "@/lib/routing/graph";

/**
 * Walking distances between the depot, the drop-off and the access points a wave actually uses.
 * Point 0 is the depot, 1 the drop-off, 2.. the used access points. Rows are filled on first use:
 * the table is used² Int32s at most (1,000 used access points ≈ 4 MB), never the whole site's.
 */
export class WalkCosts {
  static readonly START = 0;
  static readonly END = 1;
  private readonly points: AccessPoint[];
  private readonly indexOfAp = new Map<number, number>();
  private readonly rows: (Int32Array | undefined)[] = [];

  constructor(
    private readonly graph: CompactGraph,
    private readonly dm: DistanceMatrix,
    startNode: number,
    endNode: number,
  ) {
    this.points = [nodeAccessPoint(graph, startNode), nodeAccessPoint(graph, endNode)];
  }

  /** Index of an access point, registered on first sight. */
  pointOf(accessPointId: number): number {
    let i = this.indexOfAp.get(accessPointId);
    if (i === undefined) {
      const ap = this.graph.accessPoints[accessPointId];
      if (!ap) throw new RangeError(`no access point ${accessPointId}`);
      i = this.points.length;
      this.points.push(ap);
      this.indexOfAp.set(accessPointId, i);
    }
    return i;
  }

  /** Shortest walk from point a to point b in mm, or Infinity when there is none. */
  cost(a: number, b: number): number {
    let row = this.rows[a];
    if (!row || row.length <= b) row = this.fillRow(a, row);
    const c = row[b] as number;
    return c >= UNREACHABLE ? Infinity : c;
  }

  /** Row a over every point registered so far, keeping what an older, shorter row already holds. */
  private fillRow(a: number, old: Int32Array | undefined): Int32Array {
    const n = this.points.length;
    const p = this.points[a];
    if (!p) throw new RangeError(`no point ${a}`);
    const row = new Int32Array(n);
    const known = old?.length ?? 0;
    if (old) row.set(old);
    for (let j = known; j < n; j++)
      row[j] = j === a ? 0 : accessDistance(this.graph, this.dm, p, this.points[j] as AccessPoint);
    this.rows[a] = row;
    return row;
  }
}

/**
 * A cheap stand-in for a batch's walk while it is being filled: stops kept in cheapest-insertion
 * order from the depot to the drop-off. Adding k stops to a route of r costs O(k·r), so trying an
 * order as a candidate is a few hundred additions rather than a Held–Karp run.
 */
export class InsertionRoute {
  readonly stops: number[] = [];
  private readonly members = new Set<number>();
  lengthMm: number;

  constructor(private readonly costs: WalkCosts) {
    this.lengthMm = costs.cost(WalkCosts.START, WalkCosts.END);
  }

  has(point: number): boolean {
    return this.members.has(point);
  }

  /** How much longer the walk gets if these points are inserted one by one (Infinity: cannot be walked). */
  addedLength(points: readonly number[]): number {
    const fresh = points.filter((p) => !this.members.has(p));
    if (fresh.length === 0) return 0;
    const stops = [...this.stops];
    let added = 0;
    for (const p of fresh) {
      const best = cheapestSlot(this.costs, stops, p);
      if (best.delta === Infinity) return Infinity;
      stops.splice(best.slot, 0, p);
      added += best.delta;
    }
    return added;
  }

  add(points: readonly number[]): void {
    for (const p of points) {
      if (this.members.has(p)) continue;
      const best = cheapestSlot(this.costs, this.stops, p);
      this.stops.splice(best.slot, 0, p);
      this.members.add(p);
      this.lengthMm += best.delta;
    }
  }
}

/** Best place to put p between consecutive points of start → stops… → end. */
function cheapestSlot(costs: WalkCosts, stops: readonly number[], p: number): { slot: number; delta: number } {
  let slot = 0;
  let delta = Infinity;
  let prev = WalkCosts.START;
  for (let i = 0; i <= stops.length; i++) {
    const next = i < stops.length ? (stops[i] as number) : WalkCosts.END;
    const d = costs.cost(prev, p) + costs.cost(p, next) - costs.cost(prev, next);
    // Infinity - Infinity is NaN: an unwalkable leg can never be a better slot.
    if (d < delta) {
      delta = d;
      slot = i;
    }
    prev = next;
  }
  return { slot, delta };
}
