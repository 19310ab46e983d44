"use client";

import type { Problem } from "@/lib/floor-plan/checks";

type Props = { problems: Problem[]; onLocate: (p: Problem) => void; stale?: boolean };

/** The live checks, errors first; each one can be clicked to zoom to the cells it is about. */
export function ChecksPanel({ problems, onLocate, stale }: Props) {
  const errors = problems.filter((p) => p.severity === "error").length;
  const warnings = problems.length - errors;
  return (
    <section aria-labelledby="checks-title" className="card space-y-3">
      <h2 id="checks-title">Checks</h2>
      <p className="text-sm text-ink-soft" aria-live="polite">
        {problems.length === 0
          ? "No problems: every bin can be reached on a walk from a depot to a drop-off."
          : `${errors} ${errors === 1 ? "error" : "errors"} (they block publishing), ${warnings} ${warnings === 1 ? "warning" : "warnings"}.`}
        {stale && " Checking…"}
      </p>
      {problems.length > 0 && (
        <ul className="max-h-80 space-y-2 overflow-y-auto pr-1">
          {problems.map((p, i) => (
            <li key={`${p.kind}-${i}`}>
              <button
                type="button"
                onClick={() => onLocate(p)}
                className={`w-full rounded-md border-l-8 px-3 py-2 text-left text-sm hover:bg-paper-sunk ${p.severity === "error" ? "border-alarm bg-alarm-light" : "border-signal bg-signal-light"}`}
              >
                <span className="font-semibold">{p.severity === "error" ? "Error: " : "Warning: "}</span>
                {p.message}
                {p.cells.length > 0 && <span className="mt-1 block text-ink-soft underline">Show on the plan</span>}
              </button>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
