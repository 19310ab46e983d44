import type { Intent } from "./editor-state";
import { toolForKey } from "./tools";

export interface KeyLike {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

const ARROWS: Record<string, [number, number]> = {
  ArrowUp: [0, -1],
  ArrowDown: [0, 1],
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
};

/** The intent a key press stands for in the editor, or null to let the browser have it. */
export function intentForKey(k: KeyLike, ctx: { hasSelection: boolean }): Intent | null {
  const mod = k.ctrlKey || k.metaKey;
  const key = k.key.length === 1 ? k.key.toLowerCase() : k.key;
  if (mod && !k.altKey) {
    if (key === "z") return k.shiftKey ? { type: "redo" } : { type: "undo" };
    if (key === "y") return { type: "redo" };
    return null;
  }
  if (k.altKey || mod) return null;
  const tool = k.key.length === 1 ? toolForKey(key) : undefined;
  if (tool) return { type: "tool", tool };
  if (key === "+" || key === "=") return { type: "zoom", by: "in" };
  if (key === "-" || key === "_") return { type: "zoom", by: "out" };
  if (key === "Escape") return { type: "select", selection: null };
  if (!ctx.hasSelection) return null;
  if (key === "Delete" || key === "Backspace") return { type: "delete-selection" };
  const arrow = ARROWS[key];
  if (arrow) return { type: "nudge", dx: arrow[0], dy: arrow[1] };
  return null;
}
