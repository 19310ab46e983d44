import type { Knex } from "knex";

// When the batch's holder got it (took it, or a supervisor assigned or moved it to them): the floor
// page shows it, and idle time counts from the drop of the last one.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.timestamp("taken_at", { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.dropColumn("taken_at");
  });
}
