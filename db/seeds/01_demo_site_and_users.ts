import type { Knex } from "knex";
import { hash } from "@node-rs/argon2";
import { randomBytes } from "node:crypto";
import { DEMO_ACCOUNTS, DEMO_SITE } from "./demo/accounts";
import { ARGON2_OPTIONS } from "../../lib/auth/argon2-options";

// Idempotent: adds what is missing and leaves existing rows (and any changed passwords) alone.
export async function seed(knex: Knex): Promise<void> {
  let site = await knex("sites").where({ code: DEMO_SITE.code }).first();
  if (!site) {
    await knex("sites").insert({ code: DEMO_SITE.code, name: DEMO_SITE.name, timezone: DEMO_SITE.timezone });
    site = await knex("sites").where({ code: DEMO_SITE.code }).first();
  }
  for (const account of DEMO_ACCOUNTS) {
    const exists = await knex("users").where({ email: account.email }).first();
    if (exists) continue;
    await knex("users").insert({
      id: randomBytes(10).toString("hex"),
      site_id: site.id,
      email: account.email,
      display_name: account.displayName,
      role: account.role,
      password_hash: await hash(account.password, ARGON2_OPTIONS),
    });
  }
}
