import type { CellKind, GridDrawing, Side } from "@/lib/routing/drawing";
import { GROUND, type EditorDocument } from "./document";
import { documentBins, rackRunCells } from "./bin-codes";

/**
 * The routing engine's input for a document. Deterministic: outside and blocked ground become
 * "blocked", rack cells override the ground (a later run wins where runs overlap; checks report
 * that), and one-way marks are kept only on floor cells because the engine reads them only there.
 */
export function toGridDrawing(doc: EditorDocument): GridDrawing {
  const n = doc.width * doc.height;
  const cells = new Array<CellKind>(n);
  for (let i = 0; i < n; i++) cells[i] = doc.ground[i] === GROUND.floor ? "floor" : "blocked";
  const facing = new Array<Side | null>(n).fill(null);
  for (const run of doc.rackRuns) {
    for (const c of rackRunCells(run)) {
      const i = c.y * doc.width + c.x;
      cells[i] = "rack";
      facing[i] = run.facing;
    }
  }
  const oneWay = new Array<Side | null>(n).fill(null);
  for (const m of doc.oneWay) if (m.cell < n && cells[m.cell] === "floor") oneWay[m.cell] = m.dir;
  return {
    width: doc.width,
    height: doc.height,
    cellMm: doc.cellMm,
    cells,
    facing,
    oneWay,
    depots: doc.depots.map((p) => ({ id: p.id, x: p.x, y: p.y })),
    dropoffs: doc.dropoffs.map((p) => ({ id: p.id, x: p.x, y: p.y })),
    bins: documentBins(doc).map(({ code, aisle, bay, level, x, y }) => ({ code, aisle, bay, level, x, y })),
  };
}
