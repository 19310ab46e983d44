import { afterAll, describe, expect, it } from "vitest";
import { api, ORIGIN } from "../support/app";
import { auditedSince, auditMark } from "../support/audit";
import { readFileSync } from "node:fs";
import { startSecondServer } from "../support/second-server";
import { closeDb } from "@/db/knex";

// The main test server names no trusted proxy, so the client's address is its socket's (127.0.0.1
// here) whatever X-Forwarded-For says: the header cannot spread failures over made-up addresses,
// forge the audit log, or lock out the people behind someone else's address.

afterAll(closeDb);

let n = 0;
const wrongSignIn = (forwardedFor: string) =>
  api()
    .post("/api/session")
    .set("Origin", ORIGIN)
    .set("X-Forwarded-For", forwardedFor)
    .send({ email: `nobody-${Date.now()}-${++n}@tests.example`, password: "wrong password" });

describe("client address without a trusted proxy", () => {
  it("a forged X-Forwarded-For is not what the audit log records", async () => {
    const mark = await auditMark();
    expect((await wrongSignIn("198.51.100.7")).status).toBe(401);
    const [entry] = await auditedSince(mark, "sign_in.failure");
    expect(entry?.ip).toBe("127.0.0.1");
  });

  it("rotating X-Forwarded-For counts every failure against the one real address", async () => {
    const mark = await auditMark();
    for (const forged of ["198.51.100.8", "198.51.100.9, 198.51.100.10", "not an address"])
      expect((await wrongSignIn(forged)).status).toBe(401);
    const entries = await auditedSince(mark, "sign_in.failure");
    expect(entries.map((e) => e.ip)).toEqual(["127.0.0.1", "127.0.0.1", "127.0.0.1"]);
  });

  it("refusals of pages and handlers record the socket's address too", async () => {
    const mark = await auditMark();
    expect((await api().get("/api/users").set("X-Forwarded-For", "198.51.100.11")).status).toBe(401);
    expect((await api().get("/admin/users").set("X-Forwarded-For", "198.51.100.12")).status).toBeLessThan(500);
    const entries = await auditedSince(mark, "access.anonymous");
    expect(entries.map((e) => e.ip)).toEqual(["127.0.0.1", "127.0.0.1"]);
  });
});

describe("TRUSTED_PROXIES", () => {
  it("a server given an entry it cannot read does not start, and says which entry", async () => {
    await expect(
      startSecondServer({ TRUSTED_PROXIES: "127.0.0.1, proxy.local" }, "bad-trusted-proxies"),
    ).rejects.toThrow(/exited before answering/);
    expect(readFileSync(".data/test/second-app-bad-trusted-proxies.log", "utf8")).toMatch(
      /TRUSTED_PROXIES: "proxy\.local" is not an IP address/,
    );
  });
});
