import type { Side } from "@/lib/routing/drawing";
import type { EditorDocument } from "./document";
import type { Command, PointKind } from "./commands";
import { canRedo, canUndo, record, redo, revision, startHistory, undo, type History } from "./history";
import { toolRow, type Tool } from "./tools";

export type { Tool } from "./tools";
export type Selection = { kind: "run" | PointKind; id: string } | null;
export type PaintShape = "brush" | "rect";

export interface EditorState {
  history: History;
  canEdit: boolean;
  tool: Tool;
  selection: Selection;
  /** Screen pixels per cell. */
  cellPx: number;
  paintShape: PaintShape;
  /** Walking direction the one-way tool paints, or null to clear marks. */
  oneWayDir: Side | null;
  /** History revision last saved to the server. */
  savedRevision: number;
}

/** Everything a person can ask of the editor, whether from the toolbar, a key or a menu. */
export type Intent =
  | { type: "do"; command: Command }
  | { type: "undo" }
  | { type: "redo" }
  | { type: "tool"; tool: Tool }
  | { type: "select"; selection: Selection }
  | { type: "delete-selection" }
  | { type: "nudge"; dx: number; dy: number }
  | { type: "zoom"; by: "in" | "out" }
  | { type: "set-zoom"; cellPx: number }
  | { type: "paint-shape"; shape: PaintShape }
  | { type: "one-way-dir"; dir: Side | null }
  /** A draft arrived from the server: start a fresh history there. */
  | { type: "load"; document: EditorDocument }
  /** The document of `revision` (by default the present one) was saved. */
  | { type: "saved"; revision?: number };

export const ZOOM_STEPS = [3, 4, 6, 8, 10, 12, 16, 20, 24, 32, 40, 48, 64] as const;
export const DEFAULT_CELL_PX = 20;
export const MIN_CELL_PX = ZOOM_STEPS[0];
export const MAX_CELL_PX = ZOOM_STEPS[ZOOM_STEPS.length - 1] as number;

export function initialEditorState(document: EditorDocument, canEdit: boolean): EditorState {
  return {
    history: startHistory(document),
    canEdit,
    tool: "select",
    selection: null,
    cellPx: DEFAULT_CELL_PX,
    paintShape: "brush",
    oneWayDir: "N",
    savedRevision: 0,
  };
}

export function editorReducer(state: EditorState, intent: Intent): EditorState {
  switch (intent.type) {
    case "do":
      return state.canEdit ? withHistory(state, record(state.history, intent.command)) : state;
    case "undo":
      return state.canEdit && canUndo(state.history) ? withHistory(state, undo(state.history)) : state;
    case "redo":
      return state.canEdit && canRedo(state.history) ? withHistory(state, redo(state.history)) : state;
    case "tool": {
      const row = toolRow(intent.tool);
      if (!state.canEdit && row.edits) return state;
      return { ...state, tool: intent.tool, selection: row.keepsSelection ? state.selection : null };
    }
    case "select":
      return {
        ...state,
        selection: intent.selection && exists(state.history.present, intent.selection) ? intent.selection : null,
      };
    case "delete-selection": {
      const s = state.selection;
      if (!s || !state.canEdit) return state;
      const command: Command =
        s.kind === "run" ? { type: "delete-rack-run", id: s.id } : { type: "delete-point", kind: s.kind, id: s.id };
      return { ...withHistory(state, record(state.history, command)), selection: null };
    }
    case "nudge": {
      const s = state.selection;
      if (!s || !state.canEdit) return state;
      const doc = state.history.present;
      if (s.kind === "run")
        return withHistory(
          state,
          record(state.history, { type: "move-rack-run", id: s.id, dx: intent.dx, dy: intent.dy }),
        );
      const p = (s.kind === "depot" ? doc.depots : doc.dropoffs).find((q) => q.id === s.id);
      if (!p) return state;
      return withHistory(
        state,
        record(state.history, { type: "move-point", kind: s.kind, id: s.id, x: p.x + intent.dx, y: p.y + intent.dy }),
      );
    }
    case "zoom": {
      const i = ZOOM_STEPS.findIndex((z) => z >= state.cellPx);
      const at = i < 0 ? ZOOM_STEPS.length - 1 : i;
      const next =
        intent.by === "in"
          ? ZOOM_STEPS[Math.min(ZOOM_STEPS.length - 1, ZOOM_STEPS[at] === state.cellPx ? at + 1 : at)]
          : ZOOM_STEPS[Math.max(0, at - 1)];
      return { ...state, cellPx: next ?? state.cellPx };
    }
    case "set-zoom":
      return { ...state, cellPx: Math.min(MAX_CELL_PX, Math.max(MIN_CELL_PX, intent.cellPx)) };
    case "paint-shape":
      return { ...state, paintShape: intent.shape };
    case "one-way-dir":
      return { ...state, oneWayDir: intent.dir };
    case "load":
      return { ...state, history: startHistory(intent.document), selection: null, savedRevision: 0 };
    case "saved":
      return { ...state, savedRevision: intent.revision ?? revision(state.history) };
  }
}

export function isDirty(state: EditorState): boolean {
  return revision(state.history) !== state.savedRevision;
}

function withHistory(state: EditorState, history: History): EditorState {
  if (history === state.history) return state;
  // An undo can take away the selected run or point; keep the selection only while it exists.
  const selection = state.selection && exists(history.present, state.selection) ? state.selection : null;
  return { ...state, history, selection };
}

function exists(doc: EditorDocument, s: NonNullable<Selection>): boolean {
  const list = s.kind === "run" ? doc.rackRuns : s.kind === "depot" ? doc.depots : doc.dropoffs;
  return list.some((x) => x.id === s.id);
}
