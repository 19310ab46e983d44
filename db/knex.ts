import "server-only";
import knexFactory, { type Knex } from "knex";
import config from "../knexfile";

// One pool per server process; Next may evaluate this module more than once in dev, so keep it global.
const globalForKnex = globalThis as unknown as { trailbinKnex?: Knex };

export function db(): Knex {
  globalForKnex.trailbinKnex ??= knexFactory(config);
  return globalForKnex.trailbinKnex;
}

/** For scripts and seeds: end the pool so the process can exit. */
export async function closeDb(): Promise<void> {
  const k = globalForKnex.trailbinKnex;
  globalForKnex.trailbinKnex = undefined;
  await k?.destroy();
}
