import "server-only";
import { db } from "./knex";

// The parts of a batch query the handheld's lists (db/picking.ts) and the supervisor's floor
// (db/shift-floor.ts) share: which batches are still open, a batch with its wave's name, and its
// count of short lines. Both select from `batches as b` joined to `waves as w`.

/** Taken and not finished: what counts against a picker's cap, and what goes back to the pool. */
export const OPEN_STATUSES = ["released", "picking"] as const;

/** A batch with its wave's name, as `toBatchWave` reads it. */
export const BATCH_WAVE_COLUMNS = ["b.id", "b.wave_id", "w.name as wave_name", "b.number", "b.status", "b.version"];

/** How many of the batch's lines were picked short. */
export const shortLinesColumn = () =>
  db().raw("(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'short') as short_lines");

export const toBatchWave = <S extends string = string>(r: Record<string, unknown>) => ({
  id: Number(r.id),
  waveId: Number(r.wave_id),
  waveName: String(r.wave_name),
  number: Number(r.number),
  status: String(r.status) as S,
  version: Number(r.version),
});
