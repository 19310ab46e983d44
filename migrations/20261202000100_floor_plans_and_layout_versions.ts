import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("floor_plans", (t) => {
    t.increments("id").primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("name", 120).notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
    t.unique(["site_id", "name"]);
  });

  // One open draft per floor plan; `version` is the optimistic-concurrency counter of saves.
  await knex.schema.createTable("floor_plan_drafts", (t) => {
    t.integer("floor_plan_id").unsigned().primary();
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.specificType("document", "LONGTEXT").notNullable();
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("updated_by", 32).nullable();
    t.foreign("floor_plan_id").references("floor_plans.id").onDelete("CASCADE");
    t.foreign("updated_by").references("users.id").onDelete("SET NULL");
  });

  // Immutable once written. from_draft_version makes a repeated publish of the same save a no-op.
  await knex.schema.createTable("layout_versions", (t) => {
    t.increments("id").primary();
    t.integer("floor_plan_id").unsigned().notNullable();
    t.integer("number").unsigned().notNullable();
    t.integer("from_draft_version").unsigned().notNullable();
    t.specificType("document", "LONGTEXT").notNullable();
    t.integer("cell_mm").unsigned().notNullable();
    t.integer("node_count").unsigned().notNullable();
    t.integer("edge_count").unsigned().notNullable();
    t.integer("bin_count").unsigned().notNullable();
    // Int32 little-endian, n*n row-major; checksum = sha256 over dist then next.
    t.specificType("dist_matrix", "LONGBLOB").notNullable();
    t.specificType("next_matrix", "LONGBLOB").notNullable();
    t.string("matrix_sha256", 64).notNullable();
    t.timestamp("published_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("published_by", 32).nullable();
    t.foreign("floor_plan_id").references("floor_plans.id");
    t.foreign("published_by").references("users.id").onDelete("SET NULL");
    t.unique(["floor_plan_id", "number"]);
    t.unique(["floor_plan_id", "from_draft_version"]);
  });

  await knex.schema.createTable("layout_nodes", (t) => {
    t.integer("layout_version_id").unsigned().notNullable();
    t.integer("node").unsigned().notNullable();
    t.integer("x").unsigned().notNullable();
    t.integer("y").unsigned().notNullable();
    t.enu("kind", ["junction", "depot", "dropoff"]).notNullable();
    t.string("label", 24).nullable();
    t.primary(["layout_version_id", "node"]);
    t.foreign("layout_version_id").references("layout_versions.id").onDelete("CASCADE");
  });

  await knex.schema.createTable("layout_edges", (t) => {
    t.integer("layout_version_id").unsigned().notNullable();
    t.integer("edge").unsigned().notNullable();
    t.integer("from_node").unsigned().notNullable();
    t.integer("to_node").unsigned().notNullable();
    t.integer("length_mm").unsigned().notNullable();
    t.boolean("one_way").notNullable();
    // Cell indices walked from from_node to to_node, for drawing routes along the corridor.
    t.specificType("cells", "MEDIUMTEXT").notNullable();
    t.primary(["layout_version_id", "edge"]);
    t.foreign("layout_version_id").references("layout_versions.id").onDelete("CASCADE");
  });

  await knex.schema.createTable("layout_access_points", (t) => {
    t.integer("layout_version_id").unsigned().notNullable();
    t.integer("access_point").unsigned().notNullable();
    t.integer("x").unsigned().notNullable();
    t.integer("y").unsigned().notNullable();
    t.integer("node").notNullable();
    t.integer("edge").notNullable();
    t.integer("offset_mm").unsigned().notNullable();
    t.primary(["layout_version_id", "access_point"]);
    t.foreign("layout_version_id").references("layout_versions.id").onDelete("CASCADE");
  });

  await knex.schema.createTable("layout_bins", (t) => {
    t.integer("layout_version_id").unsigned().notNullable();
    t.string("code", 32).notNullable();
    t.string("rack_run", 24).notNullable();
    t.integer("aisle").unsigned().notNullable();
    t.integer("bay").unsigned().notNullable();
    t.integer("level").unsigned().notNullable();
    t.integer("x").unsigned().notNullable();
    t.integer("y").unsigned().notNullable();
    t.integer("access_point").unsigned().notNullable();
    t.primary(["layout_version_id", "code"]);
    t.foreign("layout_version_id").references("layout_versions.id").onDelete("CASCADE");
  });

  // Long work (publishing now, wave planning later) runs as a job the browser polls for progress.
  await knex.schema.createTable("jobs", (t) => {
    t.string("id", 32).primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("kind", 32).notNullable();
    // What the job works on, e.g. "floor-plan:3@7"; a second request for the same key gets the same job.
    t.string("job_key", 120).notNullable();
    t.enu("status", ["queued", "running", "done", "failed", "cancelled"]).notNullable().defaultTo("queued");
    t.double("progress").notNullable().defaultTo(0);
    t.string("message", 500).notNullable().defaultTo("");
    t.json("result").nullable();
    t.string("created_by", 32).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
    t.index(["job_key", "status"]);
  });

  await knex.schema.createTable("uploads", (t) => {
    t.string("id", 32).primary();
    t.integer("site_id").unsigned().notNullable();
    t.string("purpose", 32).notNullable();
    t.string("mime", 64).notNullable();
    t.integer("bytes").unsigned().notNullable();
    t.string("created_by", 32).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.foreign("site_id").references("sites.id");
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    "uploads",
    "jobs",
    "layout_bins",
    "layout_access_points",
    "layout_edges",
    "layout_nodes",
    "layout_versions",
    "floor_plan_drafts",
    "floor_plans",
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}
