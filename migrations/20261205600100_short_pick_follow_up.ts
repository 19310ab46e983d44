import type { Knex } from "knex";

// What the shift did about each short pick (re-pick later, or cancel the rest of the line), whether the
// bin was flagged for replenishment, and the re-pick orders that carry a short line's remaining
// quantity, linked to the order they came from. One table change per step (MariaDB commits on DDL).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("orders", (t) => {
    // A re-pick order's original (always the first order, so a re-pick of a re-pick counts on from it).
    t.integer("parent_order_id").unsigned().nullable();
    t.foreign("parent_order_id").references("orders.id").onDelete("CASCADE");
  });

  await knex.schema.alterTable("order_lines", (t) => {
    t.integer("repick_of_line_id").unsigned().nullable();
    t.foreign("repick_of_line_id").references("order_lines.id").onDelete("SET NULL");
  });

  await knex.schema.alterTable("batch_lines", (t) => {
    t.enu("follow_up", ["repick", "cancel"]).nullable();
    t.string("follow_up_by", 32).nullable();
    t.timestamp("follow_up_at", { precision: 3 }).nullable();
    t.integer("repick_order_id").unsigned().nullable();
    t.string("replenish_by", 32).nullable();
    t.timestamp("replenish_at", { precision: 3 }).nullable();
    // Moves on with every follow-up, so a change made from a stale screen is refused.
    t.integer("follow_up_version").unsigned().notNullable().defaultTo(1);
    t.foreign("repick_order_id").references("orders.id").onDelete("SET NULL");
  });

  // Bins someone asked to be replenished; cleared when done. open_bin is the bin code while the flag
  // is up and null once cleared, so the unique key allows one open flag per bin and any number of old ones.
  await knex.schema.createTable("bin_replenishments", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("bin_code", 32).notNullable();
    t.string("open_bin", 32).nullable();
    t.integer("item_id").unsigned().nullable();
    t.integer("order_line_id").unsigned().nullable();
    t.string("requested_by", 32).nullable();
    t.timestamp("requested_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("cleared_by", 32).nullable();
    t.timestamp("cleared_at", { precision: 3 }).nullable();
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.foreign("site_id").references("sites.id");
    t.foreign("item_id").references("items.id").onDelete("SET NULL");
    t.foreign("order_line_id").references("order_lines.id").onDelete("SET NULL");
    t.unique(["site_id", "open_bin"]);
    t.index(["site_id", "bin_code"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("bin_replenishments");
  await knex.schema.alterTable("batch_lines", (t) => {
    t.dropForeign(["repick_order_id"]);
  });
  await knex.schema.alterTable("batch_lines", (t) => {
    for (const c of [
      "follow_up",
      "follow_up_by",
      "follow_up_at",
      "repick_order_id",
      "replenish_by",
      "replenish_at",
      "follow_up_version",
    ])
      t.dropColumn(c);
  });
  await knex.schema.alterTable("order_lines", (t) => {
    t.dropForeign(["repick_of_line_id"]);
    t.dropColumn("repick_of_line_id");
  });
  await knex.schema.alterTable("orders", (t) => {
    t.dropForeign(["parent_order_id"]);
    t.dropColumn("parent_order_id");
  });
}
