import type { Knex } from "knex";

// A planner recalls a released batch nobody has started: the row stays, marked recalled, so the wave's
// history shows it; its orders go back to open.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    "alter table batches modify status enum('planned','released','picking','done','recalled') not null default 'planned'",
  );
  await knex.schema.alterTable("batches", (t) => {
    t.timestamp("recalled_at", { precision: 3 }).nullable();
    t.string("recalled_by", 32).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.dropColumn("recalled_at");
    t.dropColumn("recalled_by");
  });
  await knex("batches").where({ status: "recalled" }).delete();
  await knex.raw(
    "alter table batches modify status enum('planned','released','picking','done') not null default 'planned'",
  );
}
