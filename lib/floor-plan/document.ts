import { z } from "zod";

// The editor checks rack runs with these schemas in the browser. There zod would first probe
// `Function("")` to decide whether to compile its parsers, and the pages' CSP forbids eval: the probe
// fails quietly but is reported as a violation. Parsing without compiling avoids it; servers keep the JIT.
if (typeof window !== "undefined") z.config({ jitless: true });

/**
 * What the floor-plan editor saves: the admin's drawing in the admin's terms (ground paint, rack runs
 * with their numbering, points). lib/floor-plan/to-drawing.ts turns it into the routing engine's GridDrawing.
 */
export const DOCUMENT_FORMAT = 1;
export const MAX_SIDE_CELLS = 400;
export const MAX_RACK_RUNS = 2000;
export const MAX_LEVELS = 12;
/** The real size of one grid cell, in mm: the editor's field, its command and the saved document all hold to it. */
export const CELL_MM_MIN = 250;
export const CELL_MM_MAX = 5000;

/** Ground paint per cell, row-major: "." outside the floor, "f" walkable floor, "x" wall/column/dock. */
export const GROUND = { outside: ".", floor: "f", blocked: "x" } as const;
export type GroundChar = (typeof GROUND)[keyof typeof GROUND];

const side = z.enum(["N", "E", "S", "W"]);
const id = z.string().regex(/^[A-Za-z0-9_-]{1,24}$/, "Ids use letters, digits, - and _ (at most 24).");
/** The id of a rack run, depot or drop-off. */
export const elementId = id;
const cell = z
  .number()
  .int()
  .min(0)
  .max(MAX_SIDE_CELLS - 1);

/** A location code pattern: literal text with {aisle}, {bay}, {level}, each optionally zero-padded as {bay:3}. */
export const codePattern = z
  .string()
  .min(3)
  .max(40)
  .refine(
    (p) => /\{bay(:\d)?\}/.test(p) && /\{level(:\d)?\}/.test(p),
    "The pattern needs {bay} and {level} so every bin gets its own code.",
  )
  .refine(
    (p) => !/\{(?!aisle(:\d)?\}|bay(:\d)?\}|level(:\d)?\})/.test(p),
    "Only {aisle}, {bay} and {level} (optionally padded like {bay:3}) may appear in braces.",
  );

export const rackRunSchema = z
  .object({
    id,
    x: cell,
    y: cell,
    /** "h": the run goes along x (left to right); "v": along y (top to bottom). */
    orientation: z.enum(["h", "v"]),
    length: z.number().int().min(1).max(MAX_SIDE_CELLS),
    /** The side the bins are picked from: N or S for a horizontal run, E or W for a vertical one. */
    facing: side,
    aisle: z.number().int().min(1).max(999),
    firstBay: z.number().int().min(1).max(9999),
    /** 2 numbers one side of an aisle odd and the other even. */
    bayStep: z.union([z.literal(1), z.literal(2)]),
    /** "forward": bays count up along increasing x or y; "reverse": they count down. */
    bayDirection: z.enum(["forward", "reverse"]),
    levels: z.number().int().min(1).max(MAX_LEVELS),
    pattern: codePattern,
    /** Codes that differ from the pattern (imported from a spreadsheet), per bay and level. */
    customCodes: z
      .array(
        z.object({
          bay: z
            .number()
            .int()
            .min(1)
            .max(9999 + 2 * MAX_SIDE_CELLS),
          level: z.number().int().min(1).max(MAX_LEVELS),
          code: z.string().regex(/^[A-Za-z0-9._\/-]{1,32}$/, "Codes use letters, digits and . _ / - (at most 32)."),
        }),
      )
      .max(MAX_SIDE_CELLS * MAX_LEVELS),
  })
  .refine(
    (r) => (r.orientation === "h" ? r.facing === "N" || r.facing === "S" : r.facing === "E" || r.facing === "W"),
    {
      message: "A horizontal run faces N or S; a vertical one faces E or W.",
      path: ["facing"],
    },
  );

const point = z.object({ id, x: cell, y: cell, name: z.string().trim().min(1).max(60) });

export const editorDocumentSchema = z
  .object({
    format: z.literal(DOCUMENT_FORMAT),
    width: z.number().int().min(4).max(MAX_SIDE_CELLS),
    height: z.number().int().min(4).max(MAX_SIDE_CELLS),
    cellMm: z.number().int().min(CELL_MM_MIN).max(CELL_MM_MAX),
    ground: z.string().regex(/^[.fx]*$/, "Ground paint uses only '.', 'f' and 'x'."),
    oneWay: z.array(z.object({ cell: z.number().int().min(0), dir: side })).max(MAX_SIDE_CELLS * MAX_SIDE_CELLS),
    rackRuns: z.array(rackRunSchema).max(MAX_RACK_RUNS),
    depots: z.array(point).max(20),
    dropoffs: z.array(point).max(20),
    background: z
      .object({ fileId: z.string().regex(/^[a-f0-9]{32}$/), opacity: z.number().min(0.05).max(1) })
      .nullable(),
  })
  .refine((d) => d.ground.length === d.width * d.height, {
    message: "Ground paint must have one entry per cell.",
    path: ["ground"],
  })
  .refine((d) => d.oneWay.every((m) => m.cell < d.width * d.height), {
    message: "A one-way mark lies outside the grid.",
    path: ["oneWay"],
  })
  .refine(
    (d) =>
      d.rackRuns.every((r) =>
        r.orientation === "h"
          ? r.x + r.length <= d.width && r.y < d.height
          : r.y + r.length <= d.height && r.x < d.width,
      ),
    { message: "A rack run reaches past the edge of the grid.", path: ["rackRuns"] },
  )
  .refine((d) => [...d.depots, ...d.dropoffs].every((p) => p.x < d.width && p.y < d.height), {
    message: "A depot or drop-off lies outside the grid.",
    path: ["depots"],
  });

export type EditorDocument = z.infer<typeof editorDocumentSchema>;
export type RackRun = z.infer<typeof rackRunSchema>;
export type EditorPoint = z.infer<typeof point>;

export function blankDocument(width: number, height: number, cellMm: number): EditorDocument {
  return {
    format: DOCUMENT_FORMAT,
    width,
    height,
    cellMm,
    ground: GROUND.outside.repeat(width * height),
    oneWay: [],
    rackRuns: [],
    depots: [],
    dropoffs: [],
    background: null,
  };
}
