import "server-only";
import { audit } from "@/db/audit";
import { getPickBatch, type PickBatchRow } from "@/db/picking";
import type { SignedInUser } from "@/lib/auth/session";

export type PickAccess = { ok: true; batch: PickBatchRow } | { ok: false; status: 403 | 404 | 409; message: string; batch?: PickBatchRow };

/**
 * Only the picker the batch is assigned to, or an admin, works it; anyone else is refused and audited.
 * A batch not yet released cannot be picked.
 */
export async function mayWorkBatch(user: SignedInUser, batchId: number, ip: string | null, subject: string): Promise<PickAccess> {
  const batch = await getPickBatch(user.siteId, batchId);
  if (!batch) return { ok: false, status: 404, message: "No such batch at this site. Check the link or go back to your batches." };
  if (user.role !== "admin" && batch.assignedTo !== user.id) {
    await audit({ event: "access.denied", actorUserId: user.id, subject, ip, detail: { batchId, assignedTo: batch.assignedTo } });
    return {
      ok: false,
      status: 403,
      message: batch.assignedTo ? `This batch is assigned to ${batch.assignedName ?? "another picker"}. Only they (or an admin) can pick it.` : "This batch is not assigned to you. Take it from My batches first.",
      batch,
    };
  }
  if (batch.status === "planned") return { ok: false, status: 409, message: "This batch is not released yet. Ask your planner.", batch };
  return { ok: true, batch };
}
