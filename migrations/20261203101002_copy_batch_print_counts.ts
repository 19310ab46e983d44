import type { Knex } from "knex";

// Data only (the table came in the step before): prints counted on batch rows so far carry over.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    "insert into wave_batch_prints (wave_id, number, print_count) select wave_id, number, print_count from batches where print_count > 0",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(
    "update batches b join wave_batch_prints p on p.wave_id = b.wave_id and p.number = b.number set b.print_count = p.print_count",
  );
}
