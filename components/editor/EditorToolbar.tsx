"use client";

import type { Side } from "@/lib/routing/drawing";
import type { EditorState, Intent } from "@/lib/floor-plan/editor-state";
import { offeredTools, paintsWith, toolRow } from "@/lib/floor-plan/tools";
import { describeCommand } from "@/lib/floor-plan/commands";
import { canRedo, canUndo } from "@/lib/floor-plan/history";

const DIRS: { dir: Side | null; label: string; glyph: string }[] = [
  { dir: "N", label: "Walk north (up)", glyph: "↑" },
  { dir: "E", label: "Walk east (right)", glyph: "→" },
  { dir: "S", label: "Walk south (down)", glyph: "↓" },
  { dir: "W", label: "Walk west (left)", glyph: "←" },
  { dir: null, label: "Clear one-way marks", glyph: "✕" },
];

type Props = { state: EditorState; dispatch: (i: Intent) => void; onFit: () => void };

/** Tools, undo/redo and zoom. Every button sends the same intents as the keyboard. */
export function EditorToolbar({ state, dispatch, onFit }: Props) {
  const { history, canEdit, tool } = state;
  const lastDone = history.past[history.past.length - 1];
  const nextRedo = history.future[0];
  const tools = offeredTools(canEdit);
  const painting = paintsWith(tool) !== undefined;
  return (
    <div className="space-y-2">
      <div role="toolbar" aria-label="Floor plan tools" className="flex flex-wrap items-center gap-2">
        {tools.map((t) => (
          <button
            key={t.tool}
            type="button"
            aria-pressed={tool === t.tool}
            aria-keyshortcuts={t.key}
            onClick={() => dispatch({ type: "tool", tool: t.tool })}
            className={tool === t.tool ? "btn-primary px-3" : "btn-quiet px-3"}
            title={`${t.label} (${t.key})`}
          >
            {t.label}
            <kbd className="text-xs opacity-75">{t.key}</kbd>
          </button>
        ))}
        {canEdit && (
          <>
            <span className="mx-1 h-8 w-px bg-rack-light" aria-hidden="true" />
            <button
              type="button"
              className="btn-quiet px-3"
              onClick={() => dispatch({ type: "undo" })}
              disabled={!canUndo(history)}
              aria-keyshortcuts="Control+Z"
              title="Ctrl+Z"
            >
              Undo{lastDone ? ` ${describeCommand(lastDone.command)}` : ""}
            </button>
            <button
              type="button"
              className="btn-quiet px-3"
              onClick={() => dispatch({ type: "redo" })}
              disabled={!canRedo(history)}
              aria-keyshortcuts="Control+Shift+Z"
              title="Ctrl+Shift+Z"
            >
              Redo{nextRedo ? ` ${describeCommand(nextRedo.command)}` : ""}
            </button>
          </>
        )}
        <span className="mx-1 h-8 w-px bg-rack-light" aria-hidden="true" />
        <button
          type="button"
          className="btn-quiet min-w-tap px-3"
          onClick={() => dispatch({ type: "zoom", by: "out" })}
          aria-label="Zoom out"
          aria-keyshortcuts="-"
        >
          −
        </button>
        <button
          type="button"
          className="btn-quiet min-w-tap px-3"
          onClick={() => dispatch({ type: "zoom", by: "in" })}
          aria-label="Zoom in"
          aria-keyshortcuts="+"
        >
          +
        </button>
        <button type="button" className="btn-quiet px-3" onClick={onFit}>
          Fit
        </button>
      </div>
      {canEdit && painting && (
        <div className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label="Paint shape">
          <span>Paint as</span>
          <button
            type="button"
            className={state.paintShape === "brush" ? "btn-primary px-3" : "btn-quiet px-3"}
            aria-pressed={state.paintShape === "brush"}
            onClick={() => dispatch({ type: "paint-shape", shape: "brush" })}
          >
            Brush
          </button>
          <button
            type="button"
            className={state.paintShape === "rect" ? "btn-primary px-3" : "btn-quiet px-3"}
            aria-pressed={state.paintShape === "rect"}
            onClick={() => dispatch({ type: "paint-shape", shape: "rect" })}
          >
            Rectangle
          </button>
          <span className="text-ink-soft">(hold Shift for the other)</span>
        </div>
      )}
      {canEdit && tool === "one-way" && (
        <div className="space-y-2">
          <div className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label="One-way direction">
            <span>Walking direction</span>
            {DIRS.map((d) => (
              <button
                key={d.label}
                type="button"
                aria-label={d.label}
                title={d.label}
                aria-pressed={state.oneWayDir === d.dir}
                className={state.oneWayDir === d.dir ? "btn-primary min-w-tap px-3" : "btn-quiet min-w-tap px-3"}
                onClick={() => dispatch({ type: "one-way-dir", dir: d.dir })}
              >
                {d.glyph}
              </button>
            ))}
          </div>
          <p className="notice-info text-sm">
            One-way and forklift aisles follow site rules: mark them as the site&apos;s traffic plan says. Trailbin only
            plans walking routes; site safety rules always come first.
          </p>
        </div>
      )}
      <p className="text-sm text-ink-soft">
        {canEdit
          ? toolRow(tool).hint
          : "You can look at the drawing, its bins and its checks; editing is for layout admins. Drag to pan."}
      </p>
    </div>
  );
}
