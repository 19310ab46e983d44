import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // A layout version's distance and next-hop matrices, in pieces of whole rows that each fit in one
  // MariaDB packet (max_allowed_packet): one INSERT of a 2,000-junction matrix would not.
  await knex.schema.createTable("layout_matrix_chunks", (t) => {
    t.integer("layout_version_id").unsigned().notNullable();
    t.enu("matrix", ["dist", "next"]).notNullable();
    t.integer("chunk").unsigned().notNullable();
    t.integer("first_row").unsigned().notNullable();
    // Int32 little-endian, rows first_row… row-major, as layout_versions.dist_matrix was.
    t.specificType("bytes", "MEDIUMBLOB").notNullable();
    t.primary(["layout_version_id", "matrix", "chunk"]);
    t.foreign("layout_version_id").references("layout_versions.id").onDelete("CASCADE");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("layout_matrix_chunks");
}
