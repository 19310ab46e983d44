import type { Knex } from "knex";

// How many taken, unfinished batches one picker may hold: one being picked and two waiting is enough
// to keep a handheld busy, and few enough that one quick picker cannot empty the pool for the rest.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sites", (t) => {
    t.integer("max_open_batches_per_picker").unsigned().notNullable().defaultTo(3);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sites", (t) => {
    t.dropColumn("max_open_batches_per_picker");
  });
}
