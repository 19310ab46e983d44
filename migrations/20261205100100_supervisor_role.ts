import type { Knex } from "knex";

// The shift supervisor runs the floor: sees every released batch, assigns and moves them, follows up short picks.
export async function up(knex: Knex): Promise<void> {
  await knex.raw("alter table users modify role enum('admin','planner','picker','supervisor') not null");
}

export async function down(knex: Knex): Promise<void> {
  await knex("users").where({ role: "supervisor" }).update({ role: "picker" });
  await knex.raw("alter table users modify role enum('admin','planner','picker') not null");
}
