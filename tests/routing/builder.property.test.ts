import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  accessDistance,
  buildGraph,
  emptyDrawing,
  floydWarshall,
  nodeAccessPoint,
  UNREACHABLE,
  type CellKind,
  type CompactGraph,
  type GridDrawing,
  type Side,
} from "../../lib/routing";
import { dijkstraLengths, rawGridGraph } from "./helpers/raw-grid";

const SIDE = fc.constantFrom<Side>("N", "E", "S", "W");
const MAX = 64;

/** Small random drawings: mostly floor, some racks (one bin per rack cell) and blocked cells, scattered one-way marks. */
const drawingArb = fc
  .record({
    w: fc.integer({ min: 2, max: 8 }),
    h: fc.integer({ min: 2, max: 8 }),
    kinds: fc.array(fc.constantFrom<CellKind>("floor", "floor", "floor", "rack", "blocked"), {
      minLength: MAX,
      maxLength: MAX,
    }),
    facing: fc.array(SIDE, { minLength: MAX, maxLength: MAX }),
    marks: fc.array(fc.option(SIDE, { freq: 3 }), { minLength: MAX, maxLength: MAX }),
    depot: fc.nat(),
    dropoff: fc.nat(),
  })
  .map(({ w, h, kinds, facing, marks, depot, dropoff }): GridDrawing => {
    const d = emptyDrawing(w, h, 900);
    for (let c = 0; c < w * h; c++) {
      d.cells[c] = kinds[c]!;
      d.facing[c] = d.cells[c] === "rack" ? facing[c]! : null;
      d.oneWay[c] = d.cells[c] === "floor" ? (marks[c] ?? null) : null;
    }
    d.cells[0] = "floor";
    const floor = d.cells.flatMap((k, c) => (k === "floor" ? [c] : []));
    const at = (k: number) => {
      const c = floor[k % floor.length]!;
      return { x: c % w, y: Math.floor(c / w) };
    };
    d.depots = [{ id: "D1", ...at(depot) }];
    d.dropoffs = [{ id: "P1", ...at(dropoff) }];
    d.bins = d.cells.flatMap((k, c) =>
      k === "rack" ? [{ code: `R${c}`, aisle: 1, bay: c, level: 1, x: c % w, y: Math.floor(c / w) }] : [],
    );
    return d;
  });

function depotDistances(graph: CompactGraph): Map<number, number> {
  const dm = floydWarshall(graph);
  const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
  return new Map(graph.accessPoints.map((ap) => [ap.y * graph.width + ap.x, accessDistance(graph, dm, depot, ap)]));
}

describe("grid → graph builder properties", () => {
  it("every bin whose access cell the raw grid reaches from the depot has that same finite distance; others are UNREACHABLE", () => {
    fc.assert(
      fc.property(drawingArb, (d) => {
        const graph = buildGraph(d);
        const raw = dijkstraLengths(rawGridGraph(d), String(d.depots[0]!.y * d.width + d.depots[0]!.x));
        for (const [cell, dist] of depotDistances(graph)) expect(dist).toBe(raw.get(String(cell)) ?? UNREACHABLE);
        // And back: from each access point to the depot (leaving a one-way edge only forwards).
        const dm = floydWarshall(graph);
        const depot = nodeAccessPoint(graph, graph.depots[0]!.node);
        const depotCell = String(d.depots[0]!.y * d.width + d.depots[0]!.x);
        for (const ap of graph.accessPoints) {
          const back = dijkstraLengths(rawGridGraph(d), String(ap.y * d.width + ap.x)).get(depotCell) ?? UNREACHABLE;
          expect(accessDistance(graph, dm, ap, depot)).toBe(back);
        }
      }),
      { numRuns: 300, seed: 20261 },
    );
  });

  it("removing a one-way mark never lengthens any distance", () => {
    fc.assert(
      fc.property(drawingArb, fc.nat(), (d, pick) => {
        const marked = d.oneWay.flatMap((m, c) => (m ? [c] : []));
        fc.pre(marked.length > 0);
        const before = depotDistances(buildGraph(d));
        const freed = { ...d, oneWay: d.oneWay.slice() };
        freed.oneWay[marked[pick % marked.length]!] = null;
        const after = depotDistances(buildGraph(freed));
        for (const [cell, dist] of before) expect(after.get(cell)!).toBeLessThanOrEqual(dist);
      }),
      { numRuns: 300, seed: 20262 },
    );
  });

  it("is deterministic: the same drawing gives an identical graph", () => {
    fc.assert(
      fc.property(drawingArb, (d) => {
        expect(buildGraph(structuredClone(d))).toEqual(buildGraph(d));
      }),
      { numRuns: 100, seed: 20263 },
    );
  });

  it("keeps nodes to junctions: every floor cell is a node or inside exactly one edge, and plain corridor cells are never nodes", () => {
    fc.assert(
      fc.property(drawingArb, (d) => {
        // Uncompressed: with compression, open floor between the kept rows and columns is in no edge at all.
        const graph = buildGraph(d, { compress: false });
        for (const e of graph.edges) expect(e.lengthMm).toBe((e.cells.length - 1) * d.cellMm);
        const used = new Set<number>(graph.nodes.map((n) => n.y * d.width + n.x));
        for (const e of graph.edges) {
          for (const c of e.cells.slice(1, -1)) {
            expect(used.has(c)).toBe(false);
            used.add(c);
          }
        }
        const floor = d.cells.flatMap((k, c) => (k === "floor" ? [c] : []));
        expect([...used].sort((a, b) => a - b)).toEqual(floor);
        const isFloor = (x: number, y: number) =>
          x >= 0 && y >= 0 && x < d.width && y < d.height && d.cells[y * d.width + x] === "floor";
        for (const n of graph.nodes) {
          if (n.kind !== "junction") continue;
          const ns = isFloor(n.x, n.y - 1),
            s = isFloor(n.x, n.y + 1),
            e = isFloor(n.x + 1, n.y),
            w = isFloor(n.x - 1, n.y);
          const unmarked = [
            [0, 0],
            [0, -1],
            [0, 1],
            [1, 0],
            [-1, 0],
          ].every(([dx, dy]) => d.oneWay[(n.y + dy!) * d.width + n.x + dx!] == null || !isFloor(n.x + dx!, n.y + dy!));
          const straight = (ns && s && !e && !w) || (e && w && !ns && !s);
          expect(straight && unmarked).toBe(false);
        }
      }),
      { numRuns: 200, seed: 20264 },
    );
  });
});
