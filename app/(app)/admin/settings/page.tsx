import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { getSite } from "@/db/sites";
import { PageHeader } from "@/components/PageHeader";
import { SiteSettingsForm } from "@/components/site/SiteSettingsForm";
import { timeZoneNames } from "@/lib/format/time-zones";

export const metadata: Metadata = { title: "Site settings" };

export default async function SiteSettingsPage() {
  const user = await requireRole("site.manage", "/admin/settings");
  const site = await getSite(user.siteId);
  if (!site) notFound();
  return (
    <>
      <PageHeader
        title="Site settings"
        lead="This site's name, time zone, how dates and times are written, and the figures every estimate uses. A change applies at once to every screen, mail, print and estimate."
      />
      <SiteSettingsForm initial={site} nowIso={new Date().toISOString()} zones={timeZoneNames()} />
    </>
  );
}
