"use client";

import Link from "next/link";
import { useMemo } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import { kilograms, metres, minutes, savingsPct } from "@/lib/format/units";
import { estimateSeconds, type SiteTiming } from "@/lib/batching/estimate";
import { gapPercent } from "@/lib/routing/certificate";

type Row = BatchSummaryDTO & { seconds: number };

// Routes with no bound sort last (Infinity − Infinity would be NaN).
const routeGap = (b: Row) => Math.min(gapPercent({ lengthMm: b.distanceMm, lowerBoundMm: b.lowerBoundMm }), 1e9);

export function WaveResults({
  waveId,
  batches: summaries,
  timing,
}: {
  waveId: number;
  batches: BatchSummaryDTO[];
  timing: SiteTiming;
}) {
  const batches = useMemo<Row[]>(
    () =>
      summaries.map((b) => ({
        ...b,
        seconds: estimateSeconds({ distanceMm: b.distanceMm, lines: b.lineCount }, timing),
      })),
    [summaries, timing],
  );
  const columns = useMemo<DataColumn<Row>[]>(
    () => [
      {
        accessorKey: "number",
        header: "Batch",
        cell: ({ row }) => (
          <Link className="font-semibold underline" href={`/waves/${waveId}/batches/${row.original.number}`}>
            #{row.original.number}
          </Link>
        ),
      },
      { accessorKey: "stopCount", header: "Stops" },
      { accessorKey: "lineCount", header: "Lines" },
      { accessorKey: "toteCount", header: "Totes" },
      { accessorKey: "weightG", header: "Weight", cell: ({ row }) => kilograms(row.original.weightG) },
      { accessorKey: "distanceMm", header: "Walk", cell: ({ row }) => metres(row.original.distanceMm) },
      { accessorKey: "seconds", header: "Est. time", cell: ({ row }) => minutes(row.original.seconds) },
      { accessorKey: "baselineMm", header: "Usual walk", cell: ({ row }) => metres(row.original.baselineMm) },
      {
        id: "savings",
        accessorFn: (b) => (b.baselineMm > 0 ? 1 - b.distanceMm / b.baselineMm : 0),
        header: "Savings",
        cell: ({ row }) => savingsPct(row.original.distanceMm, row.original.baselineMm),
      },
      {
        // The words are what search finds; sorting goes by how far from the shortest a route can be.
        id: "certificate",
        accessorFn: (b) => b.certificate,
        header: "Route",
        sortFn: (a, b) => routeGap(a.original) - routeGap(b.original),
        cell: ({ row }) => <span className="block min-w-44 text-sm">{row.original.certificate}</span>,
      },
      { accessorKey: "status", header: "Status" },
      {
        id: "progress",
        accessorFn: (b) => (b.lineCount ? (b.pickedLines + b.shortLines) / b.lineCount : 0),
        header: "Picked",
        cell: ({ row }) => {
          const b = row.original;
          const done = b.pickedLines + b.shortLines;
          return done === 0 ? "—" : `${done}/${b.lineCount}${b.shortLines ? ` (${b.shortLines} short ⚠)` : ""}`;
        },
      },
    ],
    [waveId],
  );
  return (
    <DataTable
      data={batches}
      columns={columns}
      rowId={(b) => String(b.id)}
      searchLabel="batches (route, status)"
      empty="Not planned yet: plan the wave to see its batches."
      pageSize={20}
    />
  );
}
