import type { DrawingBin, GridDrawing } from "./drawing";
import { cellIndex, emptyDrawing } from "./drawing";
import type { CompactGraph } from "./graph";
import { mulberry32 } from "./random";

export interface WarehouseSpec {
  /** Picking aisles, each lined by a rack column on both sides. */
  aisles: number;
  /** Bay positions along each aisle (each position holds one bay per side). */
  positions: number;
  levels: number;
  /** Full-width cross aisles, at least 2 (front and back). */
  crossAisles: number;
  cellMm?: number;
  /** Alternate aisle directions (odd aisles southbound, even northbound), as some sites mark them. */
  oneWayAisles?: boolean;
}

function pad(n: number, w: number): string {
  return String(n).padStart(w, "0");
}

/**
 * A rectangular warehouse: columns repeat [rack facing E, aisle, rack facing W]; cross aisles run
 * the full width; depot at the top-left corner, drop-off at the top-right. Bays are numbered from
 * the front cross aisle, odd on the west side and even on the east, so facing bays share a cell.
 */
export function generateWarehouse(spec: WarehouseSpec): GridDrawing {
  const { aisles, positions, levels, crossAisles } = spec;
  if (aisles < 1 || positions < 1 || levels < 1 || crossAisles < 2) throw new RangeError("invalid warehouse spec");
  const blocks = crossAisles - 1;
  const width = 3 * aisles;
  const height = positions + crossAisles;
  const d = emptyDrawing(width, height, spec.cellMm ?? 1000);
  const crossRows = new Set<number>();
  const posRow: number[] = [];
  let y = 0;
  for (let b = 0; b < blocks; b++) {
    crossRows.add(y++);
    const size = Math.floor(positions / blocks) + (b < positions % blocks ? 1 : 0);
    for (let k = 0; k < size; k++) posRow.push(y++);
  }
  crossRows.add(y);

  const bins: DrawingBin[] = [];
  for (let a = 0; a < aisles; a++) {
    const aisle = a + 1;
    posRow.forEach((row, pos) => {
      const west = cellIndex(d, 3 * a, row);
      const east = cellIndex(d, 3 * a + 2, row);
      d.cells[west] = "rack";
      d.facing[west] = "E";
      d.cells[east] = "rack";
      d.facing[east] = "W";
      if (spec.oneWayAisles) d.oneWay[cellIndex(d, 3 * a + 1, row)] = aisle % 2 === 1 ? "S" : "N";
      for (const [side, x] of [
        [1, 3 * a],
        [2, 3 * a + 2],
      ] as const) {
        const bay = 2 * pos + side;
        for (let level = 1; level <= levels; level++) {
          bins.push({ code: `A${pad(aisle, 2)}-${pad(bay, 3)}-${level}`, aisle, bay, level, x, y: row });
        }
      }
    });
  }
  d.bins = bins;
  d.depots = [{ id: "D1", x: 0, y: 0 }];
  d.dropoffs = [{ id: "P1", x: width - 1, y: 0 }];
  return d;
}

/** Seeded random bin codes whose access points are all distinct, `stops` of them. */
export function randomBatch(graph: CompactGraph, stops: number, seed: number): string[] {
  const rand = mulberry32(seed);
  const byAp = new Map<number, string>();
  if (stops > graph.accessPoints.length) throw new RangeError(`only ${graph.accessPoints.length} access points`);
  while (byAp.size < stops) {
    const bin = graph.bins[Math.floor(rand() * graph.bins.length)];
    if (bin && !byAp.has(bin.accessPoint)) byAp.set(bin.accessPoint, bin.code);
  }
  return [...byAp.values()];
}
