import type { Knex } from "knex";

// Every time a supervisor assigns, takes back or moves a batch: the picker who lost it is told who
// did it and when, the one who got it sees who assigned it, and the floor keeps its history.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("batch_handovers", (t) => {
    t.increments("id").primary();
    t.integer("batch_id").unsigned().notNullable();
    t.enu("kind", ["assigned", "taken-back", "moved"]).notNullable();
    t.string("from_user", 32).nullable();
    t.string("to_user", 32).nullable();
    t.string("by_user", 32).nullable();
    t.timestamp("at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("batch_id").references("batches.id").onDelete("CASCADE");
    t.foreign("from_user").references("users.id").onDelete("SET NULL");
    t.foreign("to_user").references("users.id").onDelete("SET NULL");
    t.foreign("by_user").references("users.id").onDelete("SET NULL");
    t.index(["batch_id", "at"]);
    t.index(["from_user", "at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("batch_handovers");
}
