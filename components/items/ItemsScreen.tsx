"use client";

import useSWR from "swr";
import { useMemo } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { ImportPanel } from "@/components/imports/ImportPanel";
import type { VersionOption } from "@/lib/contracts/layout-versions";
import type { ItemDTO } from "@/lib/contracts/items";
import { swrFetcher } from "@/lib/client/fetch-json";

type Item = ItemDTO;

const columns: DataColumn<Item>[] = [
  { accessorKey: "sku", header: "SKU" },
  { accessorKey: "description", header: "Description" },
  { accessorKey: "uom", header: "Unit" },
  {
    accessorKey: "unitWeightG",
    header: "Unit weight (g)",
    cell: ({ row }) => row.original.unitWeightG.toLocaleString("en-GB"),
  },
  {
    id: "bins",
    accessorFn: (i) => i.bins.join(" "),
    header: "Pick bins",
    cell: ({ row }) => {
      const { bins, replenishBins = [] } = row.original;
      if (bins.length === 0) return "—";
      return bins.map((b, k) => (
        <span key={b}>
          {k > 0 && ", "}
          {b}
          {replenishBins.includes(b) && <span className="font-semibold text-signal"> ⚑ to replenish</span>}
        </span>
      ));
    },
  },
];

/** The item master: its SKUs with their pick bins, export, and (for planners) the import. */
export function ItemsScreen({ canPlan, versions }: { canPlan: boolean; versions: VersionOption[] }) {
  const { data, error, isLoading } = useSWR<{ items: Item[] }>("/api/items", swrFetcher);
  const items = useMemo(() => data?.items ?? [], [data]);
  const unbinned = items.filter((i) => i.bins.length === 0).length;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <p className="grow">
          {isLoading
            ? "Loading the item master…"
            : `${items.length.toLocaleString("en-GB")} SKUs${unbinned ? `, ${unbinned} without a pick bin` : ""}.`}
        </p>
        <a className="btn-quiet" href="/api/items/export" download>
          Export to .xlsx
        </a>
      </div>
      {error && (
        <p role="alert" className="notice-error">
          {error.message}
        </p>
      )}
      <DataTable
        data={items}
        columns={columns}
        searchLabel="SKU, description or bin"
        rowId={(i) => i.sku}
        empty="No items yet. Download the template, fill it in and import it below."
      />
      {canPlan && (
        <ImportPanel kind="items" title="Import the item master" versions={versions} refreshPrefix="/api/items" />
      )}
    </div>
  );
}
