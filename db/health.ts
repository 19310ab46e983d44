import "server-only";
import { db } from "./knex";

// A monitor may poll health every few seconds through a long outage: log the reason when it starts
// or changes and when the database answers again, not on every poll.
let lastProblem: string | null = null;

/**
 * Whether the database answers. The reason it does not (driver text naming hosts, ports and accounts)
 * goes to the server log only: health is public, and callers need no more than "unavailable".
 */
export async function databaseAnswers(): Promise<{ ok: true; migrations: number } | { ok: false }> {
  try {
    const r = await db()("knex_migrations").count({ n: "*" }).first();
    if (lastProblem !== null) console.log("health: the database answers again");
    lastProblem = null;
    return { ok: true, migrations: Number(r?.n ?? 0) };
  } catch (e) {
    const problem = (e as Error).message;
    if (problem !== lastProblem) console.warn(`health: database unavailable: ${problem}`);
    lastProblem = problem;
    return { ok: false };
  }
}
