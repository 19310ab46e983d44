import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { roleMay } from "@/lib/auth/permissions";
import { getFloorPlan } from "@/db/floor-plans";
import { FloorPlanEditor } from "@/components/editor/FloorPlanEditor";

export const metadata: Metadata = { title: "Floor plan" };

export default async function FloorPlanPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireRole("floorplans.read", `/floor-plans/${id}`);
  const plan = await getFloorPlan(user.siteId, pageId(id));
  if (!plan) notFound();
  return (
    <>
      <p className="mb-2 text-sm">
        <Link className="underline" href="/floor-plans">
          Floor plans
        </Link>{" "}
        › {plan.name}
      </p>
      <h1 className="mb-4">{plan.name}: draft</h1>
      <FloorPlanEditor floorPlanId={plan.id} canEdit={roleMay(user.role, "floorplans.edit")} />
    </>
  );
}
