"use client";

import { useCallback, useDeferredValue, useEffect, useMemo, useReducer, useRef, useState } from "react";
import type { EditorDocument, RackRun } from "@/lib/floor-plan/document";
import { checkDocument, hasErrors, type Problem } from "@/lib/floor-plan/checks";
import { nextId } from "@/lib/floor-plan/commands";
import { editorReducer, initialEditorState, isDirty, type Intent } from "@/lib/floor-plan/editor-state";
import { intentForKey } from "@/lib/floor-plan/shortcuts";
import { backgroundUrl } from "./api";
import { EditorToolbar } from "./EditorToolbar";
import type { DrawnRun } from "@/lib/floor-plan/gestures";
import { EditorCanvas, type Focus } from "./EditorCanvas";
import { RULER_PX } from "./Rulers";
import { ChecksPanel } from "./ChecksPanel";
import { BinListPanel } from "./BinListPanel";
import { SelectionPanel } from "./SelectionPanel";
import { BackgroundPanel } from "./BackgroundPanel";
import { GridSettings } from "./GridSettings";
import { SaveBar } from "./SaveBar";
import { useDraftSync } from "./useDraftSync";

type Props = { planId: number; canEdit: boolean; version: number; document: EditorDocument; onReload: () => void };

const DEFAULT_PATTERN = "{aisle:2}-{bay:3}-{level}";

