"use client";

import Link from "next/link";
import useSWR from "swr";
import { useMemo, useState } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { ImportPanel } from "@/components/imports/ImportPanel";
import { useDateStyle } from "@/components/SiteFormat";
import type { VersionOption } from "@/lib/contracts/layout-versions";
import { PICK_STATE_LABEL, type OrderDTO } from "@/lib/contracts/orders";
import { swrFetcher } from "@/lib/client/fetch-json";
import { formatDateTime, type DateStyle } from "@/lib/format/dates";

type Order = OrderDTO;

const STATUSES = [
  { value: "open", label: "Open (not yet in a wave)" },
  { value: "planned", label: "In a wave, not yet released" },
  { value: "released", label: "Released" },
  { value: "all", label: "All orders" },
] as const;

const STATUS_LABEL: Record<Order["status"], string> = { open: "Open", planned: "In a wave", released: "Released" };

const n = (x: number) => x.toLocaleString("en-GB");

const columns = (style: DateStyle): DataColumn<Order>[] => [
  {
    accessorKey: "orderNumber",
    header: "Order",
    cell: ({ row }) => (
      <Link className="font-semibold underline" href={`/orders/${row.original.id}`}>
        {row.original.orderNumber}
      </Link>
    ),
  },
  { id: "customerRef", accessorFn: (o) => o.customerRef ?? "", header: "Customer reference" },
  { accessorKey: "priority", header: "Priority" },
  {
    id: "cutoffAt",
    accessorFn: (o) => o.cutoffAt ?? "",
    header: "Cut-off",
    cell: ({ row }) =>
      row.original.cutoffAt ? (
        <span className={row.original.overdue ? "font-semibold text-alarm" : ""}>
          {formatDateTime(row.original.cutoffAt, style)}
          {row.original.overdue && <span className="block text-sm">⚠ Overdue</span>}
        </span>
      ) : (
        <span className="text-ink-soft">No cut-off</span>
      ),
  },
  { accessorKey: "lineCount", header: "Lines" },
  {
    id: "status",
    // Searchable by the words shown, e.g. "short" or "awaiting".
    accessorFn: (o) => `${STATUS_LABEL[o.status]} ${o.pickState ? PICK_STATE_LABEL[o.pickState] : ""}`,
    header: "Status",
    cell: ({ row }) => (
      <span className="block min-w-32">
        {STATUS_LABEL[row.original.status]}
        {row.original.pickState && (
          <span
            className={`block text-sm ${row.original.pickState === "short" ? "font-semibold text-alarm" : "text-ink-soft"}`}
          >
            {PICK_STATE_LABEL[row.original.pickState]}
          </span>
        )}
        {row.original.parent && (
          <span className="block text-sm text-ink-soft">Re-pick of {row.original.parent.orderNumber}</span>
        )}
      </span>
    ),
  },
  // Set when a released wave handed the order back because no batch could hold it.
  {
    id: "note",
    accessorFn: (o) => o.note ?? "",
    header: "Why it is open again",
    cell: ({ row }) => (row.original.note ? <span className="block min-w-72 text-sm">⚠ {row.original.note}</span> : ""),
  },
];

/** Orders by status, and (for planners) the order lines import. Cut-offs show in the site's time. */
export function OrdersScreen({ canPlan, versions }: { canPlan: boolean; versions: VersionOption[] }) {
  const style = useDateStyle();
  const [status, setStatus] = useState<(typeof STATUSES)[number]["value"]>("open");
  const [shown, setShown] = useState<number | null>(null);
  const { data, error, isLoading } = useSWR<{ orders: Order[] }>(`/api/orders?status=${status}`, swrFetcher);
  const orders = useMemo(() => data?.orders ?? [], [data]);
  const cols = useMemo(() => columns(style), [style]);
  const lines = orders.reduce((a, o) => a + o.lineCount, 0);
  const overdue = orders.filter((o) => o.overdue).length;
  const showing = shown === null ? orders.length : Math.min(shown, orders.length);
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
        <p className="pb-3" data-testid="orders-count">
          {isLoading
            ? "Loading orders…"
            : (showing === orders.length
                ? `${n(orders.length)} orders, ${n(lines)} order lines${overdue ? `, ${n(overdue)} overdue` : ""}.`
                : `${n(showing)} of ${n(orders.length)} orders match the search (in all: ${n(lines)} order lines` +
                  `${overdue ? `, ${n(overdue)} overdue` : ""}).`) + ` Cut-offs in ${style.timeZone} time.`}
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
        searchLabel="order, customer reference or status"
        rowId={(o) => String(o.id)}
        empty="No orders with this status. Import order lines below."
        onShownChange={setShown}
      />
      {canPlan && (
        <ImportPanel kind="orders" title="Import order lines" versions={versions} refreshPrefix="/api/orders" />
      )}
    </div>
  );
}
