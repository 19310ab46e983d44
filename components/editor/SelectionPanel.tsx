"use client";

import type { RackRun } from "@/lib/floor-plan/document";
import type { EditorState, Intent } from "@/lib/floor-plan/editor-state";
import { RackRunForm } from "./RackRunForm";
import { PointPanel } from "./PointPanel";
import { RunBinsSpreadsheet } from "./RunBinsSpreadsheet";

type Props = {
  planId: number;
  state: EditorState;
  dispatch: (i: Intent) => void;
  pendingRun: RackRun | null;
  onAddRun: (run: RackRun) => void;
  onCancelRun: () => void;
  ensureSaved: () => Promise<boolean>;
};

/** What is selected (or just drawn), with its settings. */
export function SelectionPanel({ planId, state, dispatch, pendingRun, onAddRun, onCancelRun, ensureSaved }: Props) {
  const doc = state.history.present;
  const sel = state.selection;
  const run = sel?.kind === "run" ? doc.rackRuns.find((r) => r.id === sel.id) : undefined;
  const point =
    sel && sel.kind !== "run"
      ? (sel.kind === "depot" ? doc.depots : doc.dropoffs).find((p) => p.id === sel.id)
      : undefined;

  let body: React.ReactNode = (
    <p className="text-sm text-ink-soft">
      Nothing selected.{" "}
      {state.canEdit ? "Draw a rack run with R, or select one with V." : "Click a rack run to see its numbering."}
    </p>
  );
  if (pendingRun) {
    body = (
      <RackRunForm
        key={`new-${pendingRun.x}-${pendingRun.y}-${pendingRun.orientation}-${pendingRun.length}`}
        doc={doc}
        run={pendingRun}
        mode="new"
        canEdit={state.canEdit}
        onSubmit={onAddRun}
        onCancel={onCancelRun}
      />
    );
  } else if (run) {
    const { id, ...rest } = run;
    body = (
      <div className="space-y-3">
        <RackRunForm
          key={JSON.stringify(run)}
          doc={doc}
          run={run}
          mode="edit"
          canEdit={state.canEdit}
          onSubmit={(next) => {
            const { id: _same, ...changes } = next;
            dispatch({ type: "do", command: { type: "update-rack-run", id, changes } });
          }}
          onDelete={() => dispatch({ type: "delete-selection" })}
        />
        <RunBinsSpreadsheet
          key={id}
          planId={planId}
          run={{ id, ...rest }}
          ensureSaved={ensureSaved}
          onCodes={(customCodes) => dispatch({ type: "do", command: { type: "set-custom-codes", id, customCodes } })}
        />
      </div>
    );
  } else if (point && sel && sel.kind !== "run") {
    body = (
      <PointPanel
        key={`${sel.kind}-${point.id}-${point.name}`}
        point={point}
        kind={sel.kind}
        canEdit={state.canEdit}
        onRename={(name) =>
          dispatch({
            type: "do",
            command: { type: "rename-point", kind: sel.kind as "depot" | "dropoff", id: point.id, name },
          })
        }
        onDelete={() => dispatch({ type: "delete-selection" })}
      />
    );
  }
  return (
    <section aria-labelledby="selection-title" className="card space-y-3">
      <h2 id="selection-title">
        {pendingRun
          ? "New rack run"
          : run
            ? "Rack run"
            : point
              ? sel?.kind === "depot"
                ? "Depot"
                : "Drop-off"
              : "Selection"}
      </h2>
      {body}
    </section>
  );
}
