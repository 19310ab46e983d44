import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // New versions keep their matrices in layout_matrix_chunks; versions published before keep theirs here.
  await knex.schema.alterTable("layout_versions", (t) => {
    t.specificType("dist_matrix", "LONGBLOB").nullable().alter();
    t.specificType("next_matrix", "LONGBLOB").nullable().alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("layout_versions", (t) => {
    t.specificType("dist_matrix", "LONGBLOB").notNullable().alter();
    t.specificType("next_matrix", "LONGBLOB").notNullable().alter();
  });
}
