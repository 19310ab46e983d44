import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // Site timing for estimates; defaults are common practice (about 1 m/s pushing a cart, 15 s per line),
  // the same figures as DEFAULT_SITE_TIMING in lib/batching/estimate.ts (this landed migration keeps its own copy).
  await knex.schema.alterTable("sites", (t) => {
    t.integer("walking_speed_mm_s").unsigned().notNullable().defaultTo(1000);
    t.integer("seconds_per_line").unsigned().notNullable().defaultTo(15);
  });

  // Every accepted spreadsheet, by content hash: the same file imported twice is recognised.
  await knex.schema.createTable("import_files", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.enu("kind", ["items", "orders"]).notNullable();
    t.string("sha256", 64).notNullable();
    t.string("filename", 255).notNullable();
    t.integer("row_count").unsigned().notNullable();
    t.string("imported_by", 32).nullable();
    t.timestamp("imported_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
    t.unique(["site_id", "kind", "sha256"]);
  });

  await knex.schema.createTable("items", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("sku", 64).notNullable();
    t.string("description", 200).notNullable();
    t.string("uom", 16).notNullable();
    t.integer("unit_weight_g").unsigned().notNullable();
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
    t.unique(["site_id", "sku"]);
  });

  // Bin codes stay stable across layout versions; a wave checks them against its own version.
  await knex.schema.createTable("item_bins", (t) => {
    t.integer("item_id").unsigned().notNullable();
    t.string("bin_code", 32).notNullable();
    t.integer("rank").unsigned().notNullable().defaultTo(1);
    t.primary(["item_id", "bin_code"]);
    t.foreign("item_id").references("items.id").onDelete("CASCADE");
  });

  await knex.schema.createTable("orders", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("order_number", 64).notNullable();
    t.string("customer_ref", 120).nullable();
    t.integer("priority").unsigned().notNullable().defaultTo(2);
    t.datetime("cutoff_at", { precision: 3 }).nullable();
    t.enu("status", ["open", "planned", "released"]).notNullable().defaultTo("open");
    t.integer("import_file_id").unsigned().nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
    t.foreign("import_file_id").references("import_files.id").onDelete("SET NULL");
    t.unique(["site_id", "order_number"]);
    t.index(["site_id", "status", "cutoff_at"]);
  });

  await knex.schema.createTable("order_lines", (t) => {
    t.increments("id").primary();
    t.integer("order_id").unsigned().notNullable();
    t.integer("line_no").unsigned().notNullable();
    t.integer("item_id").unsigned().notNullable();
    t.integer("quantity").unsigned().notNullable();
    t.foreign("order_id").references("orders.id").onDelete("CASCADE");
    t.foreign("item_id").references("items.id");
    t.unique(["order_id", "line_no"]);
  });

  await knex.schema.createTable("waves", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("name", 120).notNullable();
    t.integer("layout_version_id").unsigned().notNullable();
    t.enu("status", ["draft", "planned", "released"]).notNullable().defaultTo("draft");
    // Cart settings, batching method, depot and drop-off, as the planner chose them.
    t.json("settings").notNullable();
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.bigInteger("distance_mm").unsigned().nullable();
    t.bigInteger("baseline_mm").unsigned().nullable();
    t.json("unbatchable").nullable();
    t.string("created_by", 32).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("planned_at", { precision: 3 }).nullable();
    t.timestamp("released_at", { precision: 3 }).nullable();
    t.string("released_by", 32).nullable();
    t.foreign("site_id").references("sites.id");
    t.foreign("layout_version_id").references("layout_versions.id");
    t.foreign("created_by").references("users.id").onDelete("SET NULL");
  });

  // An order belongs to at most one wave: the primary key on order_id enforces it.
  await knex.schema.createTable("wave_orders", (t) => {
    t.integer("order_id").unsigned().primary();
    t.integer("wave_id").unsigned().notNullable();
    t.foreign("order_id").references("orders.id").onDelete("CASCADE");
    t.foreign("wave_id").references("waves.id").onDelete("CASCADE");
    t.index(["wave_id"]);
  });

  await knex.schema.createTable("batches", (t) => {
    t.increments("id").primary();
    t.integer("wave_id").unsigned().notNullable();
    t.integer("number").unsigned().notNullable();
    t.integer("line_count").unsigned().notNullable();
    t.integer("tote_count").unsigned().notNullable();
    t.integer("weight_g").unsigned().notNullable();
    t.integer("distance_mm").unsigned().notNullable();
    t.integer("baseline_mm").unsigned().notNullable();
    t.boolean("optimal").notNullable();
    t.string("method", 24).notNullable();
    t.enu("status", ["planned", "released"]).notNullable().defaultTo("planned");
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.string("assigned_to", 32).nullable();
    t.foreign("wave_id").references("waves.id").onDelete("CASCADE");
    t.foreign("assigned_to").references("users.id").onDelete("SET NULL");
    t.unique(["wave_id", "number"]);
  });

  await knex.schema.createTable("batch_stops", (t) => {
    t.integer("batch_id").unsigned().notNullable();
    t.integer("seq").unsigned().notNullable();
    t.integer("access_point").unsigned().notNullable();
    t.integer("x").unsigned().notNullable();
    t.integer("y").unsigned().notNullable();
    t.primary(["batch_id", "seq"]);
    t.foreign("batch_id").references("batches.id").onDelete("CASCADE");
  });

  await knex.schema.createTable("batch_lines", (t) => {
    t.integer("order_line_id").unsigned().primary();
    t.integer("batch_id").unsigned().notNullable();
    t.integer("stop_seq").unsigned().notNullable();
    t.integer("tote").unsigned().notNullable();
    t.string("bin_code", 32).notNullable();
    t.foreign("order_line_id").references("order_lines.id").onDelete("CASCADE");
    t.foreign("batch_id").references("batches.id").onDelete("CASCADE");
    t.index(["batch_id", "stop_seq"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    "batch_lines",
    "batch_stops",
    "batches",
    "wave_orders",
    "waves",
    "order_lines",
    "orders",
    "item_bins",
    "items",
    "import_files",
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.schema.alterTable("sites", (t) => {
    t.dropColumn("walking_speed_mm_s");
    t.dropColumn("seconds_per_line");
  });
}
