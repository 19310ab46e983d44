import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { getSite } from "@/db/sites";
import { PageHeader } from "@/components/PageHeader";
import { ShortPicksScreen } from "@/components/short-picks/ShortPicksScreen";
import { dayOf } from "@/lib/format/day-range";

export const metadata: Metadata = { title: "Short picks" };

export default async function ShortPicksPage() {
  const user = await requireRole("shortpicks.follow", "/short-picks");
  const site = await getSite(user.siteId);
  return (
    <>
      <PageHeader
        title="Short picks"
        lead="Lines pickers could not fill during a shift. Choose for each what happens to the rest: re-pick it later in another batch, or cancel it; and flag the bin for replenishment."
      />
      <ShortPicksScreen today={dayOf(new Date(), site?.timezone ?? "UTC")} />
    </>
  );
}
