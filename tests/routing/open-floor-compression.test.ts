import { describe, expect, it } from "vitest";
import {
  accessDistance,
  accessRoute,
  buildGraph,
  canStep,
  emptyDrawing,
  floydWarshall,
  mulberry32,
  nodeAccessPoint,
  UNREACHABLE,
  type AccessPoint,
  type CompactGraph,
  type GridDrawing,
  type Side,
} from "../../lib/routing";
import { routeCells } from "../../lib/layout-versions/route-cells";
import { dijkstraLengths, rawGridGraph } from "./helpers/raw-grid";

/**
 * A random floor with what makes compression hard: open halls several cells wide, blocked islands,
 * rack runs whose bins face the halls, one-way aisles and stray one-way marks inside the halls.
 */
function randomFloor(seed: number): GridDrawing {
  const rand = mulberry32(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));
  const w = int(8, 22);
  const h = int(8, 22);
  const d = emptyDrawing(w, h, [500, 900, 1200][seed % 3]!);
  const rect = (x0: number, y0: number, rw: number, rh: number, f: (c: number) => void) => {
    for (let y = y0; y < Math.min(h, y0 + rh); y++) for (let x = x0; x < Math.min(w, x0 + rw); x++) f(y * w + x);
  };
  for (let k = int(0, 3); k > 0; k--)
    rect(int(0, w - 2), int(0, h - 2), int(1, 4), int(1, 4), (c) => (d.cells[c] = "blocked"));
  for (let k = int(1, 4); k > 0; k--) {
    const vertical = rand() < 0.5;
    const len = int(2, 7);
    const x0 = int(0, w - 1);
    const y0 = int(0, h - 1);
    const facing: Side = vertical ? (rand() < 0.5 ? "E" : "W") : rand() < 0.5 ? "N" : "S";
    rect(x0, y0, vertical ? 1 : len, vertical ? len : 1, (c) => {
      d.cells[c] = "rack";
      d.facing[c] = facing;
    });
  }
  // One-way aisles: a column or row segment all marked the same way.
  for (let k = int(0, 2); k > 0; k--) {
    const vertical = rand() < 0.5;
    const dir: Side = vertical ? (rand() < 0.5 ? "N" : "S") : rand() < 0.5 ? "E" : "W";
    const len = int(3, 10);
    rect(
      int(0, w - 1),
      int(0, h - 1),
      vertical ? 1 : len,
      vertical ? len : 1,
      (c) => (d.oneWay[c] = d.cells[c] === "floor" ? dir : null),
    );
  }
  for (let c = 0; c < w * h; c++)
    if (d.cells[c] === "floor" && d.oneWay[c] == null && rand() < 0.015)
      d.oneWay[c] = (["N", "E", "S", "W"] as const)[int(0, 3)]!;
  const floor = d.cells.flatMap((k, c) => (k === "floor" ? [c] : []));
  const pick = () => {
    const c = floor[int(0, floor.length - 1)] ?? 0;
    return { x: c % w, y: Math.floor(c / w) };
  };
  d.depots = [{ id: "D1", ...pick() }];
  d.dropoffs = [{ id: "P1", ...pick() }];
  d.bins = d.cells.flatMap((k, c) =>
    k === "rack" ? [{ code: `B${c}`, aisle: 1, bay: c, level: 1, x: c % w, y: Math.floor(c / w) }] : [],
  );
  return d;
}

function pointsOf(graph: CompactGraph): AccessPoint[] {
  return [
    ...graph.depots.map((p) => nodeAccessPoint(graph, p.node)),
    ...graph.dropoffs.map((p) => nodeAccessPoint(graph, p.node)),
    ...graph.accessPoints,
  ];
}
const cellOf = (w: number, p: AccessPoint) => p.y * w + p.x;

/** The walk a route draws: neighbouring cells, each step allowed by the one-way rule, as long as the route says. */
function expectWalkable(d: GridDrawing, cells: number[], lengthMm: number, from: number, to: number) {
  expect(cells[0] ?? from).toBe(from);
  expect(cells.at(-1) ?? to).toBe(to);
  for (let i = 0; i + 1 < cells.length; i++) {
    const a = cells[i]!;
    const b = cells[i + 1]!;
    const [x, y, bx, by] = [a % d.width, Math.floor(a / d.width), b % d.width, Math.floor(b / d.width)];
    const dir: Side | undefined =
      bx === x + 1 && by === y
        ? "E"
        : bx === x - 1 && by === y
          ? "W"
          : by === y + 1 && bx === x
            ? "S"
            : by === y - 1 && bx === x
              ? "N"
              : undefined;
    expect(dir, `cells ${a} and ${b} are neighbours`).toBeDefined();
    expect(canStep(d, x, y, dir!)).toBe(true);
  }
  expect(Math.max(0, cells.length - 1) * d.cellMm).toBe(lengthMm);
}

