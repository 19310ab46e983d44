import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { PageHeader } from "@/components/PageHeader";
import { ItemsScreen } from "@/components/items/ItemsScreen";
import { importVersionOptions } from "@/lib/layout-versions/choices";

export const metadata: Metadata = { title: "Item master" };

export default async function ItemsPage() {
  const user = await requireRole("waves.read", "/items");
  const canPlan = roleMay(user.role, "waves.plan");
  return (
    <>
      <PageHeader
        title="Item master"
        lead="Every SKU with its unit of measure, unit weight and pick bins. The first pick bin of an SKU is its main one."
      />
      <ItemsScreen canPlan={canPlan} versions={canPlan ? await importVersionOptions(user.siteId) : []} />
    </>
  );
}
