import type { EditorDocument } from "./document";
import { execute, type Command } from "./commands";

export interface HistoryEntry {
  command: Command;
  inverse: Command;
  /** Identifies the document state this entry leads to, so "unsaved changes" survives undo to the saved state. */
  revision: number;
}

export interface History {
  present: EditorDocument;
  past: HistoryEntry[];
  future: HistoryEntry[];
  /** Revision of the oldest state still reachable by undo. */
  baseRevision: number;
  nextRevision: number;
}

/** Undo steps kept; older ones are forgotten (the saved draft on the server is the long-term record). */
export const HISTORY_LIMIT = 200;

export function startHistory(doc: EditorDocument, revision = 0): History {
  return { present: doc, past: [], future: [], baseRevision: revision, nextRevision: revision + 1 };
}

/** Applies a command as a new undo step; returns the same history when the command changes nothing. */
export function record(h: History, command: Command): History {
  const done = execute(h.present, command);
  if (!done) return h;
  const past = [...h.past, { command, inverse: done.inverse, revision: h.nextRevision }];
  const dropped = past.length > HISTORY_LIMIT ? past.splice(0, past.length - HISTORY_LIMIT) : [];
  return {
    present: done.doc,
    past,
    future: [],
    baseRevision: dropped.length > 0 ? (dropped[dropped.length - 1] as HistoryEntry).revision : h.baseRevision,
    nextRevision: h.nextRevision + 1,
  };
}

export function undo(h: History): History {
  const entry = h.past[h.past.length - 1];
  if (!entry) return h;
  const done = execute(h.present, entry.inverse);
  return { ...h, present: done?.doc ?? h.present, past: h.past.slice(0, -1), future: [entry, ...h.future] };
}

export function redo(h: History): History {
  const entry = h.future[0];
  if (!entry) return h;
  const done = execute(h.present, entry.command);
  return { ...h, present: done?.doc ?? h.present, past: [...h.past, entry], future: h.future.slice(1) };
}

export function canUndo(h: History): boolean {
  return h.past.length > 0;
}

export function canRedo(h: History): boolean {
  return h.future.length > 0;
}

/** The revision of the present document: compare it with the revision last saved to tell unsaved changes. */
export function revision(h: History): number {
  return h.past[h.past.length - 1]?.revision ?? h.baseRevision;
}