// Outside check: Dijkstra from graphology-shortest-path on the raw cell grid (tests/routing/helpers/raw-grid.ts).
describe("open floor compression", () => {
  it.each(Array.from({ length: 40 }, (_, i) => i + 1))(
    "random floor %i: distances between depots, drop-offs and access points equal the uncompressed graph and raw-grid Dijkstra",
    (seed) => {
      const d = randomFloor(seed);
      const graph = buildGraph(d);
      const full = buildGraph(d, { compress: false });
      expect(graph.nodes.length).toBeLessThanOrEqual(full.nodes.length);
      const dm = floydWarshall(graph);
      const dmFull = floydWarshall(full);
      const raw = rawGridGraph(d);
      const points = pointsOf(graph);
      const fullAt = new Map(pointsOf(full).map((p) => [cellOf(d.width, p), p]));
      const byNumber = (a: number, b: number) => a - b;
      expect([...new Set(points.map((p) => cellOf(d.width, p)))].sort(byNumber)).toEqual(
        [...fullAt.keys()].sort(byNumber),
      );
      expect(graph.bins.map((b) => b.code)).toEqual(full.bins.map((b) => b.code));
      let finite = 0;
      for (const p of points) {
        const lengths = dijkstraLengths(raw, String(cellOf(d.width, p)));
        for (const q of points) {
          const expected = lengths.get(String(cellOf(d.width, q))) ?? UNREACHABLE;
          const got = accessDistance(graph, dm, p, q);
          expect(got).toBe(expected);
          expect(accessDistance(full, dmFull, fullAt.get(cellOf(d.width, p))!, fullAt.get(cellOf(d.width, q))!)).toBe(
            expected,
          );
          const route = accessRoute(graph, dm, p, q);
          if (expected === UNREACHABLE) {
            expect(route).toBeNull();
            continue;
          }
          finite++;
          expectWalkable(d, routeCells(graph, route!), expected, cellOf(d.width, p), cellOf(d.width, q));
        }
      }
      expect(finite).toBeGreaterThan(0);
    },
  );

  it.each(Array.from({ length: 40 }, (_, i) => i + 1))(
    "random floor %i: every compressed edge is a straight run of floor cells, and no cell lies inside two edges",
    (seed) => {
      const d = randomFloor(seed);
      const graph = buildGraph(d);
      const inside = new Set<number>();
      const nodeCells = new Set(graph.nodes.map((n) => n.y * d.width + n.x));
      for (const e of graph.edges) {
        expect(e.lengthMm).toBe((e.cells.length - 1) * d.cellMm);
        const step = e.cells[1]! - e.cells[0]!;
        expect([1, -1, d.width, -d.width]).toContain(step);
        e.cells.forEach((c, i) => {
          expect(d.cells[c]).toBe("floor");
          if (i > 0) expect(c - e.cells[i - 1]!).toBe(step);
          if (i === 0 || i === e.cells.length - 1) return expect(nodeCells.has(c)).toBe(true);
          expect(nodeCells.has(c) || inside.has(c)).toBe(false);
          inside.add(c);
        });
      }
    },
  );

  it("an open hall several cells wide does not become one junction per cell", () => {
    // 60 × 40 cells, all floor: a depot and a drop-off at the front, two rack runs facing the hall.
    const d = emptyDrawing(60, 40, 1000);
    for (const [x0, y, facing] of [
      [10, 10, "S"],
      [10, 30, "N"],
    ] as const) {
      for (let x = x0; x < x0 + 40; x++) {
        d.cells[y * 60 + x] = "rack";
        d.facing[y * 60 + x] = facing;
        d.bins.push({ code: `R${y}-${x}`, aisle: 1, bay: x, level: 1, x, y });
      }
    }
    d.depots = [{ id: "D1", x: 0, y: 39 }];
    d.dropoffs = [{ id: "P1", x: 59, y: 39 }];
    const full = buildGraph(d, { compress: false });
    const graph = buildGraph(d);
    expect(full.nodes.length).toBeGreaterThan(2000);
    // Left are the lines that matter: the rows along the runs' faces and ends and through the depot and
    // drop-off, and the columns of the access cells, the runs' ends and the hall's edges.
    expect(graph.nodes.length).toBeLessThan(full.nodes.length / 5);
    expect(graph.accessPoints).toHaveLength(80);
  });
});
