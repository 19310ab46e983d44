import type { Side } from "@/lib/routing/drawing";
import {
  CELL_MM_MAX,
  CELL_MM_MIN,
  GROUND,
  MAX_SIDE_CELLS,
  rackRunSchema,
  type EditorDocument,
  type EditorPoint,
  type GroundChar,
  type RackRun,
} from "./document";

export type PointKind = "depot" | "dropoff";
export type RunChanges = Partial<Omit<RackRun, "id">>;
export type OneWayMark = EditorDocument["oneWay"][number];

/** Every edit of a floor plan, as data: the toolbar, the keyboard and the menus all send these. */
export type Command =
  /** Paint ground on the listed cells; painting anything but floor also drops their one-way marks. */
  | { type: "paint"; cells: number[]; ground: GroundChar }
  /** Paint ground on a rectangle given by two opposite corner cells (inclusive). */
  | { type: "paint-rect"; x0: number; y0: number; x1: number; y1: number; ground: GroundChar }
  /** Set each listed cell's ground to the matching character of `ground` (what undoing a paint does). */
  | { type: "set-ground-cells"; cells: number[]; ground: string }
  /** Mark cells one-way towards `dir`, or clear their marks with null. */
  | { type: "set-one-way"; cells: number[]; dir: Side | null }
  | { type: "replace-one-way"; marks: OneWayMark[] }
  /** Add a run; `index` puts it back where it was when a delete is undone. */
  | { type: "add-rack-run"; run: RackRun; index?: number }
  | { type: "update-rack-run"; id: string; changes: RunChanges }
  | { type: "move-rack-run"; id: string; dx: number; dy: number }
  | { type: "delete-rack-run"; id: string }
  /** Replace a run's imported codes (from its bins spreadsheet). */
  | { type: "set-custom-codes"; id: string; customCodes: RackRun["customCodes"] }
  | { type: "add-point"; kind: PointKind; point: EditorPoint; index?: number }
  | { type: "move-point"; kind: PointKind; id: string; x: number; y: number }
  | { type: "rename-point"; kind: PointKind; id: string; name: string }
  | { type: "delete-point"; kind: PointKind; id: string }
  /** Grow or crop the grid at its right and bottom edges; refused while runs or points would fall off. */
  | { type: "resize"; width: number; height: number }
  | { type: "set-cell-size"; cellMm: number }
  | { type: "set-background"; background: EditorDocument["background"] }
  | { type: "set-background-opacity"; opacity: number }
  | { type: "replace-document"; document: EditorDocument }
  /** Several commands as one undo step. */
  | { type: "batch"; label: string; commands: Command[] };

export interface Executed {
  doc: EditorDocument;
  /** Applying this to `doc` gives back the document the command was applied to. */
  inverse: Command;
}

/** Applies a command; returns the same document object when the command changes nothing or is refused. */
export function applyCommand(doc: EditorDocument, cmd: Command): EditorDocument {
  return execute(doc, cmd)?.doc ?? doc;
}

