import "server-only";
import { getPickBatch, type PickBatchRow } from "@/db/picking";
import { activePicker, assignBatch, lastHandovers } from "@/db/shift-floor";
import { getSite } from "@/db/sites";
import type { SignedInUser } from "@/lib/auth/session";
import { formatWhen } from "@/lib/format/dates";
import { HttpError } from "@/lib/http/errors";
import { wentThrough } from "@/lib/http/repeat";

export type AssignAnswer = { batch: PickBatchRow; message: string };

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * A supervisor gives a batch to a picker (`to`), takes it back (`to` null) or moves it from one picker
 * to another, started or not. Refusals say what is in the way and what to do instead.
 */
export async function assignBatchBy(
  user: SignedInUser,
  batchId: number,
  version: number,
  to: string | null,
  ip: string,
): Promise<AssignAnswer> {
  const site = await getSite(user.siteId);
  const cap = site?.maxOpenBatchesPerPicker ?? 3;
  const style = site?.dateStyle;
  const before = await getPickBatch(user.siteId, batchId);
  if (!before) throw new HttpError(404, "No such batch at this site. Reload the floor.");
  const target = to === null ? null : await activePicker(user.siteId, to);
  if (to !== null && !target)
    throw new HttpError(
      422,
      "That account is not an active picker at this site, so it cannot hold a batch. Choose a picker from the list.",
    );

  const done = (b: PickBatchRow): AssignAnswer => ({
    batch: b,
    message:
      to === null
        ? `Batch ${b.number} is back in the pool: the next picker to take a batch gets it. Lines already picked stay picked.`
        : `Batch ${b.number} of ${b.waveName} is now ${target!.name}'s.`,
  });

  // A resend of this supervisor's own change (the answer to the first was lost) is answered as done.
  const last = (await lastHandovers([batchId])).get(batchId);
  if (wentThrough(before, (b) => b.assignedTo === to && last?.byUser === user.id, version)) return done(before);

  const outcome = await assignBatch(user.siteId, batchId, version, to, { userId: user.id, ip }, cap);
  const now = (await getPickBatch(user.siteId, batchId)) ?? before;
  switch (outcome.kind) {
    case "changed":
      return done(now);
    case "missing":
      throw new HttpError(404, "No such batch at this site. Reload the floor.");
    case "target":
      throw new HttpError(
        422,
        "That account is not an active picker at this site, so it cannot hold a batch. Choose a picker from the list.",
      );
    case "cap":
      throw new HttpError(
        409,
        `${target!.name} already holds ${plural(outcome.held, "unfinished batch", "unfinished batches")}, ` +
          `the most this site allows (${cap} per picker). Take one back from them first, or choose another picker.`,
      );
    case "not-on-floor":
      throw new HttpError(
        409,
        outcome.status === "done"
          ? `Batch ${now.number} is picked to the end; a finished batch cannot be assigned or moved.`
          : outcome.status === "planned"
            ? `Batch ${now.number} is not released yet. Release its wave first.`
            : `Batch ${now.number} is not out on the floor (it is ${outcome.status}), so it cannot be assigned.`,
      );
    case "same":
      throw new HttpError(409, `${target!.name} already holds batch ${now.number}. Choose another picker.`);
    case "nobody":
      throw new HttpError(409, `Nobody holds batch ${now.number}: it is already waiting for a picker.`);
    case "stale": {
      const h = (await lastHandovers([batchId])).get(batchId);
      const state =
        now.status === "done"
          ? "it has been picked to the end"
          : now.assignedTo
            ? `${now.assignedName ?? "a picker"} holds it now` +
              (h && h.toUser === now.assignedTo
                ? ` (${h.byName ?? "someone"} ${h.kind === "moved" ? "moved" : "assigned"} it at ${formatWhen(h.at, style)})`
                : " (they took it themselves)")
            : h && h.kind === "taken-back"
              ? `${h.byName ?? "someone"} took it back at ${formatWhen(h.at, style)}, and nobody holds it`
              : "nobody holds it now";
      throw new HttpError(
        409,
        `Batch ${now.number} changed since your screen loaded it: ${state}. The floor list is updated; check it and try again.`,
      );
    }
  }
}