/** One editing session on one loaded draft version; the parent remounts it to load another. */
export function EditorSession({ planId, canEdit, version, document, onReload }: Props) {
  const [state, rawDispatch] = useReducer(editorReducer, undefined, () => initialEditorState(document, canEdit));
  const [pendingRun, setPendingRun] = useState<RackRun | null>(null);
  const [focus, setFocus] = useState<Focus | null>(null);
  const scrollRef = useRef<HTMLDivElement | null>(null);
  const lastRun = useRef<RackRun | null>(null);
  const doc = state.history.present;
  const dirty = isDirty(state);

  const dispatch = useCallback((i: Intent) => {
    if (i.type === "tool") setPendingRun(null);
    rawDispatch(i);
  }, []);
  const sync = useDraftSync(planId, version, state, dispatch);
  // A located problem stays outlined until the next edit, which may well have fixed it.
  useEffect(() => setFocus(null), [doc]);

  // Checks run on a deferred copy so dragging stays smooth on large plans.
  const checkedDoc = useDeferredValue(doc);
  const problems = useMemo(() => checkDocument(checkedDoc), [checkedDoc]);
  const shownProblems = sync.serverProblems.length > 0 && checkedDoc === doc && !dirty ? sync.serverProblems : problems;
  const problemCells = useMemo(
    () => [...new Set(problems.filter((p) => p.severity === "error").flatMap((p) => p.cells))].slice(0, 5000),
    [problems],
  );

  const fit = useCallback(() => {
    const box = scrollRef.current;
    if (!box) return;
    const px = Math.floor(
      Math.min(
        (box.clientWidth - RULER_PX - 4) / doc.width,
        (Math.max(box.clientHeight, 320) - RULER_PX - 4) / doc.height,
      ),
    );
    dispatch({ type: "set-zoom", cellPx: px });
  }, [doc.width, doc.height, dispatch]);
  // Fit once on opening; later size changes are the person's own zoom.
  useEffect(fit, []); // fit is deliberately not a dependency

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (e.defaultPrevented || (t && (t.isContentEditable || /^(INPUT|TEXTAREA|SELECT)$/.test(t.tagName)))) return;
      const intent = intentForKey(e, { hasSelection: state.selection !== null });
      if (!intent) return;
      e.preventDefault();
      if (intent.type === "select" && intent.selection === null) setPendingRun(null);
      dispatch(intent);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [dispatch, state.selection]);

  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);

  function onRackDrawn(drawn: DrawnRun) {
    const t = lastRun.current;
    const aisle = t ? t.aisle : Math.max(0, ...doc.rackRuns.map((r) => r.aisle)) + 1;
    setPendingRun({
      id: nextId(doc, "run"),
      ...drawn,
      facing: drawn.orientation === "h" ? "S" : "E",
      aisle,
      firstBay: 1,
      bayStep: t?.bayStep ?? 1,
      bayDirection: t?.bayDirection ?? "forward",
      levels: t?.levels ?? 4,
      pattern: t?.pattern ?? DEFAULT_PATTERN,
      customCodes: [],
    });
    dispatch({ type: "select", selection: null });
  }

  function addRun(run: RackRun) {
    dispatch({ type: "do", command: { type: "add-rack-run", run } });
    dispatch({ type: "select", selection: { kind: "run", id: run.id } });
    lastRun.current = run;
    setPendingRun(null);
  }

  function locate(p: Problem) {
    setFocus((f) => ({ cells: p.cells, nonce: (f?.nonce ?? 0) + 1 }));
    if (p.runId) dispatch({ type: "select", selection: { kind: "run", id: p.runId } });
  }

  const errors = hasErrors(problems);
  const publishBlocked = !canEdit
    ? "Publishing is for layout admins."
    : errors
      ? "Publishing waits until the checks show no errors: fix the ones listed under Checks."
      : checkedDoc !== doc
        ? "Checking the latest edit…"
        : null;
  const bgUrl = doc.background ? backgroundUrl(planId, doc.background.fileId) : null;

  return (
    <div className="space-y-4">
      {canEdit && (
        <SaveBar
          planId={planId}
          dirty={dirty}
          saving={sync.saving}
          publishing={sync.publishing}
          publishBlocked={publishBlocked}
          conflict={sync.conflict}
          notice={sync.notice}
          jobId={sync.jobId}
          onSave={() => void sync.save()}
          onPublish={() => void sync.publish()}
          onReload={onReload}
          onKeepEditing={sync.dismissConflict}
        />
      )}
      <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 space-y-2">
          <EditorToolbar state={state} dispatch={dispatch} onFit={fit} />
          <p className="text-sm">
            Scale: 1 cell = {(doc.cellMm / 1000).toLocaleString()} m · plan{" "}
            {((doc.width * doc.cellMm) / 1000).toLocaleString()} × {((doc.height * doc.cellMm) / 1000).toLocaleString()}{" "}
            m ({doc.width} × {doc.height} cells) · zoom {state.cellPx} px per cell
          </p>
          <EditorCanvas
            state={state}
            dispatch={dispatch}
            problemCells={problemCells}
            focus={focus}
            backgroundUrl={bgUrl}
            pendingRun={pendingRun}
            onRackDrawn={onRackDrawn}
            scrollRef={scrollRef}
          />
          <Legend />
        </div>
        <aside className="min-w-0 space-y-4">
          <SelectionPanel
            planId={planId}
            state={state}
            dispatch={dispatch}
            pendingRun={pendingRun}
            onAddRun={addRun}
            onCancelRun={() => setPendingRun(null)}
            ensureSaved={sync.save}
          />
          <ChecksPanel problems={shownProblems} onLocate={locate} stale={checkedDoc !== doc} />
          {canEdit && (
            <details className="card">
              <summary className="min-h-tap cursor-pointer py-2 font-semibold">Background picture</summary>
              <BackgroundPanel planId={planId} doc={doc} dispatch={dispatch} />
            </details>
          )}
          {canEdit && (
            <details className="card">
              <summary className="min-h-tap cursor-pointer py-2 font-semibold">Grid size</summary>
              <GridSettings key={`${doc.width}x${doc.height}x${doc.cellMm}`} doc={doc} dispatch={dispatch} />
            </details>
          )}
        </aside>
      </div>
      <BinListPanel document={checkedDoc} />
    </div>
  );
}

function Legend() {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Legend">
      <li>
        <span className="mr-1 inline-block h-3 w-3 border border-rack bg-paper-raised align-middle" />
        walkable floor
      </li>
      <li>
        <span className="mr-1 inline-block h-3 w-3 bg-ink-soft align-middle" />
        blocked (hatched)
      </li>
      <li>
        <span className="mr-1 inline-block h-3 w-3 bg-paper-sunk align-middle" />
        outside
      </li>
      <li>
        <span className="mr-1 inline-block h-3 w-3 border border-rack bg-rack-light align-middle" />
        rack run, thick edge = picking side
      </li>
      <li>
        <span className="mr-1 font-bold text-signal">↑</span>one-way
      </li>
      <li>
        <span className="mr-1 inline-block bg-trail px-1 text-xs font-bold text-white">D</span>depot (square)
      </li>
      <li>
        <span className="mr-1 inline-block rotate-45 bg-trail px-1 text-xs font-bold text-white">
          <span className="inline-block -rotate-45">P</span>
        </span>
        drop-off (diamond)
      </li>
      <li>
        <span className="mr-1 inline-block h-3 w-3 border-2 border-dashed border-alarm align-middle" />
        cell with a problem
      </li>
    </ul>
  );
}
