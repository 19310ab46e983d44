"use client";

import { useMemo } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import type { EditorDocument } from "@/lib/floor-plan/document";
import { documentBins, type RunBin } from "@/lib/floor-plan/bin-codes";

const columns: DataColumn<RunBin>[] = [
  { accessorKey: "code", header: "Location code" },
  { accessorKey: "aisle", header: "Aisle" },
  { accessorKey: "bay", header: "Bay" },
  { accessorKey: "level", header: "Level" },
  { accessorKey: "runId", header: "Rack run" },
];

/** Every bin of the drawing as it stands (saved or not), searchable. */
export function BinListPanel({ document }: { document: EditorDocument }) {
  const bins = useMemo(() => documentBins(document), [document]);
  return (
    <section aria-labelledby="bins-title" className="card space-y-3">
      <h2 id="bins-title">Bins</h2>
      <p className="text-sm text-ink-soft">
        Level 1 is the floor level; bins from level 3 up usually need a step or ladder. Follow site rules for working at
        height.
      </p>
      <DataTable
        data={bins}
        columns={columns}
        searchLabel="location code or rack run"
        rowId={(b) => `${b.runId}|${b.bay}|${b.level}|${b.code}`}
        empty="No bins yet: draw a rack run to add bays and levels."
        pageSize={15}
      />
    </section>
  );
}
