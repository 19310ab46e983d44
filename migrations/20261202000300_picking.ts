import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.enu("status", ["planned", "released", "picking", "done"]).notNullable().defaultTo("planned").alter();
    t.timestamp("started_at", { precision: 3 }).nullable();
    t.timestamp("finished_at", { precision: 3 }).nullable();
    // How often its pick list was printed: every print after the first says "reprint" on the paper.
    t.integer("print_count").unsigned().notNullable().defaultTo(0);
  });

  await knex.schema.alterTable("batch_lines", (t) => {
    t.enu("pick_status", ["open", "picked", "short"]).notNullable().defaultTo("open");
    t.integer("picked_qty").unsigned().nullable();
    t.string("short_reason", 200).nullable();
    t.timestamp("confirmed_at", { precision: 3 }).nullable();
    t.string("confirmed_by", 32).nullable();
  });

  // One row per confirmation a handheld sent: a repeat with the same key gets the stored answer back.
  await knex.schema.createTable("pick_confirmations", (t) => {
    t.string("idempotency_key", 64).primary();
    t.integer("batch_id").unsigned().notNullable();
    t.string("user_id", 32).notNullable();
    t.string("request_sha256", 64).notNullable();
    t.json("response").notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("batch_id").references("batches.id").onDelete("CASCADE");
    t.index(["batch_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("pick_confirmations");
  await knex.schema.alterTable("batch_lines", (t) => {
    for (const c of ["pick_status", "picked_qty", "short_reason", "confirmed_at", "confirmed_by"]) t.dropColumn(c);
  });
  await knex.schema.alterTable("batches", (t) => {
    t.dropColumn("started_at");
    t.dropColumn("finished_at");
    t.dropColumn("print_count");
  });
}
