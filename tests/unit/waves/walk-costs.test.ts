import { beforeAll, describe, expect, it } from "vitest";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { accessDistance } from "@/lib/routing/access";
import { nodeAccessPoint, type AccessPoint } from "@/lib/routing/graph";
import { InsertionRoute, WalkCosts } from "@/lib/batching/walk-costs";
import { demoLayout } from "./fixture";

let layout: BuiltLayout;
beforeAll(async () => {
  ({ layout } = await demoLayout());
});

function costs(): { wc: WalkCosts; start: number; end: number } {
  const start = layout.graph.depots[0]?.node as number;
  const end = layout.graph.dropoffs[0]?.node as number;
  return { wc: new WalkCosts(layout.graph, layout.matrix, start, end), start, end };
}

describe("WalkCosts and InsertionRoute", () => {
  it("reads the engine's access-point distances, also for points registered after the first read", () => {
    const { wc, start } = costs();
    const g = layout.graph;
    const a = wc.pointOf(10);
    expect(wc.cost(a, WalkCosts.START)).toBe(
      accessDistance(g, layout.matrix, g.accessPoints[10] as AccessPoint, nodeAccessPoint(g, start)),
    );
    const b = wc.pointOf(150);
    expect(wc.pointOf(150)).toBe(b);
    expect(wc.cost(a, b)).toBe(
      accessDistance(g, layout.matrix, g.accessPoints[10] as AccessPoint, g.accessPoints[150] as AccessPoint),
    );
    expect(wc.cost(b, a)).toBe(
      accessDistance(g, layout.matrix, g.accessPoints[150] as AccessPoint, g.accessPoints[10] as AccessPoint),
    );
  });

  it("keeps its length equal to the walk through its stops, and prices additions without making them", () => {
    const { wc } = costs();
    const pts = [3, 40, 77, 120, 160, 191].map((ap) => wc.pointOf(ap));
    const route = new InsertionRoute(wc);
    let expected = route.lengthMm;
    for (const p of pts) {
      const added = route.addedLength([p]);
      expect(route.stops).not.toContain(p);
      route.add([p]);
      expected += added;
      expect(route.lengthMm).toBe(expected);
    }
    const legs = [WalkCosts.START, ...route.stops, WalkCosts.END];
    let walk = 0;
    for (let i = 0; i + 1 < legs.length; i++) walk += wc.cost(legs[i] as number, legs[i + 1] as number);
    expect(route.lengthMm).toBe(walk);
    expect(route.addedLength(pts)).toBe(0);
  });
});