/** Applies a command and gives its inverse, or null when it changes nothing or is refused. */
export function execute(doc: EditorDocument, cmd: Command): Executed | null {
  switch (cmd.type) {
    case "paint":
      return paint(doc, cmd.cells, cmd.ground);
    case "paint-rect":
      return paint(doc, rectCells(doc, cmd.x0, cmd.y0, cmd.x1, cmd.y1), cmd.ground);
    case "set-ground-cells":
      return setGroundCells(doc, cmd.cells, cmd.ground);
    case "set-one-way":
      return setOneWay(doc, cmd.cells, cmd.dir);
    case "replace-one-way":
      return sameMarks(doc.oneWay, cmd.marks)
        ? null
        : { doc: { ...doc, oneWay: cmd.marks }, inverse: { type: "replace-one-way", marks: doc.oneWay } };
    case "add-rack-run": {
      if (doc.rackRuns.some((r) => r.id === cmd.run.id) || runProblem(doc, cmd.run)) return null;
      const at = clampIndex(cmd.index, doc.rackRuns.length);
      return {
        doc: { ...doc, rackRuns: insertAt(doc.rackRuns, at, cmd.run) },
        inverse: { type: "delete-rack-run", id: cmd.run.id },
      };
    }
    case "update-rack-run":
      return updateRun(doc, cmd.id, cmd.changes);
    case "move-rack-run": {
      const run = doc.rackRuns.find((r) => r.id === cmd.id);
      if (!run || (cmd.dx === 0 && cmd.dy === 0)) return null;
      const moved = updateRun(doc, cmd.id, { x: run.x + cmd.dx, y: run.y + cmd.dy });
      return moved && { doc: moved.doc, inverse: { type: "move-rack-run", id: cmd.id, dx: -cmd.dx, dy: -cmd.dy } };
    }
    case "delete-rack-run": {
      const at = doc.rackRuns.findIndex((r) => r.id === cmd.id);
      const run = doc.rackRuns[at];
      if (!run) return null;
      return {
        doc: { ...doc, rackRuns: doc.rackRuns.filter((_r, i) => i !== at) },
        inverse: { type: "add-rack-run", run, index: at },
      };
    }
    case "set-custom-codes":
      return updateRun(doc, cmd.id, { customCodes: cmd.customCodes });
    case "add-point": {
      const list = points(doc, cmd.kind);
      if (
        [...doc.depots, ...doc.dropoffs].some((p) => p.id === cmd.point.id) ||
        !inGrid(doc, cmd.point.x, cmd.point.y) ||
        !cmd.point.name.trim()
      )
        return null;
      const at = clampIndex(cmd.index, list.length);
      return {
        doc: withPoints(doc, cmd.kind, insertAt(list, at, cmd.point)),
        inverse: { type: "delete-point", kind: cmd.kind, id: cmd.point.id },
      };
    }
    case "move-point": {
      const p = points(doc, cmd.kind).find((q) => q.id === cmd.id);
      if (!p || !inGrid(doc, cmd.x, cmd.y) || (p.x === cmd.x && p.y === cmd.y)) return null;
      return {
        doc: withPoints(
          doc,
          cmd.kind,
          points(doc, cmd.kind).map((q) => (q.id === cmd.id ? { ...q, x: cmd.x, y: cmd.y } : q)),
        ),
        inverse: { type: "move-point", kind: cmd.kind, id: cmd.id, x: p.x, y: p.y },
      };
    }
    case "rename-point": {
      const p = points(doc, cmd.kind).find((q) => q.id === cmd.id);
      const name = cmd.name.trim();
      if (!p || !name || name.length > 60 || p.name === name) return null;
      return {
        doc: withPoints(
          doc,
          cmd.kind,
          points(doc, cmd.kind).map((q) => (q.id === cmd.id ? { ...q, name } : q)),
        ),
        inverse: { type: "rename-point", kind: cmd.kind, id: cmd.id, name: p.name },
      };
    }
    case "delete-point": {
      const list = points(doc, cmd.kind);
      const at = list.findIndex((q) => q.id === cmd.id);
      const p = list[at];
      if (!p) return null;
      return {
        doc: withPoints(
          doc,
          cmd.kind,
          list.filter((_q, i) => i !== at),
        ),
        inverse: { type: "add-point", kind: cmd.kind, point: p, index: at },
      };
    }
    case "resize":
      return resize(doc, cmd.width, cmd.height);
    case "set-cell-size": {
      if (
        !Number.isInteger(cmd.cellMm) ||
        cmd.cellMm < CELL_MM_MIN ||
        cmd.cellMm > CELL_MM_MAX ||
        cmd.cellMm === doc.cellMm
      )
        return null;
      return { doc: { ...doc, cellMm: cmd.cellMm }, inverse: { type: "set-cell-size", cellMm: doc.cellMm } };
    }
    case "set-background": {
      const b = cmd.background;
      if (
        b === doc.background ||
        (b && doc.background && b.fileId === doc.background.fileId && b.opacity === doc.background.opacity)
      )
        return null;
      if (b && !(b.opacity >= 0.05 && b.opacity <= 1 && /^[a-f0-9]{32}$/.test(b.fileId))) return null;
      return { doc: { ...doc, background: b }, inverse: { type: "set-background", background: doc.background } };
    }
    case "set-background-opacity": {
      const opacity = Math.min(1, Math.max(0.05, cmd.opacity));
      if (!doc.background || !Number.isFinite(cmd.opacity) || opacity === doc.background.opacity) return null;
      return {
        doc: { ...doc, background: { ...doc.background, opacity } },
        inverse: { type: "set-background-opacity", opacity: doc.background.opacity },
      };
    }
    case "replace-document":
      return cmd.document === doc ? null : { doc: cmd.document, inverse: { type: "replace-document", document: doc } };
    case "batch": {
      let current = doc;
      const inverses: Command[] = [];
      for (const c of cmd.commands) {
        const done = execute(current, c);
        if (!done) continue;
        current = done.doc;
        inverses.unshift(done.inverse);
      }
      return inverses.length === 0
        ? null
        : { doc: current, inverse: { type: "batch", label: cmd.label, commands: inverses } };
    }
  }
}

