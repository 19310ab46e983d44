"use client";

import { useState } from "react";
import { MAX_LEVELS, type EditorDocument, type RackRun } from "@/lib/floor-plan/document";
import { bayRange, formatCode } from "@/lib/floor-plan/bin-codes";
import { runProblem } from "@/lib/floor-plan/commands";

type Props = {
  doc: EditorDocument;
  run: RackRun;
  mode: "new" | "edit";
  canEdit: boolean;
  onSubmit: (run: RackRun) => void;
  onCancel?: () => void;
  onDelete?: () => void;
};

/** Numbering and shape of one rack run: a new one just drawn, or the selected one. */
export function RackRunForm({ doc, run: initial, mode, canEdit, onSubmit, onCancel, onDelete }: Props) {
  const [run, setRun] = useState(initial);
  const set = <K extends keyof RackRun>(k: K, v: RackRun[K]) => setRun((r) => ({ ...r, [k]: v }));
  const num = (k: "aisle" | "firstBay" | "levels" | "length" | "x" | "y") => (e: React.ChangeEvent<HTMLInputElement>) =>
    set(k, Math.trunc(Number(e.target.value)));
  const problem = runProblem(doc, run);
  const [lo, hi] = bayRange(run);
  const example = problem
    ? null
    : `${formatCode(run.pattern, { aisle: run.aisle, bay: lo, level: 1 })} … ${formatCode(run.pattern, { aisle: run.aisle, bay: hi, level: run.levels })}`;
  const sides = run.orientation === "h" ? (["N", "S"] as const) : (["E", "W"] as const);
  const sideName = { N: "north (up)", S: "south (down)", E: "east (right)", W: "west (left)" } as const;
  const ro = !canEdit;

  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!problem) onSubmit(run);
      }}
    >
      <p className="text-sm text-ink-soft">
        {mode === "new" ? "New rack run" : `Rack run ${run.id}`}: {run.orientation === "h" ? "across" : "down"},{" "}
        {run.length} {run.length === 1 ? "bay" : "bays"} of {(doc.cellMm / 1000).toLocaleString()} m.
      </p>
      <div className="grid grid-cols-2 gap-3">
        <label>
          <span className="label">Aisle</span>
          <input
            className="field"
            type="number"
            min={1}
            max={999}
            value={run.aisle}
            onChange={num("aisle")}
            disabled={ro}
          />
        </label>
        <label>
          <span className="label">Levels</span>
          <input
            className="field"
            type="number"
            min={1}
            max={MAX_LEVELS}
            value={run.levels}
            onChange={num("levels")}
            disabled={ro}
          />
        </label>
        <label>
          <span className="label">First bay</span>
          <input
            className="field"
            type="number"
            min={1}
            value={run.firstBay}
            onChange={num("firstBay")}
            disabled={ro}
          />
        </label>
        <label>
          <span className="label">Bay numbers</span>
          <select
            className="field"
            value={run.bayStep}
            onChange={(e) => set("bayStep", e.target.value === "2" ? 2 : 1)}
            disabled={ro}
          >
            <option value={1}>every bay (1, 2, 3…)</option>
            <option value={2}>every other (odd or even)</option>
          </select>
        </label>
        <label>
          <span className="label">Count bays</span>
          <select
            className="field"
            value={run.bayDirection}
            onChange={(e) => set("bayDirection", e.target.value === "reverse" ? "reverse" : "forward")}
            disabled={ro}
          >
            <option value="forward">{run.orientation === "h" ? "left to right" : "top to bottom"}</option>
            <option value="reverse">{run.orientation === "h" ? "right to left" : "bottom to top"}</option>
          </select>
        </label>
        <label>
          <span className="label">Picked from</span>
          <select
            className="field"
            value={run.facing}
            onChange={(e) => set("facing", e.target.value as RackRun["facing"])}
            disabled={ro}
          >
            {sides.map((s) => (
              <option key={s} value={s}>
                {sideName[s]}
              </option>
            ))}
          </select>
        </label>
        {mode === "edit" && (
          <label>
            <span className="label">Bays in the run</span>
            <input className="field" type="number" min={1} value={run.length} onChange={num("length")} disabled={ro} />
          </label>
        )}
      </div>
      <label className="block">
        <span className="label">Location code pattern</span>
        <input
          className="field font-mono"
          value={run.pattern}
          onChange={(e) => set("pattern", e.target.value)}
          disabled={ro}
          aria-describedby="pattern-help"
        />
        <span id="pattern-help" className="mt-1 block text-sm text-ink-soft">
          Use {"{aisle}"}, {"{bay}"} and {"{level}"}; {"{bay:3}"} pads to 3 digits.
        </span>
      </label>
      {problem ? (
        <p className="notice-error text-sm">{problem}</p>
      ) : (
        <p className="text-sm">
          Codes: <span className="font-mono">{example}</span>
          {run.customCodes.length > 0 && ` (${run.customCodes.length} imported codes replace the pattern)`}
        </p>
      )}
      {canEdit && (
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary" disabled={!!problem}>
            {mode === "new" ? "Add rack run" : "Apply changes"}
          </button>
          {onCancel && (
            <button type="button" className="btn-quiet" onClick={onCancel}>
              Cancel
            </button>
          )}
          {onDelete && (
            <button type="button" className="btn-danger" onClick={onDelete}>
              Delete run
            </button>
          )}
        </div>
      )}
    </form>
  );
}
