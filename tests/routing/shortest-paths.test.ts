import { describe, expect, it } from "vitest";
import {
  accessDistance,
  accessRoute,
  buildGraph,
  floydWarshall,
  nodeAccessPoint,
  UNREACHABLE,
} from "../../lib/routing";
import { obstructedWarehouse } from "./helpers/layouts";
import { compactGraphology, dijkstraLengths, rawGridGraph } from "./helpers/raw-grid";

// Outside check: Dijkstra from graphology-shortest-path (npm), lengths as summed edge weights.
describe("Floyd–Warshall against Dijkstra", () => {
  it.each([1, 2, 3, 4, 5, 6])("compact graph of obstructed layout %i", (seed) => {
    const graph = buildGraph(obstructedWarehouse(seed));
    const dm = floydWarshall(graph);
    const g = compactGraphology(graph);
    for (const u of graph.nodes) {
      const lengths = dijkstraLengths(g, String(u.id));
      for (const v of graph.nodes) {
        expect(dm.dist[u.id * dm.n + v.id]).toBe(lengths.get(String(v.id)) ?? UNREACHABLE);
      }
    }
  });

  it.each([1, 2, 3, 4, 5, 6])("access-point distances equal raw cell-grid Dijkstra, layout %i", (seed) => {
    const drawing = obstructedWarehouse(seed);
    const graph = buildGraph(drawing);
    const dm = floydWarshall(graph);
    const raw = rawGridGraph(drawing);
    const points = [...graph.depots.map((p) => nodeAccessPoint(graph, p.node)), ...graph.accessPoints];
    let finite = 0;
    for (const p of points.filter((_, i) => i % 4 === 0)) {
      const lengths = dijkstraLengths(raw, String(p.y * drawing.width + p.x));
      for (const q of points) {
        const expected = lengths.get(String(q.y * drawing.width + q.x)) ?? UNREACHABLE;
        expect(accessDistance(graph, dm, p, q)).toBe(expected);
        const route = accessRoute(graph, dm, p, q);
        if (expected === UNREACHABLE) {
          expect(route).toBeNull();
        } else {
          finite++;
          const walked = route!.segments.reduce((t, s) => t + Math.abs(s.toMm - s.fromMm), 0);
          expect(walked).toBe(expected);
          for (const s of route!.segments) {
            if (graph.edges[s.edge]!.oneWay) expect(s.toMm).toBeGreaterThanOrEqual(s.fromMm);
          }
        }
      }
    }
    expect(finite).toBeGreaterThan(0);
  });

  it("reports progress from 0 to 1", () => {
    const graph = buildGraph(obstructedWarehouse(3));
    const seen: number[] = [];
    floydWarshall(graph, (f) => seen.push(f));
    expect(seen.length).toBeGreaterThan(1);
    expect(seen.at(-1)).toBe(1);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
  });
});
