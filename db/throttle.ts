import "server-only";
import { db } from "./knex";

/** An attempt's place in its window: n counts it and every other attempt kept or still in flight. */
export type Count = { n: number; kept: number; windowStart: Date };

const DEADLOCK = new Set(["ER_LOCK_DEADLOCK", "ER_LOCK_WAIT_TIMEOUT"]);

/**
 * Counts one attempt and answers the count in the current window, this attempt included. The row is
 * locked from the upsert to the commit, so every parallel attempt gets a count of its own: the 11th of
 * 200 sent at once sees 11, never 10. A window older than `windowMs` (or emptied) starts over.
 */
export async function countAttempt(scope: string, subject: string, windowMs: number, now: Date): Promise<Count> {
  for (let attempt = 1; ; attempt++) {
    try {
      // READ COMMITTED takes no gap locks, which is what lets InnoDB deadlock two first inserts of a key.
      return await db().transaction(
        async (trx) => {
          // ON DUPLICATE KEY UPDATE takes the row's exclusive lock (INSERT IGNORE would take a shared one,
          // and two shared holders wanting to write deadlock).
          await trx.raw(
            "INSERT INTO throttle_counters (scope, subject, n, kept, window_start) VALUES (?, ?, 0, 0, ?) ON DUPLICATE KEY UPDATE n = n",
            [scope, subject, now],
          );
          const row = (await trx("throttle_counters").where({ scope, subject }).first("n", "kept", "window_start")) as {
            n: number;
            kept: number;
            window_start: Date;
          };
          const fresh = row.n === 0 || row.window_start.getTime() <= now.getTime() - windowMs;
          const next: Count = fresh
            ? { n: 1, kept: 0, windowStart: now }
            : { n: row.n + 1, kept: row.kept, windowStart: row.window_start };
          await trx("throttle_counters")
            .where({ scope, subject })
            .update({ n: next.n, kept: next.kept, window_start: next.windowStart });
          return next;
        },
        { isolationLevel: "read committed" },
      );
    } catch (e) {
      // Insurance only: one row per transaction leaves InnoDB little to deadlock on.
      if (attempt >= 3 || !DEADLOCK.has((e as { code?: string }).code ?? "")) throw e;
    }
  }
}

// Both leave a later window alone: an attempt belongs to the window it was counted in.

/** The attempt stays counted for the rest of its window (a wrong password, a reset mail). */
export async function keepAttempt(scope: string, subject: string, windowStart: Date): Promise<void> {
  await db()("throttle_counters").where({ scope, subject, window_start: windowStart }).increment("kept", 1);
}

/** Takes the attempt back (a right password, or one refused by another cap). */
export async function uncountAttempt(scope: string, subject: string, windowStart: Date): Promise<void> {
  await db()("throttle_counters")
    .where({ scope, subject, window_start: windowStart })
    .andWhere("n", ">", 0)
    .decrement("n", 1);
}