/** Why a run cannot be placed in the document as it is, or null when it can. */
export function runProblem(doc: Pick<EditorDocument, "width" | "height">, run: RackRun): string | null {
  const parsed = rackRunSchema.safeParse(run);
  if (!parsed.success) return parsed.error.issues[0]?.message ?? "The rack run is not valid.";
  const endX = run.orientation === "h" ? run.x + run.length : run.x + 1;
  const endY = run.orientation === "v" ? run.y + run.length : run.y + 1;
  if (endX > doc.width || endY > doc.height) return "The rack run reaches past the edge of the grid.";
  return null;
}

/** Why the grid cannot be resized to width × height, or null when it can. */
export function resizeProblem(doc: EditorDocument, width: number, height: number): string | null {
  if (
    !Number.isInteger(width) ||
    !Number.isInteger(height) ||
    width < 4 ||
    height < 4 ||
    width > MAX_SIDE_CELLS ||
    height > MAX_SIDE_CELLS
  ) {
    return `Width and height are whole numbers of cells from 4 to ${MAX_SIDE_CELLS}.`;
  }
  const size = { width, height };
  if (doc.rackRuns.some((r) => runProblem(size, r)))
    return "Some rack runs would fall off the grid. Move or shorten them first.";
  if ([...doc.depots, ...doc.dropoffs].some((p) => p.x >= width || p.y >= height))
    return "A depot or drop-off would fall off the grid. Move it first.";
  return null;
}

/** Cells of the rectangle spanned by two corners, clipped to the grid. */
export function rectCells(
  doc: Pick<EditorDocument, "width" | "height">,
  x0: number,
  y0: number,
  x1: number,
  y1: number,
): number[] {
  const cells: number[] = [];
  const [xa, xb] = [Math.max(0, Math.min(x0, x1)), Math.min(doc.width - 1, Math.max(x0, x1))];
  const [ya, yb] = [Math.max(0, Math.min(y0, y1)), Math.min(doc.height - 1, Math.max(y0, y1))];
  for (let y = ya; y <= yb; y++) for (let x = xa; x <= xb; x++) cells.push(y * doc.width + x);
  return cells;
}

/** A short name of the edit, for "Undo …" labels. */
export function describeCommand(cmd: Command): string {
  switch (cmd.type) {
    case "paint":
    case "paint-rect":
      return cmd.ground === GROUND.floor ? "paint floor" : cmd.ground === GROUND.blocked ? "paint blocked" : "erase";
    case "set-ground-cells":
      return "restore paint";
    case "set-one-way":
      return cmd.dir ? "one-way mark" : "clear one-way";
    case "replace-one-way":
      return "restore one-way marks";
    case "add-rack-run":
      return `add rack run ${cmd.run.id}`;
    case "update-rack-run":
      return `change rack run ${cmd.id}`;
    case "move-rack-run":
      return `move rack run ${cmd.id}`;
    case "delete-rack-run":
      return `delete rack run ${cmd.id}`;
    case "set-custom-codes":
      return `import codes of ${cmd.id}`;
    case "add-point":
      return `add ${cmd.kind === "depot" ? "depot" : "drop-off"}`;
    case "move-point":
      return `move ${cmd.kind === "depot" ? "depot" : "drop-off"}`;
    case "rename-point":
      return `rename ${cmd.kind === "depot" ? "depot" : "drop-off"}`;
    case "delete-point":
      return `delete ${cmd.kind === "depot" ? "depot" : "drop-off"}`;
    case "resize":
      return "resize grid";
    case "set-cell-size":
      return "change cell size";
    case "set-background":
      return cmd.background ? "set background" : "remove background";
    case "set-background-opacity":
      return "background opacity";
    case "replace-document":
      return "replace drawing";
    case "batch":
      return cmd.label;
  }
}

/** The next free id like "R12" for a rack run, "D2" for a depot or "P3" for a drop-off. */
export function nextId(doc: EditorDocument, what: "run" | PointKind): string {
  const prefix = what === "run" ? "R" : what === "depot" ? "D" : "P";
  const taken = what === "run" ? doc.rackRuns.map((r) => r.id) : [...doc.depots, ...doc.dropoffs].map((p) => p.id);
  let max = 0;
  for (const id of taken) {
    const m = new RegExp(`^${prefix}(\\d+)$`).exec(id);
    if (m) max = Math.max(max, Number(m[1]));
  }
  return `${prefix}${max + 1}`;
}

function paint(doc: EditorDocument, cells: number[], ground: GroundChar): Executed | null {
  const valid = [...new Set(cells)].filter(
    (c) => Number.isInteger(c) && c >= 0 && c < doc.ground.length && doc.ground[c] !== ground,
  );
  const groundDone = setGroundCells(doc, valid, ground.repeat(valid.length));
  if (ground === GROUND.floor) return groundDone;
  const dropped = new Set(cells);
  const marks = doc.oneWay.filter((m) => !dropped.has(m.cell));
  if (marks.length === doc.oneWay.length) return groundDone;
  const base = groundDone?.doc ?? doc;
  const inverse: Command[] = [{ type: "replace-one-way", marks: doc.oneWay }];
  if (groundDone) inverse.push(groundDone.inverse);
  return { doc: { ...base, oneWay: marks }, inverse: { type: "batch", label: "restore paint", commands: inverse } };
}

