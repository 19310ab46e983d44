import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // Mail to send, written in the same transaction as the change that causes it: either both happen
  // or neither. dedupe_key is UNIQUE so one logical message is queued (and so sent) at most once.
  await knex.schema.createTable("outbox", (t) => {
    t.increments("id").primary();
    t.string("dedupe_key", 191).notNullable().unique();
    t.string("to_address", 254).notNullable();
    t.string("to_name", 120).nullable();
    t.string("subject", 200).notNullable();
    t.text("text_body").notNullable();
    t.text("html_body").nullable();
    // "sending" is held by exactly one sender, which claimed the row with a conditional UPDATE.
    t.enu("status", ["pending", "sending", "sent", "failed"]).notNullable().defaultTo("pending");
    t.integer("attempts").unsigned().notNullable().defaultTo(0);
    t.timestamp("next_attempt_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("claimed_at", { precision: 3 }).nullable();
    t.string("last_error", 500).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("sent_at", { precision: 3 }).nullable();
    t.index(["status", "next_attempt_at"]);
  });

  // Only the SHA-256 of a link's token is kept: a copy of the database does not hold working links.
  await knex.schema.createTable("password_tokens", (t) => {
    t.increments("id").primary();
    t.string("user_id", 32).notNullable();
    t.string("token_sha256", 64).notNullable().unique();
    t.enu("purpose", ["invite", "reset"]).notNullable();
    t.timestamp("expires_at", { precision: 3 }).notNullable();
    t.timestamp("used_at", { precision: 3 }).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("user_id").references("users.id").onDelete("CASCADE");
    t.index(["user_id"]);
  });

  // What the local SMTP sink (scripts/mail-sink.ts) received; the admin page /admin/mail shows it.
  await knex.schema.createTable("mail_sink_messages", (t) => {
    t.increments("id").primary();
    t.timestamp("received_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("envelope_from", 254).nullable();
    t.string("envelope_to", 1000).notNullable();
    t.string("message_id", 254).nullable();
    t.string("from_header", 500).nullable();
    t.string("to_header", 1000).nullable();
    t.string("subject", 500).nullable();
    t.text("text_body", "mediumtext").nullable();
    t.text("raw", "mediumtext").notNullable();
    t.index(["message_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("mail_sink_messages");
  await knex.schema.dropTableIfExists("password_tokens");
  await knex.schema.dropTableIfExists("outbox");
}
