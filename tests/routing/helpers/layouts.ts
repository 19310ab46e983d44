import { generateWarehouse, mulberry32, type GridDrawing } from "../../../lib/routing";

/** A generated warehouse with one-way aisles and a seeded scatter of blocked aisle cells. */
export function obstructedWarehouse(seed: number): GridDrawing {
  const d = generateWarehouse({
    aisles: 5,
    positions: 12,
    levels: 2,
    crossAisles: 3,
    cellMm: 1200,
    oneWayAisles: seed % 2 === 0,
  });
  const rand = mulberry32(seed);
  for (let c = 0; c < d.cells.length; c++) {
    const isDepot = [...d.depots, ...d.dropoffs].some((p) => p.y * d.width + p.x === c);
    if (d.cells[c] === "floor" && !isDepot && rand() < 0.06) d.cells[c] = "blocked";
    else if (d.cells[c] === "floor" && d.oneWay[c] == null && rand() < 0.05)
      d.oneWay[c] = (["N", "E", "S", "W"] as const)[Math.floor(rand() * 4)]!;
  }
  return d;
}
