import "server-only";
import { db } from "./knex";

export async function databaseAnswers(): Promise<{ ok: true; migrations: number } | { ok: false; error: string }> {
  try {
    const r = await db()("knex_migrations").count({ n: "*" }).first();
    return { ok: true, migrations: Number(r?.n ?? 0) };
  } catch (e) {
    return { ok: false, error: (e as Error).message };
  }
}
