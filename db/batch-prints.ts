import "server-only";
import { db } from "./knex";

// How often each batch of a wave has been printed, kept per wave and batch number in
// wave_batch_prints, so a re-planned wave's next print of a batch is still a reprint.

export type PrintOutcome = { unknown: number[]; batchCount: number } | { before: Map<number, number> };

/**
 * Counts one print of each listed batch (each once, however often listed) and returns how often each
 * had been printed before. The history is per wave and batch number, so it outlives re-planning.
 * Nothing is counted when a number names no batch of the wave.
 */
export async function recordPrinted(waveId: number, numbers: number[]): Promise<PrintOutcome> {
  const wanted = [...new Set(numbers)].sort((a, b) => a - b);
  return db().transaction(async (trx) => {
    // The wave row's lock keeps a re-plan from renumbering the batches between the check and the count.
    await trx("waves").where({ id: waveId }).forUpdate().first("id");
    const have = new Set<number>(
      await trx("batches").where({ wave_id: waveId }).whereIn("number", wanted).pluck("number"),
    );
    const unknown = wanted.filter((n) => !have.has(n));
    if (unknown.length) {
      const count = await trx("batches").where({ wave_id: waveId }).first(trx.raw("count(*) as n"));
      return { unknown, batchCount: Number(count?.n ?? 0) };
    }
    const rows = await trx("wave_batch_prints")
      .where({ wave_id: waveId })
      .whereIn("number", wanted)
      .forUpdate()
      .select("number", "print_count");
    await trx("wave_batch_prints")
      .insert(wanted.map((number) => ({ wave_id: waveId, number, print_count: 1, last_printed_at: trx.fn.now(3) })))
      .onConflict(["wave_id", "number"])
      .merge({ print_count: trx.raw("print_count + 1"), last_printed_at: trx.fn.now(3) });
    const before = new Map<number, number>(wanted.map((n) => [n, 0]));
    for (const r of rows as { number: number; print_count: number }[]) before.set(r.number, r.print_count);
    return { before };
  });
}

export async function printCounts(waveId: number): Promise<Map<number, number>> {
  const rows = await db()("wave_batch_prints").where({ wave_id: waveId }).select("number", "print_count");
  return new Map(rows.map((r: { number: number; print_count: number }) => [r.number, r.print_count]));
}
