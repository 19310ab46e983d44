import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { pageId } from "@/lib/http/page-params";
import { getOrderDetail } from "@/db/orders";
import { getSite } from "@/db/sites";
import { PICK_STATE_LABEL, type OrderLineDTO } from "@/lib/contracts/orders";
import { DEFAULT_DATE_STYLE, formatDateTime } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Order" };

const STATUS_LABEL = { open: "Open (in no wave)", planned: "In a wave, not yet released", released: "Released" };

function pickText(l: OrderLineDTO): string {
  if (l.pickStatus === null) return "Not in a batch yet";
  if (l.pickStatus === "open") return "To pick";
  if (l.pickStatus === "picked") return `Picked ${l.pickedQty ?? l.quantity}`;
  const short = `Short: picked ${l.pickedQty ?? 0} of ${l.quantity}${l.shortReason ? ` (${l.shortReason})` : ""}`;
  if (l.followUp === "repick") return `${short}; the rest is re-picked later`;
  if (l.followUp === "cancel") return `${short}; the rest is cancelled`;
  return `${short}; no follow-up chosen yet`;
}

export default async function OrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireRole("waves.read", `/orders/${id}`);
  const order = await getOrderDetail(user.siteId, pageId(id));
  if (!order) notFound();
  const style = (await getSite(user.siteId))?.dateStyle ?? DEFAULT_DATE_STYLE;
  const mayFollowUp = roleMay(user.role, "shortpicks.follow");
  return (
    <>
      <p className="mb-2 text-sm">
        <Link className="underline" href="/orders">
          Orders
        </Link>{" "}
        › {order.orderNumber}
      </p>
      <h1>Order {order.orderNumber}</h1>
      <dl className="card mt-4 grid max-w-3xl grid-cols-[auto_1fr] gap-x-6 gap-y-2" aria-label="Order summary">
        <dt className="text-ink-soft">Status</dt>
        <dd data-testid="order-status">
          <span className="font-semibold">{STATUS_LABEL[order.status]}</span>
          {order.pickState && <span> · {PICK_STATE_LABEL[order.pickState]}</span>}
        </dd>
        <dt className="text-ink-soft">Cut-off</dt>
        <dd data-testid="order-cutoff">
          {order.cutoffAt ? formatDateTime(order.cutoffAt, style) : "No cut-off"}
          {order.overdue && (
            <span className="ml-2 font-semibold text-alarm">
              ⚠ Overdue: the cut-off has passed and it is not picked
            </span>
          )}
        </dd>
        <dt className="text-ink-soft">Priority</dt>
        <dd>{order.priority}</dd>
        {order.customerRef && (
          <>
            <dt className="text-ink-soft">Customer reference</dt>
            <dd>{order.customerRef}</dd>
          </>
        )}
        <dt className="text-ink-soft">Wave</dt>
        <dd>
          {order.wave ? (
            <Link className="underline" href={`/waves/${order.wave.id}`}>
              {order.wave.name}
            </Link>
          ) : (
            "In no wave"
          )}
        </dd>
        {order.parent && (
          <>
            <dt className="text-ink-soft">Re-pick of</dt>
            <dd>
              <Link className="underline" href={`/orders/${order.parent.id}`}>
                {order.parent.orderNumber}
              </Link>{" "}
              (what its short picks left to pick)
            </dd>
          </>
        )}
        {order.repickOrders.length > 0 && (
          <>
            <dt className="text-ink-soft">Re-pick orders</dt>
            <dd>
              <ul>
                {order.repickOrders.map((r) => (
                  <li key={r.id}>
                    <Link className="underline" href={`/orders/${r.id}`}>
                      {r.orderNumber}
                    </Link>{" "}
                    · {r.pickState ? PICK_STATE_LABEL[r.pickState] : STATUS_LABEL[r.status]}
                  </li>
                ))}
              </ul>
            </dd>
          </>
        )}
        {order.note && (
          <>
            <dt className="text-ink-soft">Note</dt>
            <dd>⚠ {order.note}</dd>
          </>
        )}
      </dl>
      {order.pickState === "short" && mayFollowUp && (
        <p className="notice-error mt-4 max-w-3xl">
          This order was picked short and nobody has chosen what happens to the rest.{" "}
          <Link className="font-semibold underline" href="/short-picks">
            Follow it up on the short-picks list
          </Link>
          .
        </p>
      )}
      <h2 className="mt-8">Lines</h2>
      <div className="mt-2 overflow-x-auto rounded-lg border border-rack-light bg-paper-raised">
        <table className="w-full border-collapse text-left">
          <thead className="bg-paper-sunk">
            <tr>
              <th scope="col" className="px-3 py-2">
                Line
              </th>
              <th scope="col" className="px-3 py-2">
                SKU
              </th>
              <th scope="col" className="px-3 py-2">
                Qty
              </th>
              <th scope="col" className="px-3 py-2">
                Bin
              </th>
              <th scope="col" className="px-3 py-2">
                Batch
              </th>
              <th scope="col" className="px-3 py-2">
                Pick
              </th>
            </tr>
          </thead>
          <tbody>
            {order.lines.map((l) => (
              <tr key={l.id} className="border-t border-rack-light" data-testid="order-line">
                <td className="px-3 py-2">{l.lineNo}</td>
                <td className="px-3 py-2">
                  <span className="font-semibold">{l.sku}</span>
                  <span className="block text-sm text-ink-soft">{l.description}</span>
                </td>
                <td className="px-3 py-2">{l.quantity}</td>
                <td className="px-3 py-2">
                  {l.binCode ?? "No pick bin"}
                  {l.replenishFlagged && <span className="block text-sm">⚑ Flagged for replenishment</span>}
                </td>
                <td className="px-3 py-2">
                  {l.batch ? (
                    <Link className="underline" href={`/waves/${l.batch.waveId}/batches/${l.batch.number}`}>
                      #{l.batch.number} of {l.batch.waveName}
                    </Link>
                  ) : (
                    "—"
                  )}
                </td>
                <td
                  className={`px-3 py-2 ${l.pickStatus === "short" && !l.followUp ? "font-semibold text-alarm" : ""}`}
                >
                  {pickText(l)}
                  {l.repickOrder && (
                    <span className="block text-sm">
                      Re-pick order{" "}
                      <Link className="underline" href={`/orders/${l.repickOrder.id}`}>
                        {l.repickOrder.orderNumber}
                      </Link>
                    </span>
                  )}
                  {l.repickOf && (
                    <span className="block text-sm text-ink-soft">
                      Rest of line {l.repickOf.lineNo} of{" "}
                      <Link className="underline" href={`/orders/${l.repickOf.orderId}`}>
                        {l.repickOf.orderNumber}
                      </Link>
                    </span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
