import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { PageHeader } from "@/components/PageHeader";
import { ShiftFloor } from "@/components/shift/ShiftFloor";
import { floorView } from "@/lib/shift/floor-view";

export const metadata: Metadata = { title: "Shift floor" };

export default async function FloorPage() {
  const user = await requireRole("floor.watch", "/floor");
  return (
    <>
      <PageHeader
        title="Shift floor"
        lead="Every batch of the waves out on the floor (and those finished in the last day): who holds it, how far they are, and how long it takes against its estimate."
      />
      <ShiftFloor initial={await floorView(user.siteId)} canAssign={roleMay(user.role, "batches.assign")} />
    </>
  );
}
