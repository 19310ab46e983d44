"use client";

import { useState } from "react";
import { useSWRConfig } from "swr";
import { FileField } from "@/components/FileField";
import { FailureNotice } from "@/components/FailureNotice";
import { requestJson, type ApiFailure } from "@/lib/client/fetch-json";
import type { ImportKind } from "@/lib/imports/fields";
import { MappingFields } from "./MappingFields";
import { PreviewTable } from "./PreviewTable";
import { ProblemList } from "./ProblemList";
import { importedSentence } from "./import-text";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime } from "@/lib/format/dates";
import type { ImportAnswer, PreviewAnswer, RowProblem } from "@/lib/contracts/imports";
import type { VersionOption } from "@/lib/contracts/layout-versions";

type Props = {
  kind: ImportKind;
  title: string;
  versions: VersionOption[];
  /** SWR keys starting with this are fetched again after an import (the lists on the page). */
  refreshPrefix: string;
};

const ACCEPT = ".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv";

function form(file: File, versionId: number, mapping: Record<string, number | null> | null): FormData {
  const f = new FormData();
  f.append("file", file);
  f.append("layoutVersionId", String(versionId));
  if (mapping) f.append("mapping", JSON.stringify(mapping));
  return f;
}

/** Layout version → file → preview with column choices and row problems → import, all or nothing. */
export function ImportPanel({ kind, title, versions, refreshPrefix }: Props) {
  const { mutate } = useSWRConfig();
  const style = useDateStyle();
  const [versionId, setVersionId] = useState<number | null>(versions[0]?.id ?? null);
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<Record<string, number | null> | null>(null);
  const [answer, setAnswer] = useState<PreviewAnswer | null>(null);
  const [rejected, setRejected] = useState<RowProblem[]>([]);
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState<"reading" | "importing" | null>(null);

  async function preview(f: File, v: number, m: Record<string, number | null> | null) {
    setBusy("reading");
    setFailure(null);
    setRejected([]);
    setDone(null);
    const r = await requestJson<PreviewAnswer>("POST", `/api/imports/${kind}/preview`, form(f, v, m));
    setBusy(null);
    if (r.ok) setAnswer(r.data);
    else {
      setAnswer(null);
      setFailure(r);
    }
  }

  function chooseFile(f: File) {
    setFile(f);
    setMapping(null);
    if (versionId !== null) void preview(f, versionId, null);
  }

  function chooseColumn(key: string, column: number | null) {
    if (!answer || !file || versionId === null) return;
    const next = { ...answer.mapping, [key]: column };
    setMapping(next);
    void preview(file, versionId, next);
  }

  async function runImport() {
    if (!file || versionId === null) return;
    setBusy("importing");
    setFailure(null);
    const r = await requestJson<ImportAnswer>("POST", `/api/imports/${kind}`, form(file, versionId, mapping));
    setBusy(null);
    if (r.ok) {
      setDone(importedSentence(kind, r.data, style));
      setAnswer(null);
      setFile(null);
      setMapping(null);
      await mutate((key) => typeof key === "string" && key.startsWith(refreshPrefix));
    } else {
      const rows = (r.body as { rows?: RowProblem[] } | null | undefined)?.rows;
      setRejected(Array.isArray(rows) ? rows : []);
      setFailure(Array.isArray(rows) ? null : r);
    }
  }

  const problems = rejected.length ? rejected : (answer?.problems ?? []);
  // The column choices show only when the sheet's headers are not the template's own.
  const headersDiffer = answer?.fields.some((f) => {
    const at = answer.mapping[f.key];
    return at === null || at === undefined ? f.required : answer.headers[at] !== f.label;
  });
  const rows = answer?.counts.rows ?? 0;

  return (
    <section className="card space-y-4" aria-labelledby={`import-${kind}`}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id={`import-${kind}`}>{title}</h2>
        <a className="btn-quiet" href={`/api/imports/${kind}/template`} download>
          Download template
        </a>
      </div>
      {versions.length === 0 ? (
        <p className="notice-info">
          No layout version is published yet. Bins are checked against a published layout version: ask a layout admin to
          publish the floor plan.
        </p>
      ) : (
        <>
          <label className="block max-w-md">
            <span className="label">Check bins against layout version</span>
            <select
              className="field"
              value={versionId ?? ""}
              disabled={busy !== null}
              onChange={(e) => {
                const v = Number(e.target.value);
                setVersionId(v);
                if (file) void preview(file, v, mapping);
              }}
            >
              {versions.map((v) => (
                <option key={v.id} value={v.id}>
                  {v.label}
                </option>
              ))}
            </select>
          </label>
          <FileField
            label="Spreadsheet (.xlsx or .csv)"
            accept={ACCEPT}
            disabled={busy !== null}
            onFile={chooseFile}
            hint={file ? `Chosen: ${file.name}` : "Nothing is written until you press Import."}
          />
        </>
      )}
      {busy && (
        <p role="status" className="text-ink-soft">
          {busy === "reading" ? "Reading the sheet…" : "Importing…"}
        </p>
      )}
      {done && (
        <p role="status" className="notice-info">
          {done}
        </p>
      )}
      <FailureNotice failure={failure} />
      {answer && (
        <>
          {answer.duplicate && (
            <p className="notice-info">
              This exact file was imported on {formatDateTime(answer.duplicate.importedAt, style)} as “
              {answer.duplicate.filename}”.
              {kind === "orders"
                ? " Importing it again adds nothing."
                : " Importing it again sets the same SKUs again."}
            </p>
          )}
          {headersDiffer || mapping ? (
            <MappingFields answer={answer} disabled={busy !== null} onChange={chooseColumn} />
          ) : (
            <p className="text-sm text-ink-soft">Every column was found by its template header.</p>
          )}
          <PreviewTable answer={answer} />
          <p>
            {rows} {rows === 1 ? "row" : "rows"}
            {kind === "items" ? `, ${answer.counts.items ?? 0} SKUs` : `, ${answer.counts.orders ?? 0} orders`}.
          </p>
        </>
      )}
      <ProblemList problems={problems} />
      {answer && (
        <button
          type="button"
          className="btn-primary w-full sm:w-auto"
          disabled={busy !== null || problems.length > 0 || rows === 0}
          onClick={() => void runImport()}
        >
          Import {rows} {rows === 1 ? "row" : "rows"}
        </button>
      )}
    </section>
  );
}
