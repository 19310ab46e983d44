import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { myBatches, nextUnassignedBatch } from "@/db/picking";
import { MyBatches } from "@/components/picking/MyBatches";
import { withAssigners } from "@/lib/shift/assigned-by";

export const metadata: Metadata = { title: "My batches" };

export default async function MyBatchesPage() {
  const user = await requireRole("picks.work", "/my-batches");
  const [batches, next] = await Promise.all([myBatches(user.siteId, user.id), nextUnassignedBatch(user.siteId)]);
  return (
    <div className="mx-auto max-w-xl">
      <PageHeader title="My batches" lead={`Batches assigned to ${user.displayName}, in the order to pick them.`} />
      <MyBatches initial={{ batches: await withAssigners(user.id, batches), next }} />
    </div>
  );
}
