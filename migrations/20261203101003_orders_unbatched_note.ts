import type { Knex } from "knex";

// Why an order came back to open from a released wave (no batch of it held the order), shown on the
// orders page until a new wave takes it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("orders", (t) => {
    t.string("unbatched_note", 1000).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("orders", (t) => {
    t.dropColumn("unbatched_note");
  });
}
