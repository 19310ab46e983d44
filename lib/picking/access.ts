import "server-only";
import { audit } from "@/db/audit";
import { getPickBatch, type PickBatchRow } from "@/db/picking";
import { handoverAwayFrom } from "@/db/shift-floor";
import { movedAwayMessage } from "@/lib/shift/moved-away";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";

/** A refusal to work a batch; the pick page shows the batch it names (never sent in the JSON answer). */
export class BatchRefusal extends HttpError {
  constructor(
    status: 403 | 404 | 409,
    message: string,
    readonly batch?: PickBatchRow,
    /** The batch was the user's until a supervisor moved it or took it back: the page says so, not 403. */
    readonly movedAway = false,
  ) {
    super(status, message);
  }
}

/**
 * Only the picker the batch is assigned to, or an admin, works it; anyone else is refused and audited.
 * A batch not yet released cannot be picked.
 */
export async function workableBatch(
  user: SignedInUser,
  batchId: number,
  ip: string | null,
  subject: string,
): Promise<PickBatchRow> {
  const batch = await getPickBatch(user.siteId, batchId);
  if (!batch) throw new BatchRefusal(404, "No such batch at this site. Check the link or go back to your batches.");
  // Whoever held it has lost it: say why, rather than "not assigned to you".
  if (batch.status === "recalled")
    throw new BatchRefusal(
      409,
      "This batch was recalled by the planner: its orders went back to be planned again. Go back to your batches and take the next one.",
      batch,
    );
  if (user.role !== "admin" && batch.assignedTo !== user.id) {
    // The picker who had it is told who moved it and when (their handheld polls, so not audited as a denial).
    const away = await handoverAwayFrom(batchId, user.id);
    if (away) throw new BatchRefusal(403, await movedAwayMessage(user.siteId, away), batch, true);
    await audit({
      event: "access.denied",
      actorUserId: user.id,
      subject,
      ip,
      detail: { batchId, assignedTo: batch.assignedTo },
    });
    throw new BatchRefusal(
      403,
      batch.assignedTo
        ? `This batch is assigned to ${batch.assignedName ?? "another picker"}. Only they (or an admin) can pick it.`
        : "This batch is not assigned to you. Take it from My batches first.",
      batch,
    );
  }
  if (batch.status === "planned")
    throw new BatchRefusal(409, "This batch is not released yet. Ask your planner.", batch);
  return batch;
}
