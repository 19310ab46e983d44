import { route } from "@/lib/http/route";
import { myBatches, nextUnassignedBatch } from "@/db/picking";

export const GET = route({ access: "picks.work" }, async ({ user }) => {
  const [batches, next] = await Promise.all([myBatches(user.siteId, user.id), nextUnassignedBatch(user.siteId)]);
  return Response.json({ batches, next });
});
