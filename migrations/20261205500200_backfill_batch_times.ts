import type { Knex } from "knex";

// Data only (the column came in the step before). A held batch was taken at its last "batch.taken"
// audit row, or at the latest when its first line was confirmed; a batch picked before started_at and
// finished_at were written gets them from its lines' confirmation times.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    `update batches b set b.taken_at = coalesce(
       (select max(a.at) from audit_log a where a.event = 'batch.taken' and a.subject = concat('batch:', b.id)),
       b.started_at)
     where b.assigned_to is not null and b.taken_at is null`,
  );
  await knex.raw(
    `update batches b set b.started_at = (select min(l.confirmed_at) from batch_lines l where l.batch_id = b.id)
     where b.started_at is null and b.status in ('picking', 'done')`,
  );
  await knex.raw(
    `update batches b set b.finished_at = (select max(l.confirmed_at) from batch_lines l where l.batch_id = b.id)
     where b.finished_at is null and b.status = 'done'`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex("batches").update({ taken_at: null });
}
