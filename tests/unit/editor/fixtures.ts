import { DOCUMENT_FORMAT, type EditorDocument, type RackRun } from "@/lib/floor-plan/document";

/** A document drawn as text rows of ground characters ('.', 'f', 'x'), 1 m cells. */
export function docFromRows(rows: string[], extra: Partial<EditorDocument> = {}): EditorDocument {
  const width = rows[0]?.length ?? 0;
  if (rows.some((r) => r.length !== width)) throw new Error("rows must have equal length");
  return {
    format: DOCUMENT_FORMAT,
    width,
    height: rows.length,
    cellMm: 1000,
    ground: rows.join(""),
    oneWay: [],
    rackRuns: [],
    depots: [],
    dropoffs: [],
    background: null,
    ...extra,
  };
}

export function rackRun(over: Partial<RackRun> & Pick<RackRun, "id" | "x" | "y">): RackRun {
  return {
    orientation: "h",
    length: 3,
    facing: "S",
    aisle: 1,
    firstBay: 1,
    bayStep: 1,
    bayDirection: "forward",
    levels: 2,
    pattern: "{aisle:2}-{bay:3}-{level}",
    customCodes: [],
    ...over,
  };
}

export const depot = (x: number, y: number, id = "D1") => ({ id, x, y, name: `Depot ${id}` });
export const dropoff = (x: number, y: number, id = "P1") => ({ id, x, y, name: `Drop-off ${id}` });
