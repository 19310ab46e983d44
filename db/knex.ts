import "server-only";
import knexFactory, { type Knex } from "knex";
import config from "../knexfile";

// One pool per server process; Next may evaluate this module more than once in dev, so keep it global.
const globalForKnex = globalThis as unknown as { trailbinKnex?: Knex };

export function db(): Knex {
  globalForKnex.trailbinKnex ??= knexFactory(config);
  return globalForKnex.trailbinKnex;
}
