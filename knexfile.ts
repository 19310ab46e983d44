import type { Knex } from "knex";

// scripts/start.sh and scripts/test.sh export these (from .env.local or the test datadir);
// the app, the migrations and the seeds all read the same variables.
function required(name: string): string {
  const value = process.env[name];
  if (!value)
    throw new Error(`${name} is not set: run the app through "npm start" or "npm test", which set up the database`);
  return value;
}

const config: Knex.Config = {
  client: "mysql2",
  connection: () => ({
    host: process.env.DB_HOST ?? "127.0.0.1",
    port: Number(process.env.DB_PORT ?? 3306),
    user: required("DB_USER"),
    password: required("DB_PASSWORD"),
    database: required("DB_NAME"),
    timezone: "Z",
    dateStrings: false,
    supportBigNumbers: true,
  }),
  pool: { min: 0, max: 10 },
  migrations: { directory: "./migrations", extension: "ts", loadExtensions: [".ts"] },
  seeds: { directory: "./db/seeds", extension: "ts", loadExtensions: [".ts"] },
};

export default config;
