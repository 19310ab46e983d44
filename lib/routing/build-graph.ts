import { canStep, cellIndex, binAccessCell, inGrid, opposite, SIDES, SIDE_DX, SIDE_DY } from "./drawing";
import type { GridDrawing, Side } from "./drawing";
import type { AccessPoint, CompactGraph, GraphBin, GraphEdge, GraphNode, UnattachedBin } from "./graph";
import { allLines, keptLines, type KeptLines } from "./kept-lines";

export interface BuildOptions {
  /**
   * Drop the rows and columns of open floor that no shortest walk needs (lib/routing/kept-lines.ts),
   * so an open hall does not become one junction per cell. Default true; false keeps every cell.
   */
  compress?: boolean;
}

/** Rule of one step between neighbours along a kept line: bit 1 = forward allowed, bit 2 = backward allowed. */
function stepRule(d: GridDrawing, lines: KeptLines, x: number, y: number, dir: Side): number {
  if (!(dir === "E" || dir === "W" ? lines.rows[y] : lines.cols[x])) return 0;
  const nx = x + SIDE_DX[dir];
  const ny = y + SIDE_DY[dir];
  return (canStep(d, x, y, dir) ? 1 : 0) | (canStep(d, nx, ny, opposite(dir)) ? 2 : 0);
}

function linkedSides(d: GridDrawing, lines: KeptLines, x: number, y: number): Side[] {
  return SIDES.filter((s) => stepRule(d, lines, x, y, s) !== 0);
}

function onKeptLine(lines: KeptLines, x: number, y: number): boolean {
  return lines.rows[y] === 1 || lines.cols[x] === 1;
}

/**
 * A floor cell becomes a node where corridors meet, end or turn, at depots and drop-offs, and
 * where the one-way rule changes along a straight run (so every edge has a single direction rule
 * and any point on it is reached the same way as its ends).
 */
function isNodeCell(d: GridDrawing, lines: KeptLines, x: number, y: number, special: Set<number>): boolean {
  if (!onKeptLine(lines, x, y)) return false;
  if (special.has(cellIndex(d, x, y))) return true;
  const sides = linkedSides(d, lines, x, y);
  if (sides.length !== 2) return true;
  const [a, b] = sides as [Side, Side];
  if (b !== opposite(a)) return true;
  const incoming = stepRule(d, lines, x - SIDE_DX[b], y - SIDE_DY[b], b);
  const outgoing = stepRule(d, lines, x, y, b);
  return incoming !== outgoing;
}

function checkShape(d: GridDrawing): void {
  const n = d.width * d.height;
  if (!Number.isInteger(d.width) || !Number.isInteger(d.height) || d.width <= 0 || d.height <= 0) {
    throw new RangeError("drawing width and height must be positive integers");
  }
  if (!Number.isInteger(d.cellMm) || d.cellMm <= 0) throw new RangeError("cellMm must be a positive integer");
  if (d.cells.length !== n || d.facing.length !== n || d.oneWay.length !== n) {
    throw new RangeError(`cells, facing and oneWay must each hold width*height = ${n} entries`);
  }
}

function specialCells(d: GridDrawing): { special: Set<number>; misplacedPoints: string[] } {
  const special = new Set<number>();
  const misplacedPoints: string[] = [];
  for (const p of [...d.depots, ...d.dropoffs]) {
    if (inGrid(d, p.x, p.y) && d.cells[cellIndex(d, p.x, p.y)] === "floor") special.add(cellIndex(d, p.x, p.y));
    else misplacedPoints.push(p.id);
  }
  return { special, misplacedPoints };
}

/** How many nodes buildGraph would make, without making them: cheap enough for the editor's live checks. */
export function junctionCount(d: GridDrawing, options: BuildOptions = {}): number {
  checkShape(d);
  const lines = options.compress === false ? allLines(d) : keptLines(d);
  const { special } = specialCells(d);
  let n = 0;
  for (let y = 0; y < d.height; y++)
    for (let x = 0; x < d.width; x++)
      if (d.cells[cellIndex(d, x, y)] === "floor" && isNodeCell(d, lines, x, y, special)) n++;
  return n;
}

/**
 * Turns a grid drawing into the compact corridor graph. Deterministic: nodes are numbered in
 * row-major cell order, edges in the order they are met walking from each node N, E, S, W,
 * and access points in row-major order of their floor cell.
 */
