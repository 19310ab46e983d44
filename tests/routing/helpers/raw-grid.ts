import { DirectedGraph } from "graphology";
import { singleSource } from "graphology-shortest-path/dijkstra";
import type { CompactGraph, GridDrawing } from "../../../lib/routing";

type Dir = "N" | "E" | "S" | "W";
const STEP: Record<Dir, [number, number]> = { N: [0, -1], E: [1, 0], S: [0, 1], W: [-1, 0] };
const AXIS: Record<Dir, string> = { N: "v", S: "v", E: "h", W: "h" };

/**
 * The documented cell rule, written out again independently of lib/routing: a move is allowed
 * between floor cells unless either cell carries a one-way mark on the move's axis that points
 * the other way.
 */
function allowed(d: GridDrawing, x: number, y: number, dir: Dir): boolean {
  const [dx, dy] = STEP[dir];
  const nx = x + dx;
  const ny = y + dy;
  if (nx < 0 || ny < 0 || nx >= d.width || ny >= d.height) return false;
  const a = y * d.width + x;
  const b = ny * d.width + nx;
  if (d.cells[a] !== "floor" || d.cells[b] !== "floor") return false;
  for (const mark of [d.oneWay[a], d.oneWay[b]]) {
    if (mark && AXIS[mark] === AXIS[dir] && mark !== dir) return false;
  }
  return true;
}

export function rawGridGraph(d: GridDrawing): DirectedGraph {
  const g = new DirectedGraph();
  for (let c = 0; c < d.width * d.height; c++) if (d.cells[c] === "floor") g.addNode(String(c));
  for (let y = 0; y < d.height; y++) {
    for (let x = 0; x < d.width; x++) {
      for (const dir of ["N", "E", "S", "W"] as Dir[]) {
        if (!allowed(d, x, y, dir)) continue;
        const [dx, dy] = STEP[dir];
        g.addDirectedEdge(String(y * d.width + x), String((y + dy) * d.width + x + dx), { w: d.cellMm });
      }
    }
  }
  return g;
}

export function compactGraphology(graph: CompactGraph): DirectedGraph {
  const g = new DirectedGraph();
  for (const n of graph.nodes) g.addNode(String(n.id));
  for (const e of graph.edges) {
    g.addDirectedEdge(String(e.from), String(e.to), { w: e.lengthMm });
    if (!e.oneWay) g.addDirectedEdge(String(e.to), String(e.from), { w: e.lengthMm });
  }
  return g;
}

/** Dijkstra (graphology-shortest-path) from one node, lengths as summed edge weights; absent = unreachable. */
export function dijkstraLengths(g: DirectedGraph, source: string): Map<string, number> {
  const paths = singleSource(g, source, "w");
  const out = new Map<string, number>();
  for (const [target, path] of Object.entries(paths)) {
    let total = 0;
    for (let i = 0; i + 1 < path.length; i++) {
      total += g.getEdgeAttribute(g.edge(path[i], path[i + 1]), "w") as number;
    }
    out.set(target, total);
  }
  return out;
}
