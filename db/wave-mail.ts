import "server-only";
import type { Knex } from "knex";
import { enqueueMail } from "./outbox";
import { shortPicksOfWave } from "./short-picks";
import { shortPickSummaryMail, waveReleasedMail } from "@/lib/mail/wave-mails";

async function plannerOf(trx: Knex.Transaction, waveId: number) {
  return trx("waves as w")
    .join("users as u", "u.id", "w.created_by")
    .where("w.id", waveId)
    .first("w.name", "w.distance_mm", "w.baseline_mm", "u.email", "u.display_name");
}

// The mails link to the wave page at `origin`, the address people open the app at (appOrigin() in
// lib/mail/config.ts), which the server layer passes down: db/ reads no settings of the web server.

/** Queued in the release's own transaction: the mail goes if and only if the release happened. */
export async function queueWaveReleasedMail(trx: Knex.Transaction, waveId: number, origin: string): Promise<void> {
  const w = await plannerOf(trx, waveId);
  if (!w) return;
  const batches = await trx("batches")
    .where({ wave_id: waveId })
    .orderBy("number")
    .select("number", "line_count", "distance_mm");
  await enqueueMail(trx, {
    dedupeKey: `wave-released:${waveId}`,
    ...waveReleasedMail({
      to: w.email,
      name: w.display_name,
      waveName: w.name,
      batches: batches.map((b: { number: number; line_count: number; distance_mm: number }) => ({
        number: b.number,
        lineCount: b.line_count,
        distanceMm: b.distance_mm,
      })),
      distanceMm: Number(w.distance_mm ?? 0),
      baselineMm: Number(w.baseline_mm ?? 0),
      link: `${origin}/waves/${waveId}`,
    }),
  });
}

/** When the last batch of a wave is done: the short picks to follow up, to the wave's planner, once. */
export async function queueShortPickSummaryIfWaveDone(
  trx: Knex.Transaction,
  batchId: number,
  origin: string,
): Promise<void> {
  const b = await trx("batches").where({ id: batchId }).first("wave_id");
  if (!b) return;
  const open = await trx("batches")
    .where({ wave_id: b.wave_id })
    .whereNotIn("status", ["done", "recalled"])
    .count({ n: "*" })
    .first();
  if (Number(open?.n ?? 0) > 0) return;
  const w = await plannerOf(trx, b.wave_id);
  if (!w) return;
  await enqueueMail(trx, {
    dedupeKey: `short-summary:${b.wave_id}`,
    ...shortPickSummaryMail({
      to: w.email,
      name: w.display_name,
      waveName: w.name,
      shorts: await shortPicksOfWave(b.wave_id, trx),
      link: `${origin}/waves/${b.wave_id}`,
    }),
  });
}
