import { afterAll, describe, expect, it, beforeAll } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { auditedSince, auditMark } from "../support/audit";
import { closeDb } from "@/db/knex";
import { concrete, concretePage, discoverRoutes } from "../support/app-routes";
import { API_ACCESS, PAGE_ACCESS } from "@/lib/auth/access-table";
import { ROLES, ROLE_HOME, roleMay, type Role } from "@/lib/auth/permissions";

const { pages, handlers } = discoverRoutes();

afterAll(closeDb);

// Every refusal below must also be in the audit log, naming what was asked for.

describe("every route under app/ has an access decision", () => {
  it("found the app's pages and handlers", () => {
    expect(pages).toContain("/sign-in");
    expect(handlers.map((h) => h.url)).toContain("/api/health");
  });
  it.each(pages)("page %s is in PAGE_ACCESS", (p) =>
    expect(PAGE_ACCESS[p], `add ${p} to lib/auth/access-table.ts`).toBeDefined(),
  );
  it.each(handlers)("handler $url declares exactly its exported methods", ({ url, methods }) => {
    expect(Object.keys(API_ACCESS[url] ?? {}).sort()).toEqual([...methods].sort());
  });
});

describe("role × page matrix", () => {
  const cookies: Partial<Record<Role, string>> = {};
  beforeAll(async () => {
    for (const r of ROLES) cookies[r] = await signInAs(r);
  });

  it.each(pages)("anonymous %s: only public pages render, the rest go to sign-in (audited)", async (p) => {
    const mark = await auditMark();
    const res = await api().get(concretePage(p)).redirects(0);
    if (PAGE_ACCESS[p] === "public") expect(res.status).toBe(200);
    else {
      expect(res.status).toBeGreaterThanOrEqual(300);
      expect(res.status).toBeLessThan(400);
      expect(res.headers.location).toContain("/sign-in");
      expect((await auditedSince(mark, "access.anonymous")).map((e) => e.subject)).toContain(concretePage(p));
    }
  });

  for (const role of ROLES) {
    it.each(pages)(`${role} on %s gets what the permission table allows`, async (p) => {
      const access = PAGE_ACCESS[p]!;
      const mark = await auditMark();
      const res = await api().get(concretePage(p)).set("Cookie", cookies[role]!).redirects(0);
      if (p === "/" || p === "/sign-in") {
        // Both send a signed-in person to their own start page.
        expect(res.status).toBe(307);
        expect(res.headers.location).toContain(ROLE_HOME[role]);
      } else if (roleMay(role, access)) expect(res.status).toBe(200);
      else {
        expect(res.status).toBe(403);
        expect((await auditedSince(mark, "access.denied")).map((e) => e.subject)).toContain(concretePage(p));
      }
    });
  }
});

describe("role × route handler matrix", () => {
  const cases = handlers.flatMap((h) =>
    h.methods.map((m) => ({ url: h.url, method: m, access: API_ACCESS[h.url]![m]! })),
  );

  it.each(cases)("anonymous $method $url", async ({ url, method, access }) => {
    const mark = await auditMark();
    const res = await api()
      [method.toLowerCase() as "get"](concrete(url))
      .set("Origin", ORIGIN)
      .send(method === "GET" ? undefined : {});
    if (access === "public") expect([401, 403]).not.toContain(res.status);
    else {
      expect(res.status).toBe(401);
      expect(res.body.error).toMatch(/sign in/i);
      expect((await auditedSince(mark, "access.anonymous")).map((e) => e.subject)).toContain(
        `${method} ${concrete(url)}`,
      );
    }
  });

  for (const role of ROLES) {
    it.each(cases)(`${role}: $method $url`, async ({ url, method, access }) => {
      // A fresh session per request: DELETE /api/session would end a shared one.
      const cookie = await signInAs(role);
      const mark = await auditMark();
      const req = api()[method.toLowerCase() as "get"](concrete(url)).set("Cookie", cookie).set("Origin", ORIGIN);
      const res = await (method === "GET" ? req : req.send({}));
      if (roleMay(role, access)) expect([401, 403]).not.toContain(res.status);
      else {
        expect(res.status).toBe(403);
        expect(res.body.error).toMatch(/role/i);
        expect((await auditedSince(mark, "access.denied")).map((e) => e.subject)).toContain(
          `${method} ${concrete(url)}`,
        );
      }
      expect(res.status).toBeLessThan(500);
    });
  }
});
