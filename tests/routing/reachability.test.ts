import { describe, expect, it } from "vitest";
import { emptyDrawing, mulberry32, reachableFrom, reachingTo, type GridDrawing, type Side } from "../../lib/routing";
import { dijkstraLengths, rawGridGraph } from "./helpers/raw-grid";

/** A small random floor: blocked cells, racks and one-way marks scattered at random. */
function randomFloor(seed: number): GridDrawing {
  const rand = mulberry32(seed);
  const w = 4 + Math.floor(rand() * 9);
  const h = 4 + Math.floor(rand() * 9);
  const d = emptyDrawing(w, h, 1000);
  const sides: Side[] = ["N", "E", "S", "W"];
  for (let c = 0; c < w * h; c++) {
    const r = rand();
    if (r < 0.15) d.cells[c] = "blocked";
    else if (r < 0.2) d.cells[c] = "rack";
    else if (r < 0.45) d.oneWay[c] = sides[Math.floor(rand() * 4)]!;
  }
  return d;
}

const floorCells = (d: GridDrawing) => d.cells.flatMap((k, c) => (k === "floor" ? [c] : []));
const cellsOf = (seen: Uint8Array) => [...seen].flatMap((v, c) => (v ? [c] : []));

// The outside source: graphology's Dijkstra on the raw grid graph built from the documented cell rule
// (tests/routing/helpers/raw-grid.ts), independent of lib/routing's step rule and search.
describe("reachableFrom and reachingTo, against graphology on the raw grid", () => {
  for (let seed = 1; seed <= 40; seed++) {
    it(`seed ${seed}`, () => {
      const d = randomFloor(seed);
      const g = rawGridGraph(d);
      const floor = floorCells(d);
      const reaches = new Map(floor.map((c) => [c, dijkstraLengths(g, String(c))]));
      for (const s of floor.slice(0, 6)) {
        const from = [...reaches.get(s)!.keys()].map(Number).sort((a, b) => a - b);
        expect(cellsOf(reachableFrom(d, [s]))).toEqual(from);
        const to = floor.filter((c) => reaches.get(c)!.has(String(s)));
        expect(cellsOf(reachingTo(d, [s]))).toEqual(to);
      }
    });
  }

  it("starts only from floor cells, and from all of them at once", () => {
    const d = randomFloor(7);
    const floor = floorCells(d);
    const notFloor = d.cells.findIndex((k) => k !== "floor");
    expect(cellsOf(reachableFrom(d, [notFloor, -1, d.width * d.height]))).toEqual([]);
    const union = new Set([...cellsOf(reachableFrom(d, [floor[0]!])), ...cellsOf(reachableFrom(d, [floor[1]!]))]);
    expect(cellsOf(reachableFrom(d, [floor[0]!, floor[1]!]))).toEqual([...union].sort((a, b) => a - b));
  });
});
