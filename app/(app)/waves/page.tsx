import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { EmptyState } from "@/components/EmptyState";

export const metadata: Metadata = { title: "Waves" };

export default async function WavesPage() {
  await requireRole("waves.read", "/waves");
  return (
    <>
      <PageHeader title="Waves" lead="Groups of orders cut into cart-sized batches, each with an exact walking route and its savings against the usual walk." />
      <EmptyState title="No waves yet">
        Importing the item master and order lines and planning waves arrives with wave planning. Nothing has been planned at this site.
      </EmptyState>
    </>
  );
}
