import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { EmptyState } from "@/components/EmptyState";

export const metadata: Metadata = { title: "My batches" };

export default async function MyBatchesPage() {
  const user = await requireRole("picks.work", "/my-batches");
  return (
    <>
      <PageHeader title="My batches" lead={`Batches assigned to ${user.displayName}, in the order to pick them.`} />
      <EmptyState title="No batches for you right now">
        When a planner releases a batch to you it appears here with its numbered stops. Ask your planner if you expected one.
      </EmptyState>
    </>
  );
}
