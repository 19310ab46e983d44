import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { EmptyState } from "@/components/EmptyState";

export const metadata: Metadata = { title: "Floor plans" };

export default async function FloorPlansPage() {
  await requireRole("floorplans.read", "/floor-plans");
  return (
    <>
      <PageHeader title="Floor plans" lead="The drawing of each warehouse floor: aisles, cross-aisles, rack runs, depots and drop-offs. Routes are planned on its published layout versions." />
      <EmptyState title="No floor plan yet">
        Drawing and publishing floor plans arrives with the floor-plan editor. Until then there is nothing to route on.
      </EmptyState>
    </>
  );
}