function setGroundCells(doc: EditorDocument, cells: number[], chars: string): Executed | null {
  if (cells.length === 0 || chars.length !== cells.length || !/^[.fx]*$/.test(chars)) return null;
  if (cells.some((c) => !Number.isInteger(c) || c < 0 || c >= doc.ground.length)) return null;
  const ground = doc.ground.split("");
  const before = cells.map((c) => ground[c] as string).join("");
  if (before === chars) return null;
  cells.forEach((c, i) => (ground[c] = chars[i] as string));
  // Restore in reverse so that a cell listed twice gets its earliest value back.
  const back = [...cells].reverse();
  return {
    doc: { ...doc, ground: ground.join("") },
    inverse: { type: "set-ground-cells", cells: back, ground: before.split("").reverse().join("") },
  };
}

function setOneWay(doc: EditorDocument, cells: number[], dir: Side | null): Executed | null {
  const target = new Set(cells.filter((c) => Number.isInteger(c) && c >= 0 && c < doc.ground.length));
  if (target.size === 0) return null;
  const kept = doc.oneWay.filter((m) => !target.has(m.cell));
  const added = dir ? [...target].map((cell) => ({ cell, dir })) : [];
  // Kept sorted by cell so two drawings with the same marks save the same way.
  const marks = [...kept, ...added].sort((a, b) => a.cell - b.cell);
  if (sameMarks(doc.oneWay, marks)) return null;
  return { doc: { ...doc, oneWay: marks }, inverse: { type: "replace-one-way", marks: doc.oneWay } };
}

function sameMarks(a: OneWayMark[], b: OneWayMark[]): boolean {
  return a.length === b.length && a.every((m, i) => m.cell === b[i]?.cell && m.dir === b[i]?.dir);
}

function updateRun(doc: EditorDocument, id: string, changes: RunChanges): Executed | null {
  const at = doc.rackRuns.findIndex((r) => r.id === id);
  const run = doc.rackRuns[at];
  if (!run) return null;
  const keys = (Object.keys(changes) as (keyof RunChanges)[]).filter(
    (k) => changes[k] !== undefined && !sameValue(changes[k], run[k]),
  );
  if (keys.length === 0) return null;
  const next = { ...run, ...Object.fromEntries(keys.map((k) => [k, changes[k]])) } as RackRun;
  if (runProblem(doc, next)) return null;
  const back = Object.fromEntries(keys.map((k) => [k, run[k]])) as RunChanges;
  return {
    doc: { ...doc, rackRuns: doc.rackRuns.map((r, i) => (i === at ? next : r)) },
    inverse: { type: "update-rack-run", id, changes: back },
  };
}

function sameValue(a: unknown, b: unknown): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

function resize(doc: EditorDocument, width: number, height: number): Executed | null {
  if ((width === doc.width && height === doc.height) || resizeProblem(doc, width, height)) return null;
  let ground = "";
  for (let y = 0; y < height; y++) {
    ground +=
      y < doc.height
        ? doc.ground.slice(y * doc.width, y * doc.width + Math.min(width, doc.width)) +
          GROUND.outside.repeat(Math.max(0, width - doc.width))
        : GROUND.outside.repeat(width);
  }
  const oneWay = doc.oneWay.flatMap((m) => {
    const x = m.cell % doc.width;
    const y = (m.cell - x) / doc.width;
    return x < width && y < height ? [{ cell: y * width + x, dir: m.dir }] : [];
  });
  return { doc: { ...doc, width, height, ground, oneWay }, inverse: { type: "replace-document", document: doc } };
}

function points(doc: EditorDocument, kind: PointKind): EditorPoint[] {
  return kind === "depot" ? doc.depots : doc.dropoffs;
}

function withPoints(doc: EditorDocument, kind: PointKind, list: EditorPoint[]): EditorDocument {
  return kind === "depot" ? { ...doc, depots: list } : { ...doc, dropoffs: list };
}

function inGrid(doc: Pick<EditorDocument, "width" | "height">, x: number, y: number): boolean {
  return Number.isInteger(x) && Number.isInteger(y) && x >= 0 && y >= 0 && x < doc.width && y < doc.height;
}

function clampIndex(index: number | undefined, length: number): number {
  return index === undefined ? length : Math.max(0, Math.min(length, Math.floor(index)));
}

function insertAt<T>(list: T[], at: number, item: T): T[] {
  return [...list.slice(0, at), item, ...list.slice(at)];
}
