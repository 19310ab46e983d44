import type { Knex } from "knex";

// Prints are counted in wave_batch_prints (per wave and batch number, so they outlive re-planning);
// nothing has read or written batches.print_count since.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.dropColumn("print_count");
  });
}

// The column comes back empty; 20261203101002's down fills it from wave_batch_prints.
export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.integer("print_count").unsigned().notNullable().defaultTo(0);
  });
}
