import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sites", (t) => {
    t.increments("id").primary();
    t.string("code", 32).notNullable().unique();
    t.string("name", 120).notNullable();
    // IANA zone: times shown to people (throttle messages, cut-offs) are in the site's local time.
    t.string("timezone", 64).notNullable().defaultTo("UTC");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });

  await knex.schema.createTable("users", (t) => {
    t.string("id", 32).primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("email", 254).notNullable().unique();
    t.string("display_name", 120).notNullable();
    t.enu("role", ["admin", "planner", "picker"]).notNullable();
    t.string("password_hash", 255).nullable();
    t.timestamp("disabled_at", { precision: 3 }).nullable();
    t.timestamp("last_sign_in_at", { precision: 3 }).nullable();
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
  });

  // Column names are fixed by lucia's MySQL adapter (id, user_id, expires_at); created_at carries
  // the absolute lifetime that lucia's sliding expiry alone does not give.
  await knex.schema.createTable("sessions", (t) => {
    t.string("id", 255).primary();
    t.string("user_id", 32).notNullable();
    t.datetime("expires_at", { precision: 3 }).notNullable();
    t.datetime("created_at", { precision: 3 }).notNullable();
    t.foreign("user_id").references("users.id").onDelete("CASCADE");
    t.index(["user_id"]);
  });

  await knex.schema.createTable("audit_log", (t) => {
    t.bigIncrements("id").primary();
    t.timestamp("at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("event", 64).notNullable();
    t.string("actor_user_id", 32).nullable();
    // What the event is about: an e-mail address for sign-in attempts, a path for refusals, a user id.
    t.string("subject", 254).nullable();
    t.string("ip", 64).nullable();
    t.json("detail").nullable();
    t.index(["event", "subject", "at"]);
    t.index(["event", "ip", "at"]);
    t.index(["at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("audit_log");
  await knex.schema.dropTableIfExists("sessions");
  await knex.schema.dropTableIfExists("users");
  await knex.schema.dropTableIfExists("sites");
}
