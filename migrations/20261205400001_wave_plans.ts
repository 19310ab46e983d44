import type { Knex } from "knex";

// Plans of one wave computed side by side on the same orders; the planner keeps one as the wave's plan.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("wave_plans", (t) => {
    t.increments("id").primary();
    t.integer("wave_id").unsigned().notNullable();
    // The wave's version the plan was computed for: another version means other orders or settings.
    t.integer("wave_version").unsigned().notNullable();
    // The comparison (one job) the plan came from.
    t.string("job_id", 32).notNullable();
    t.string("label", 200).notNullable();
    // Method, cart limits, depot and drop-off: what the wave's settings become when the plan is kept.
    t.json("settings").notNullable();
    t.json("summary").notNullable();
    // What storePlan takes: the batches, the totals and the orders no batch holds.
    t.json("batches").notNullable();
    t.json("unbatchable").notNullable();
    // Every order the plan was computed on (batched or not): keeping it needs the wave to hold exactly these.
    t.json("order_ids").notNullable();
    // The wave's version right after this plan was kept, so a resent "keep" is answered as done.
    t.integer("kept_version").unsigned().nullable();
    t.string("created_by", 32).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("wave_id").references("waves.id").onDelete("CASCADE");
    t.foreign("created_by").references("users.id").onDelete("SET NULL");
    t.index(["wave_id", "wave_version"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("wave_plans");
}
