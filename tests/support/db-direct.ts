import mysql from "mysql2/promise";

/**
 * A connection of the test's own, as the app's database user (DB_* from npm test): for watching the
 * server's process list and killing the app's connections, which MariaDB lets a user do to its own.
 */
export function appUserConnection(): Promise<mysql.Connection> {
  return mysql.createConnection({
    host: process.env.DB_HOST ?? "127.0.0.1",
    port: Number(process.env.DB_PORT),
    user: process.env.DB_USER,
    password: process.env.DB_PASSWORD,
    database: process.env.DB_NAME,
  });
}
