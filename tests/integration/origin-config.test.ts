import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { api, APP_URL, demoAccount } from "../support/app";
import { startSecondServer, type SecondServer } from "../support/second-server";
import { db } from "@/db/knex";

// The Origin of a state-changing request is compared with the configured public origin (APP_ORIGIN),
// not with the Host header, which the client chooses.

let server: SecondServer | null = null;
afterEach(async () => {
  await server?.stop();
  server = null;
});
afterAll(async () => {
  await db().destroy();
});

const planner = demoAccount("planner");
const signInFrom = (origin: string, host?: string, on = api) => {
  let req = on().post("/api/session").set("Origin", origin);
  if (host) req = req.set("Host", host);
  return req.send({ email: planner.email, password: planner.password });
};

describe("Origin against APP_ORIGIN", () => {
  it("a foreign page that also sends its own name as Host is refused", async () => {
    const res = await signInFrom("http://evil.example", "evil.example");
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/Origin/);
  });

  it("https on this plain-HTTP site is refused; the site's own http origin is accepted", async () => {
    const ours = new URL(APP_URL);
    const https = await signInFrom(`https://${ours.host}`);
    expect(https.status).toBe(403);
    expect((await signInFrom(ours.origin)).status).toBe(200);
  });

  it("a LAN host name listed in APP_ORIGIN is accepted even though the request's Host is the loopback address", async () => {
    const port = process.env.TEST_SECOND_APP_PORT;
    const lan = `http://handheld-gate.lan:${port}`;
    server = await startSecondServer({ APP_ORIGIN: `http://127.0.0.1:${port},${lan}` }, "origin-list");
    expect((await signInFrom(lan, undefined, server.api)).status).toBe(200);
    expect((await signInFrom(`http://elsewhere.lan:${port}`, undefined, server.api)).status).toBe(403);
  });

  it("a production server without APP_ORIGIN does not start, and says what to set", async () => {
    await expect(startSecondServer({ APP_ORIGIN: "" }, "no-origin").then((s) => (server = s))).rejects.toThrow(
      /exited before answering/,
    );
    const log = readFileSync(path.resolve(process.cwd(), ".data/test/second-app-no-origin.log"), "utf8");
    expect(log).toMatch(/APP_ORIGIN is not set/);
    expect(log).toMatch(/http:\/\/127\.0\.0\.1:3000/);
  });
});
