"use client";

import { FileField } from "@/components/FileField";
import { useState } from "react";
import type { RackRun } from "@/lib/floor-plan/document";
import { importRunBins, runBinsUrl, type BadRow } from "./api";

type Props = {
  planId: number;
  run: RackRun;
  /** Saves the draft first when it has unsaved changes; false when that failed. */
  ensureSaved: () => Promise<boolean>;
  onCodes: (codes: RackRun["customCodes"]) => void;
};

/** Export a run's bins as a spreadsheet, edit codes there, import them back as one undoable edit. */
export function RunBinsSpreadsheet({ planId, run, ensureSaved, onCodes }: Props) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; rows: BadRow[] } | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function onFile(file: File) {
    setBusy(true);
    setError(null);
    setDone(null);
    // The server reads the run from the saved draft, so unsaved changes to it are saved first.
    if (!(await ensureSaved())) {
      setBusy(false);
      setError({ message: "Save the draft first, then import again.", rows: [] });
      return;
    }
    const r = await importRunBins(planId, run.id, file);
    setBusy(false);
    if (r.ok) {
      onCodes(r.data.customCodes);
      const n = r.data.customCodes.length;
      setDone(
        n === 0
          ? "Every code matches the pattern; nothing to change."
          : `${n} ${n === 1 ? "code differs" : "codes differ"} from the pattern. Undo takes the import back.`,
      );
    } else {
      const rows = (r.body as { rows?: BadRow[] } | null | undefined)?.rows;
      setError({ message: r.message, rows: Array.isArray(rows) ? rows : [] });
    }
  }

  return (
    <div className="space-y-2 border-t border-rack-light pt-3">
      <h3 className="font-semibold">Bins spreadsheet</h3>
      <p className="text-sm text-ink-soft">Download the saved run&apos;s bins, change codes, and import the sheet.</p>
      <div className="flex flex-wrap gap-2">
        <a className="btn-quiet" href={runBinsUrl(planId, run.id, "xlsx")} download>
          Download .xlsx
        </a>
        <a className="btn-quiet" href={runBinsUrl(planId, run.id, "csv")} download>
          Download .csv
        </a>
      </div>
      <FileField
        label="Import codes (.xlsx or .csv)"
        accept=".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv"
        disabled={busy}
        onFile={(f) => void onFile(f)}
      />
      {busy && (
        <p className="text-sm" role="status">
          Reading the sheet…
        </p>
      )}
      {done && (
        <p className="notice-info text-sm" role="status">
          {done}
        </p>
      )}
      {error && (
        <div className="notice-error text-sm" role="alert">
          <p>{error.message}</p>
          {error.rows.length > 0 && (
            <ul className="mt-1 max-h-40 list-disc overflow-y-auto pl-5">
              {error.rows.map((r) => (
                <li key={`${r.row}-${r.message}`}>
                  Row {r.row}: {r.message}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
