import { binAccessCell, cellIndex, inGrid } from "./drawing";
import type { CellRef, GridDrawing } from "./drawing";
import { reachableFrom, reachingTo } from "./reachability";

export type IssueCode =
  | "bad-shape"
  | "missing-depot"
  | "missing-dropoff"
  | "point-not-on-floor"
  | "duplicate-bin-code"
  | "bin-without-access"
  | "bin-unreachable"
  | "unreachable-floor"
  | "one-way-trap";

export interface DrawingIssue {
  code: IssueCode;
  severity: "error" | "warning";
  message: string;
  cells?: CellRef[];
  bins?: string[];
}

function cellsWhere(d: GridDrawing, pred: (c: number) => boolean): CellRef[] {
  const out: CellRef[] = [];
  for (let c = 0; c < d.width * d.height; c++) if (pred(c)) out.push({ x: c % d.width, y: Math.floor(c / d.width) });
  return out;
}

/**
 * Live checks for the floor-plan editor. Reachability is judged on the raw cell grid with the
 * same step rule the graph builder uses: a bin is usable only if some depot reaches its access
 * cell and some drop-off can be reached from it.
 */
export function validateDrawing(d: GridDrawing): DrawingIssue[] {
  const n = d.width * d.height;
  if (d.width <= 0 || d.height <= 0 || d.cells.length !== n || d.facing.length !== n || d.oneWay.length !== n) {
    return [{ code: "bad-shape", severity: "error", message: `cells, facing and oneWay must each hold ${n} entries` }];
  }
  const issues: DrawingIssue[] = [];
  if (d.depots.length === 0)
    issues.push({ code: "missing-depot", severity: "error", message: "the plan has no depot" });
  if (d.dropoffs.length === 0)
    issues.push({ code: "missing-dropoff", severity: "error", message: "the plan has no drop-off" });
  const onFloor = (p: CellRef) => inGrid(d, p.x, p.y) && d.cells[cellIndex(d, p.x, p.y)] === "floor";
  for (const p of [...d.depots, ...d.dropoffs]) {
    if (!onFloor(p))
      issues.push({
        code: "point-not-on-floor",
        severity: "error",
        message: `${p.id} is not on a floor cell`,
        cells: [{ x: p.x, y: p.y }],
      });
  }

  const seenCodes = new Set<string>();
  const dupes = new Set<string>();
  for (const b of d.bins) (seenCodes.has(b.code) ? dupes : seenCodes).add(b.code);
  if (dupes.size > 0)
    issues.push({
      code: "duplicate-bin-code",
      severity: "error",
      message: `duplicate location codes: ${[...dupes].join(", ")}`,
      bins: [...dupes],
    });

  const fromDepot = reachableFrom(
    d,
    d.depots.filter(onFloor).map((p) => cellIndex(d, p.x, p.y)),
  );
  const toDropoff = reachingTo(
    d,
    d.dropoffs.filter(onFloor).map((p) => cellIndex(d, p.x, p.y)),
  );
  const noAccess: string[] = [];
  const unreachable: string[] = [];
  for (const b of d.bins) {
    const a = binAccessCell(d, b);
    if (!a) noAccess.push(b.code);
    else if (!fromDepot[cellIndex(d, a.x, a.y)] || !toDropoff[cellIndex(d, a.x, a.y)]) unreachable.push(b.code);
  }
  if (noAccess.length > 0) {
    issues.push({
      code: "bin-without-access",
      severity: "error",
      message: `${noAccess.length} bin(s) face no floor cell: ${noAccess.slice(0, 10).join(", ")}`,
      bins: noAccess,
    });
  }
  if (unreachable.length > 0) {
    issues.push({
      code: "bin-unreachable",
      severity: "error",
      message: `${unreachable.length} bin(s) cannot be picked on a walk from a depot to a drop-off: ${unreachable.slice(0, 10).join(", ")}`,
      bins: unreachable,
    });
  }
  if (d.depots.length > 0) {
    const cut = cellsWhere(d, (c) => d.cells[c] === "floor" && !fromDepot[c]);
    if (cut.length > 0)
      issues.push({
        code: "unreachable-floor",
        severity: "warning",
        message: `${cut.length} floor cell(s) cannot be reached from any depot`,
        cells: cut,
      });
  }
  if (d.dropoffs.length > 0) {
    const trap = cellsWhere(d, (c) => fromDepot[c] === 1 && !toDropoff[c]);
    if (trap.length > 0)
      issues.push({
        code: "one-way-trap",
        severity: "error",
        message: `${trap.length} floor cell(s) can be entered from a depot but lead to no drop-off`,
        cells: trap,
      });
  }
  return issues;
}
