import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // One row per throttled thing (an account's or an address's sign-ins, reset mails): the count is
  // taken under this row's lock before the answer, so parallel requests cannot all slip under the cap.
  // n counts attempts kept (failures, mails) and those still being checked; kept only the former.
  await knex.schema.createTable("throttle_counters", (t) => {
    t.string("scope", 32).notNullable();
    t.string("subject", 254).notNullable();
    t.integer("n").unsigned().notNullable().defaultTo(0);
    t.integer("kept").unsigned().notNullable().defaultTo(0);
    t.timestamp("window_start", { precision: 3 }).notNullable();
    t.primary(["scope", "subject"]);
    t.index(["window_start"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("throttle_counters");
}
