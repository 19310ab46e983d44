import type { Knex } from "knex";

// A site's own date order, clock and units, the set-up time each batch costs (collecting a cart and its
// totes at the depot, dropping them at packing: about 2 minutes is common practice, not a measured figure),
// and a version so two admins saving the settings at once cannot overwrite each other unseen.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sites", (t) => {
    t.enu("date_order", ["dmy", "mdy", "ymd"]).notNullable().defaultTo("dmy");
    t.enu("clock", ["24h", "12h"]).notNullable().defaultTo("24h");
    t.enu("units", ["metric", "imperial"]).notNullable().defaultTo("metric");
    t.integer("setup_seconds_per_batch").unsigned().notNullable().defaultTo(120);
    t.integer("version").unsigned().notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sites", (t) => {
    t.dropColumn("version");
    t.dropColumn("setup_seconds_per_batch");
    t.dropColumn("units");
    t.dropColumn("clock");
    t.dropColumn("date_order");
  });
}
