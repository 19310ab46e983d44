import type { Knex } from "knex";

// Every batch's route carries a lower bound on the shortest possible walk, so the pages can say how
// close to the shortest it is. Rows planned before had only `optimal`, set exactly when Held–Karp
// ordered the stops: their bound is their length then, and 0 (no bound known) otherwise. Plans kept
// for comparison (wave_plans.batches, what storePlan takes) get the same bound, batch by batch.
type OldBatch = { distanceMm: number; optimal: boolean; method: string; lowerBoundMm?: number };

const PAGE = 50;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.integer("lower_bound_mm").unsigned().notNullable().defaultTo(0);
  });
  await knex("batches")
    .where({ optimal: true })
    .orWhere({ method: "held-karp" })
    .update({ lower_bound_mm: knex.ref("distance_mm") });
  // Kept from here on by storePlan; no default, so a writer that forgets the bound fails loudly.
  await knex.raw("alter table batches alter column lower_bound_mm drop default");

  for (let after = 0; ;) {
    const plans: { id: number; batches: unknown }[] = await knex("wave_plans")
      .where("id", ">", after)
      .orderBy("id")
      .limit(PAGE)
      .select("id", "batches");
    if (plans.length === 0) break;
    for (const p of plans) {
      const batches = (typeof p.batches === "string" ? JSON.parse(p.batches) : p.batches) as OldBatch[];
      const bounded = batches.map((b) => ({
        ...b,
        lowerBoundMm: b.lowerBoundMm ?? (b.optimal || b.method === "held-karp" ? b.distanceMm : 0),
      }));
      await knex("wave_plans")
        .where({ id: p.id })
        .update({ batches: JSON.stringify(bounded) });
    }
    after = plans[plans.length - 1]!.id;
  }
}

// The bounds stay in wave_plans.batches on the way down: storePlan before this step ignores them.
export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("batches", (t) => {
    t.dropColumn("lower_bound_mm");
  });
}
