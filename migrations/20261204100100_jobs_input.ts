import type { Knex } from "knex";

// What a job works on, stored with it, so that a worker process that did not start the job can run it
// from its row alone.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("jobs", (t) => {
    t.json("input").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("jobs", (t) => {
    t.dropColumn("input");
  });
}
