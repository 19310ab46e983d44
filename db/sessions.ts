import "server-only";
import mysql from "mysql2/promise";
import { Mysql2Adapter } from "@lucia-auth/adapter-mysql";
import { db } from "./knex";

// lucia's adapter speaks mysql2 directly; it gets its own small pool on the same credentials as knex.
const globalForPool = globalThis as unknown as { trailbinSessionPool?: mysql.Pool };

function pool(): mysql.Pool {
  globalForPool.trailbinSessionPool ??= mysql.createPool({
    host: process.env.DB_HOST ?? "127.0.0.1",
    port: Number(process.env.DB_PORT ?? 3306),
    user: process.env.DB_USER,
    password: process.env.DB_PASSWORD,
    database: process.env.DB_NAME,
    timezone: "Z",
    connectionLimit: 10,
  });
  return globalForPool.trailbinSessionPool;
}

export function sessionAdapter(): Mysql2Adapter {
  return new Mysql2Adapter(pool(), { user: "users", session: "sessions" });
}

export async function deleteUserSessions(userId: string): Promise<void> {
  await db()("sessions").where({ user_id: userId }).delete();
}

export async function countUserSessions(userId: string): Promise<number> {
  const r = await db()("sessions").where({ user_id: userId }).count({ n: "*" }).first();
  return Number(r?.n ?? 0);
}
