import type { Knex } from "knex";

// Print history per wave and batch number, apart from the batch rows: re-planning replaces those, but the
// papers already printed for "batch 3 of this wave" still exist, so the next print of batch 3 is a reprint.
// batches.print_count is no longer read or written; wave_batch_prints replaces it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("wave_batch_prints", (t) => {
    t.integer("wave_id").unsigned().notNullable();
    t.integer("number").unsigned().notNullable();
    t.integer("print_count").unsigned().notNullable().defaultTo(0);
    t.timestamp("last_printed_at", { precision: 3 }).nullable();
    t.primary(["wave_id", "number"]);
    t.foreign("wave_id").references("waves.id").onDelete("CASCADE");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("wave_batch_prints");
}