export function buildGraph(d: GridDrawing, options: BuildOptions = {}): CompactGraph {
  checkShape(d);
  const lines = options.compress === false ? allLines(d) : keptLines(d);
  const { special, misplacedPoints } = specialCells(d);

  const cellCount = d.width * d.height;
  const nodeOfCell = new Int32Array(cellCount).fill(-1);
  const nodes: GraphNode[] = [];
  for (let y = 0; y < d.height; y++) {
    for (let x = 0; x < d.width; x++) {
      const c = cellIndex(d, x, y);
      if (d.cells[c] !== "floor" || !isNodeCell(d, lines, x, y, special)) continue;
      nodeOfCell[c] = nodes.length;
      nodes.push({ id: nodes.length, x, y, kind: "junction" });
    }
  }
  const label = (list: GridDrawing["depots"], kind: "depot" | "dropoff") =>
    list.flatMap((p) => {
      const node = inGrid(d, p.x, p.y) ? (nodeOfCell[cellIndex(d, p.x, p.y)] ?? -1) : -1;
      const gn = nodes[node];
      if (!gn) return [];
      // A cell that is both depot and drop-off keeps the depot kind; both lists still point at it.
      if (gn.kind === "junction") {
        gn.kind = kind;
        gn.label = p.id;
      }
      return [{ id: p.id, node }];
    });
  const depots = label(d.depots, "depot");
  const dropoffs = label(d.dropoffs, "dropoff");

  const edgeOfCell = new Int32Array(cellCount).fill(-1);
  const offsetOfCell = new Int32Array(cellCount);
  const edges: GraphEdge[] = [];
  for (const u of nodes) {
    for (const dir of linkedSides(d, lines, u.x, u.y)) {
      const rule = stepRule(d, lines, u.x, u.y, dir);
      const cells = [cellIndex(d, u.x, u.y)];
      let x = u.x;
      let y = u.y;
      let v = -1;
      while (v < 0) {
        x += SIDE_DX[dir];
        y += SIDE_DY[dir];
        const c = cellIndex(d, x, y);
        cells.push(c);
        v = nodeOfCell[c] ?? -1;
      }
      // Each corridor run is met from both ends; keep it once, from its lower-numbered end.
      if (v <= u.id) continue;
      const forward = (rule & 1) !== 0;
      const backward = (rule & 2) !== 0;
      const ordered = forward ? cells : cells.slice().reverse();
      const edge: GraphEdge = {
        id: edges.length,
        from: forward ? u.id : v,
        to: forward ? v : u.id,
        lengthMm: (cells.length - 1) * d.cellMm,
        oneWay: !(forward && backward),
        cells: ordered,
      };
      edges.push(edge);
      for (let i = 1; i < ordered.length - 1; i++) {
        const c = ordered[i] as number;
        edgeOfCell[c] = edge.id;
        offsetOfCell[c] = i * d.cellMm;
      }
    }
  }

  const unattachedBins: UnattachedBin[] = [];
  const binCell: number[] = [];
  for (const b of d.bins) {
    const rackCell = inGrid(d, b.x, b.y) ? cellIndex(d, b.x, b.y) : -1;
    const access = binAccessCell(d, b);
    if (rackCell < 0 || d.cells[rackCell] !== "rack") unattachedBins.push({ code: b.code, reason: "not-a-rack-cell" });
    else if (d.facing[rackCell] == null) unattachedBins.push({ code: b.code, reason: "no-facing-side" });
    else if (!access) unattachedBins.push({ code: b.code, reason: "face-reaches-no-floor" });
    binCell.push(access ? cellIndex(d, access.x, access.y) : -1);
  }

  const apCells = [...new Set(binCell.filter((c) => c >= 0))].sort((a, b) => a - b);
  const apOfCell = new Map<number, number>();
  const accessPoints: AccessPoint[] = apCells.map((c, id) => {
    apOfCell.set(c, id);
    return {
      id,
      x: c % d.width,
      y: Math.floor(c / d.width),
      node: nodeOfCell[c] ?? -1,
      edge: nodeOfCell[c] === -1 ? (edgeOfCell[c] ?? -1) : -1,
      offsetMm: nodeOfCell[c] === -1 ? (offsetOfCell[c] ?? 0) : 0,
    };
  });
  const bins: GraphBin[] = [];
  d.bins.forEach((b, i) => {
    const ap = apOfCell.get(binCell[i] ?? -1);
    if (ap !== undefined) bins.push({ code: b.code, aisle: b.aisle, bay: b.bay, level: b.level, accessPoint: ap });
  });

  return {
    width: d.width,
    height: d.height,
    cellMm: d.cellMm,
    nodes,
    edges,
    accessPoints,
    bins,
    depots,
    dropoffs,
    unattachedBins,
    misplacedPoints,
  };
}
