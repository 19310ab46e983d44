import { route } from "@/lib/http/route";
import { myBatches, nextUnassignedBatch } from "@/db/picking";
import { withAssigners } from "@/lib/shift/assigned-by";

export const GET = route({ access: "picks.work" }, async ({ user }) => {
  const [batches, next] = await Promise.all([myBatches(user.siteId, user.id), nextUnassignedBatch(user.siteId)]);
  return Response.json({ batches: await withAssigners(user.id, batches), next });
});
