"use client";

import useSWR from "swr";
import { useMemo, useState } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { ImportPanel } from "@/components/imports/ImportPanel";
import type { VersionOption } from "@/lib/contracts/layout-versions";
import type { OrderDTO } from "@/lib/contracts/orders";
import { swrFetcher } from "@/lib/client/fetch-json";

type Order = OrderDTO;

const STATUSES = [
  { value: "open", label: "Open (not yet in a wave)" },
  { value: "planned", label: "In a wave, not yet released" },
  { value: "released", label: "Released" },
  { value: "all", label: "All orders" },
] as const;

const columns = (timeZone: string): DataColumn<Order>[] => [
  { accessorKey: "orderNumber", header: "Order" },
  { id: "customerRef", accessorFn: (o) => o.customerRef ?? "", header: "Customer reference" },
  { accessorKey: "priority", header: "Priority" },
  {
    id: "cutoffAt",
    accessorFn: (o) => o.cutoffAt ?? "",
    header: "Cut-off",
    cell: ({ row }) =>
      row.original.cutoffAt
        ? new Date(row.original.cutoffAt).toLocaleString("en-GB", { timeZone, dateStyle: "medium", timeStyle: "short" })
        : "—",
  },
  { accessorKey: "lineCount", header: "Lines" },
  { accessorKey: "status", header: "Status" },
  // Set when a released wave handed the order back because no batch could hold it.
  {
    id: "note",
    accessorFn: (o) => o.note ?? "",
    header: "Why it is open again",
    cell: ({ row }) => (row.original.note ? <span className="block min-w-72 text-sm">⚠ {row.original.note}</span> : ""),
  },
];

/** Orders by status, and (for planners) the order lines import. Cut-offs show in the site's time. */
export function OrdersScreen({
  canPlan,
  versions,
  timeZone,
}: {
  canPlan: boolean;
  versions: VersionOption[];
  timeZone: string;
}) {
  const [status, setStatus] = useState<(typeof STATUSES)[number]["value"]>("open");
  const { data, error, isLoading } = useSWR<{ orders: Order[] }>(`/api/orders?status=${status}`, swrFetcher);
  const orders = useMemo(() => data?.orders ?? [], [data]);
  const cols = useMemo(() => columns(timeZone), [timeZone]);
  const lines = orders.reduce((n, o) => n + o.lineCount, 0);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-4">
        <label className="block min-w-60">
          <span className="label">Show</span>
          <select className="field" value={status} onChange={(e) => setStatus(e.target.value as typeof status)}>
            {STATUSES.map((s) => (
              <option key={s.value} value={s.value}>
                {s.label}
              </option>
            ))}
          </select>
        </label>
        <p className="pb-3">
          {isLoading
            ? "Loading orders…"
            : `${orders.length.toLocaleString("en-GB")} orders, ${lines.toLocaleString("en-GB")} order lines. Cut-offs in ${timeZone} time.`}
        </p>
      </div>
      {error && (
        <p role="alert" className="notice-error">
          {error.message}
        </p>
      )}
      <DataTable
        data={orders}
        columns={cols}
        searchLabel="order or customer reference"
        rowId={(o) => String(o.id)}
        empty="No orders with this status. Import order lines below."
      />
      {canPlan && (
        <ImportPanel kind="orders" title="Import order lines" versions={versions} refreshPrefix="/api/orders" />
      )}
    </div>
  );
}
