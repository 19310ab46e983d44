"use client";

import { useMemo, useState } from "react";
import { FloorPlanView } from "@/components/floor/FloorPlanView";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { requestJson } from "@/lib/client/fetch-json";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { BinRowDTO } from "@/lib/contracts/layout-versions";
import { documentBins } from "@/lib/floor-plan/bin-codes";

export type VersionBin = BinRowDTO & { fromDepot: { depot: string; mm: number } | null };

type Answer = { from: string; to: string; distanceMm: number; cells: number[] };

import { metres } from "@/lib/format/units";

export function VersionExplorer({
  layoutVersionId,
  document,
  bins,
}: {
  layoutVersionId: number;
  document: EditorDocument;
  bins: VersionBin[];
}) {
  const [hovered, setHovered] = useState<number | null>(null);
  const binByCode = useMemo(() => new Map(bins.map((b) => [b.code, b])), [bins]);
  // Rack cell → its bins, to answer "how far is this from the depot?" under the pointer.
  const codesByCell = useMemo(() => {
    const m = new Map<number, string[]>();
    for (const b of documentBins(document)) {
      const c = b.y * document.width + b.x;
      m.set(c, [...(m.get(c) ?? []), b.code]);
    }
    return m;
  }, [document]);
  const hoverCodes = hovered === null ? [] : (codesByCell.get(hovered) ?? []);
  const hoverBin = hoverCodes[0] ? binByCode.get(hoverCodes[0]) : undefined;
  const [from, setFrom] = useState(bins[0]?.code ?? "");
  const [to, setTo] = useState(bins[bins.length - 1]?.code ?? "");
  const [answer, setAnswer] = useState<Answer | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function measure(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    const r = await requestJson<Answer>(
      "GET",
      `/api/layout-versions/${layoutVersionId}/distance?from=${encodeURIComponent(from.trim())}&to=${encodeURIComponent(to.trim())}`,
    );
    setBusy(false);
    if (r.ok) {
      setAnswer(r.data);
      setError(null);
    } else {
      setAnswer(null);
      setError(r.message);
    }
  }

  const columns = useMemo<DataColumn<VersionBin>[]>(
    () => [
      { accessorKey: "code", header: "Location code" },
      { accessorKey: "aisle", header: "Aisle" },
      { accessorKey: "bay", header: "Bay" },
      { accessorKey: "level", header: "Level" },
      { accessorKey: "rackRun", header: "Rack run" },
      {
        id: "fromDepot",
        accessorFn: (b) => b.fromDepot?.mm ?? Number.MAX_SAFE_INTEGER,
        header: "Walk from depot",
        cell: ({ row }) => (row.original.fromDepot ? metres(row.original.fromDepot.mm) : "not reachable"),
      },
      {
        id: "ap",
        accessorFn: (b) => b.accessPoint,
        header: "Access point",
        cell: ({ row }) => `#${row.original.accessPoint} (cell ${row.original.x}, ${row.original.y})`,
      },
    ],
    [],
  );

  const fromBin = bins.find((b) => b.code === answer?.from);
  const toBin = bins.find((b) => b.code === answer?.to);
  const route =
    answer && fromBin && toBin
      ? {
          cells: answer.cells,
          stops: [
            { x: fromBin.x, y: fromBin.y, label: "1" },
            { x: toBin.x, y: toBin.y, label: "2" },
          ],
        }
      : undefined;

  return (
    <div className="space-y-6">
      <form onSubmit={measure} className="card flex flex-wrap items-end gap-4" aria-labelledby="measure-title">
        <h2 id="measure-title" className="w-full">
          Walking distance between two bins
        </h2>
        <label>
          <span className="label">From bin</span>
          <input className="field" list="bin-codes" value={from} onChange={(e) => setFrom(e.target.value)} />
        </label>
        <label>
          <span className="label">To bin</span>
          <input className="field" list="bin-codes" value={to} onChange={(e) => setTo(e.target.value)} />
        </label>
        <datalist id="bin-codes">
          {bins.slice(0, 5000).map((b) => (
            <option key={b.code} value={b.code} />
          ))}
        </datalist>
        <button className="btn-primary" disabled={busy}>
          {busy ? "Measuring…" : "Measure"}
        </button>
        {answer && (
          <p role="status" className="text-lg">
            <span className="font-semibold">{answer.from}</span> → <span className="font-semibold">{answer.to}</span>:{" "}
            <strong data-testid="distance">{metres(answer.distanceMm)}</strong>{" "}
            <span className="text-ink-soft">
              ({answer.distanceMm.toLocaleString("en")} mm on foot, one-way aisles respected)
            </span>
          </p>
        )}
        {error && (
          <p role="alert" className="notice-error w-full">
            {error}
          </p>
        )}
      </form>
      <div className="card overflow-hidden p-2">
        <FloorPlanView
          document={document}
          route={route}
          onCellHover={(c) => setHovered(c?.index ?? null)}
          label="Published floor plan"
        />
        <p className="mt-2 min-h-tap px-2 text-base" aria-live="polite" data-testid="hover-info">
          {hoverBin
            ? `${hoverCodes.join(", ")}: ${hoverBin.fromDepot ? `${metres(hoverBin.fromDepot.mm)} walk from ${hoverBin.fromDepot.depot}` : "no depot reaches this bay"}`
            : "Point at a rack bay to see how far it is from the depot."}
        </p>
      </div>
      <section aria-labelledby="bins-title">
        <h2 id="bins-title" className="mb-3">
          Bins ({bins.length.toLocaleString("en")})
        </h2>
        <DataTable
          data={bins}
          columns={columns}
          rowId={(b) => b.code}
          searchLabel="location code, aisle or rack run"
          empty="This version has no bins."
        />
      </section>
    </div>
  );
}
