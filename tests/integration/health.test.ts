import { afterAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { api } from "../support/app";
import { testService } from "../support/test-services";

// /api/health is public (monitors call it without a session): when the database is down it says so
// in two words and nothing about why, since driver errors name hosts, ports and accounts. The why
// goes to the server log, where the person running the server reads it.

const serverLog = () => readFileSync(path.resolve(process.cwd(), ".data/test/next.log"), "utf8");

afterAll(async () => {
  // Whatever happened above, the next test files need the database.
  await testService("mariadb", "start").catch(() => undefined);
});

describe("health with the database down", () => {
  it('tells an anonymous caller only "database unavailable" and logs the details on the server', async () => {
    const logBefore = serverLog().length;
    await testService("mariadb", "stop");
    try {
      const res = await api().get("/api/health");
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: "unavailable", database: "database unavailable" });
      expect(res.headers["retry-after"]).toMatch(/^\d+$/);
      // The driver's words (ECONNREFUSED, the address) stay out of the answer but reach the log.
      expect(res.text).not.toMatch(/ECONN|127\.0\.0\.1|connect|refused|port/i);
      const logged = serverLog().slice(logBefore);
      expect(logged).toMatch(/health: database unavailable: \S/);
    } finally {
      await testService("mariadb", "start");
    }
    const back = await api().get("/api/health");
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ status: "ok", database: "ok" });
  });
});
