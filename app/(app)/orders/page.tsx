import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { PageHeader } from "@/components/PageHeader";
import { OrdersScreen } from "@/components/orders/OrdersScreen";
import { importVersionOptions } from "@/lib/layout-versions/choices";

export const metadata: Metadata = { title: "Orders" };

export default async function OrdersPage() {
  const user = await requireRole("waves.read", "/orders");
  const canPlan = roleMay(user.role, "waves.plan");
  return (
    <>
      <PageHeader
        title="Orders"
        lead="Orders imported from order-line spreadsheets, with their cut-off and priority. Open orders are the ones waves are planned from."
      />
      {canPlan && (
        <p className="mb-4 text-sm">
          Trying Trailbin out? Import{" "}
          <a className="font-semibold underline" href="/demo/bramblegate-orders-2026-11-28.csv" download>
            the demo order sheet
          </a>{" "}
          (Saturday&apos;s invented orders for Bramblegate), then plan a wave from them.
        </p>
      )}
      <OrdersScreen canPlan={canPlan} versions={canPlan ? await importVersionOptions(user.siteId) : []} />
    </>
  );
}
