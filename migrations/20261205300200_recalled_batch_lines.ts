import type { Knex } from "knex";

// batch_lines is keyed by order line, so a recalled batch's lines move here: the order lines are free
// to be planned again, and the recalled batch still says what it held.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("recalled_batch_lines", (t) => {
    t.integer("batch_id").unsigned().notNullable();
    t.integer("order_line_id").unsigned().notNullable();
    t.integer("stop_seq").unsigned().notNullable();
    t.integer("tote").unsigned().notNullable();
    t.string("bin_code", 32).notNullable();
    t.primary(["batch_id", "order_line_id"]);
    t.foreign("batch_id").references("batches.id").onDelete("CASCADE");
    t.foreign("order_line_id").references("order_lines.id").onDelete("CASCADE");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("recalled_batch_lines");
}
