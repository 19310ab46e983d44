import "server-only";
import { discardWave, getWave, releaseWave } from "@/db/waves";
import { recordPrinted } from "@/db/batch-prints";
import { audit } from "@/db/audit";
import type { SignedInUser } from "@/lib/auth/session";
import { HttpError } from "@/lib/http/errors";
import { wentThrough } from "@/lib/http/repeat";
import { appOrigin } from "@/lib/mail/config";
import { cancellationOf } from "@/db/wave-control";

const noWave = () => new HttpError(404, "No such wave at this site.");

/** A planned wave's batches go to the pickers' handhelds. */
export async function releaseWaveBy(user: SignedInUser, id: number, version: number, ip: string) {
  const outcome = await releaseWave(user.siteId, id, version, user.id, appOrigin());
  const wave = await getWave(user.siteId, id);
  if (!wave) throw noWave();
  if (outcome === "not-planned") throw new HttpError(409, "Plan the wave before releasing it.");
  if (outcome === "stale") {
    // Only the same planner's repeat; a release by anyone else since is news to this planner.
    if (wentThrough(wave, (w) => w.status === "released" && w.releasedBy === user.id, version)) return wave;
    throw new HttpError(
      409,
      wave.status === "released"
        ? "This wave was already released by someone else."
        : "The wave changed (re-planned?) since you loaded it. Reload and check the batches, then release.",
    );
  }
  await audit({
    event: "wave.released",
    actorUserId: user.id,
    subject: `wave:${id}`,
    ip,
    detail: { batches: wave.batchCount },
  });
  return wave;
}

/** An unreleased wave goes away and its orders are open again. */
export async function discardWaveBy(
  user: SignedInUser,
  id: number,
  version: number,
  ip: string,
): Promise<{ orders: number }> {
  // The audit line commits with the deletion, so a planner who lost the race learns who cancelled it.
  const r = await discardWave(user.siteId, id, version, (trx, orders) =>
    audit({ event: "wave.discarded", actorUserId: user.id, subject: `wave:${id}`, ip, detail: { orders } }, trx),
  );
  if (r.outcome === "missing") {
    const earlier = await cancellationOf(id);
    // Someone else cancelled it first; the same planner's repeat keeps its 404 below.
    if (earlier && earlier.actorUserId !== user.id)
      throw new HttpError(
        409,
        `This wave was already cancelled${earlier.actorName ? ` by ${earlier.actorName}` : " by someone else"}; its orders are open again on the orders page.`,
      );
    throw new HttpError(
      404,
      "No such wave at this site: it may have been discarded already. Its orders are then open again on the orders page.",
    );
  }
  if (r.outcome === "released")
    throw new HttpError(
      409,
      "This wave is released: its batches are on the pickers' handhelds and it cannot be cancelled. " +
        "Recall each batch nobody has started (its orders go back to open); a started batch is reassigned on the floor.",
    );
  if (r.outcome !== "discarded")
    throw new HttpError(409, "The wave changed (re-planned?) since you loaded it. Reload it and decide again.");
  return { orders: r.orders };
}

const list = (ns: number[]) =>
  ns.length <= 10 ? ns.join(", ") : `${ns.slice(0, 10).join(", ")} and ${ns.length - 10} more`;

/** Counts the printing of a planned wave's pick lists; a second print of a batch is a reprint. */
export async function recordPrintedBy(
  user: SignedInUser,
  id: number,
  numbers: number[],
  ip: string,
): Promise<{ printed: number; reprints: number[] }> {
  const wave = await getWave(user.siteId, id);
  if (!wave) throw noWave();
  if (wave.status === "draft") throw new HttpError(409, "Plan the wave before printing its pick lists.");
  const outcome = await recordPrinted(wave.id, numbers);
  if ("unknown" in outcome) {
    const has =
      outcome.batchCount === 0
        ? "it has no batches"
        : outcome.batchCount === 1
          ? "it has batch 1 only"
          : `it has batches 1–${outcome.batchCount}`;
    throw new HttpError(
      400,
      `This wave has no batch ${list(outcome.unknown)} (${has}); nothing was counted as printed. It may have been re-planned: reload the page and print again.`,
    );
  }
  const printed = [...outcome.before.keys()];
  const reprints = printed.filter((n) => (outcome.before.get(n) ?? 0) > 0);
  await audit({
    event: "batch.printed",
    actorUserId: user.id,
    subject: `wave:${wave.id}`,
    ip,
    detail: { batches: printed, reprints },
  });
  return { printed: printed.length, reprints };
}
