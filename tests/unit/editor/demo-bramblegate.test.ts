import { describe, expect, it } from "vitest";
import { bramblegateDocument, bramblegateDraftDocument } from "@/db/seeds/demo/floor-plan";
import { checkDocument } from "@/lib/floor-plan/checks";
import { documentBins } from "@/lib/floor-plan/bin-codes";
import { editorDocumentSchema } from "@/lib/floor-plan/document";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { buildGraph } from "@/lib/routing/build-graph";
import { floydWarshall } from "@/lib/routing/floyd-warshall";
import { UNREACHABLE } from "@/lib/routing/constants";

describe.each([
  ["published demo", bramblegateDocument],
  ["draft demo", bramblegateDraftDocument],
])("Bramblegate %s", (_name, make) => {
  const doc = make();

  it("is a valid document with no problems at all", () => {
    expect(editorDocumentSchema.safeParse(doc).success).toBe(true);
    expect(checkDocument(doc)).toEqual([]);
  });

  it("publishes to a graph holding every bin, its depot and its drop-off", () => {
    const graph = buildGraph(toGridDrawing(doc));
    expect(graph.bins).toHaveLength(documentBins(doc).length);
    expect(graph.unattachedBins).toEqual([]);
    expect(graph.misplacedPoints).toEqual([]);
    expect(graph.depots.map((p) => p.id)).toEqual(["D1"]);
    expect(graph.dropoffs.map((p) => p.id)).toEqual(["P1"]);
    expect(graph.edges.some((e) => e.oneWay)).toBe(true);
  });
});

describe("Bramblegate layout", () => {
  const doc = bramblegateDocument();
  const graph = buildGraph(toGridDrawing(doc));
  const m = floydWarshall(graph);
  const node = (x: number, y: number) => {
    const n = graph.nodes.find((q) => q.x === x && q.y === y);
    if (!n) throw new Error(`no node at ${x},${y}`);
    return n.id;
  };
  const dist = (a: number, b: number) => m.dist[a * m.n + b] as number;

  it("has eight aisles with four levels, odd bays west and even bays east of each walkway", () => {
    const bins = documentBins(doc);
    expect(new Set(bins.map((b) => b.aisle))).toEqual(new Set([1, 2, 3, 4, 5, 6, 7, 8]));
    expect(Math.max(...bins.map((b) => b.level))).toBe(4);
    const aisle3 = bins.filter((b) => b.aisle === 3);
    expect(aisle3.filter((b) => b.x === 7).every((b) => b.bay % 2 === 1)).toBe(true);
    expect(aisle3.filter((b) => b.x === 9).every((b) => b.bay % 2 === 0)).toBe(true);
    expect(aisle3.find((b) => b.x === 7 && b.y === 25 && b.level === 1)?.code).toBe("03-001-1");
    expect(new Set(bins.map((b) => b.code)).size).toBe(bins.length);
  });

  it("walks its narrow aisle northwards only", () => {
    // Aisle 5 runs down column 14 from the middle cross-aisle (row 13) to the front one (row 26).
    const front = node(14, 26);
    const middle = node(14, 13);
    expect(dist(front, middle)).toBe(13_000);
    expect(dist(middle, front)).toBeGreaterThan(13_000);
  });

  it("connects the depot to the drop-off along the front cross-aisle", () => {
    expect(dist(node(1, 26), node(25, 26))).toBe(24_000);
    expect(dist(node(25, 26), node(1, 26))).toBeLessThan(UNREACHABLE);
  });
});
