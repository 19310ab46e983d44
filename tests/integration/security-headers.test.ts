import { beforeAll, describe, expect, it } from "vitest";
import type { Response } from "supertest";
import { api, signInAs } from "../support/app";
import { concretePage, discoverRoutes } from "../support/app-routes";
import { cspDirectives, scriptNonce, scriptTags } from "../support/csp";
import { PAGE_ACCESS } from "@/lib/auth/access-table";
import { ROLES, roleMay, type Role } from "@/lib/auth/permissions";

// What a strict nonce-based policy looks like: web.dev "Mitigate XSS with a strict CSP" and the OWASP
// Secure Headers project's recommended values.
const { pages } = discoverRoutes();

function expectCommonHeaders(res: Response) {
  expect(res.headers["x-content-type-options"]).toBe("nosniff");
  expect(res.headers["x-frame-options"]).toBe("DENY");
  expect(res.headers["referrer-policy"]).toBe("same-origin");
  expect(res.headers["cross-origin-opener-policy"]).toBe("same-origin");
  expect(res.headers["cross-origin-resource-policy"]).toBe("same-origin");
  expect(res.headers["permissions-policy"]).toMatch(/microphone=\(\)/);
  expect(res.headers["permissions-policy"]).toMatch(/geolocation=\(\)/);
  expect(res.headers["x-powered-by"]).toBeUndefined();
}

/** The page policy: checked directive by directive, and the nonce it names returned. */
function expectPagePolicy(res: Response): string {
  const header = res.headers["content-security-policy"] as string | undefined;
  expect(header, "the page has a Content-Security-Policy").toBeTruthy();
  const d = cspDirectives(header);
  const nonce = scriptNonce(header);
  expect(nonce).toMatch(/^[A-Za-z0-9+/]{22}==$/);
  expect(d.get("script-src")).toEqual(["'self'", `'nonce-${nonce}'`, "'strict-dynamic'"]);
  expect(d.get("style-src")).toEqual(["'self'", `'nonce-${nonce}'`]);
  expect(d.get("default-src")).toEqual(["'self'"]);
  expect(d.get("object-src")).toEqual(["'none'"]);
  expect(d.get("base-uri")).toEqual(["'none'"]);
  expect(d.get("frame-ancestors")).toEqual(["'none'"]);
  expect(d.get("form-action")).toEqual(["'self'"]);
  expect(d.get("img-src")).toEqual(["'self'", "data:", "blob:"]);
  expect(d.get("font-src")).toEqual(["'self'"]);
  expect(d.get("connect-src")).toEqual(["'self'"]);
  expect(header).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
  expect(res.headers["content-security-policy-report-only"]).toBeUndefined();
  return nonce!;
}

/** A rendered page: every script carries this response's nonce, and there are scripts to carry it. */
function expectNoncedScripts(res: Response, nonce: string, { stylesheet = true } = {}) {
  const tags = scriptTags(res.text);
  expect(tags.length).toBeGreaterThan(0);
  for (const tag of tags) expect(tag).toContain(` nonce="${nonce}"`);
  // Next's stylesheet links carry it too, so the style-src nonce is not decoration. (The 403/404
  // shells load the stylesheet from the page's data instead, with the same nonce.)
  if (stylesheet)
    expect(res.text).toMatch(new RegExp(`<link rel="stylesheet" [^>]*nonce="${nonce.replace(/[+/=]/g, "\\$&")}"`));
}

describe("anonymous visitors", () => {
  it.each(pages)("%s answers with the security headers and a page policy", async (p) => {
    const first = await api().get(concretePage(p)).redirects(0);
    expectCommonHeaders(first);
    const nonce = expectPagePolicy(first);
    if (PAGE_ACCESS[p] === "public") {
      expect(first.status).toBe(200);
      expectNoncedScripts(first, nonce);
      const second = await api().get(concretePage(p)).redirects(0);
      const again = expectPagePolicy(second);
      expect(again).not.toBe(nonce);
      expectNoncedScripts(second, again);
    } else {
      // requireRole sends people without a session to the sign-in page.
      expect(first.status).toBe(307);
      expect(first.headers.location).toContain(`/sign-in?next=${encodeURIComponent(concretePage(p))}`);
    }
  });

  it("a policy sent by the browser does not choose the nonce", async () => {
    const res = await api()
      .get("/sign-in")
      .set("Content-Security-Policy", "script-src 'nonce-AAAAAAAAAAAAAAAAAAAAAA=='")
      .redirects(0);
    const nonce = expectPagePolicy(res);
    expect(nonce).not.toBe("AAAAAAAAAAAAAAAAAAAAAA==");
    expect(res.text).not.toContain("AAAAAAAAAAAAAAAAAAAAAA==");
    expectNoncedScripts(res, nonce);
  });
});

describe("signed-in people", () => {
  const cookies: Partial<Record<Role, string>> = {};
  beforeAll(async () => {
    for (const r of ROLES) cookies[r] = await signInAs(r);
  });

  const cases = pages.flatMap((p) => ROLES.filter((r) => roleMay(r, PAGE_ACCESS[p]!)).map((role) => ({ p, role })));
  it.each(cases)("$role on $p: headers, policy, a fresh nonce on every script", async ({ p, role }) => {
    const seen = new Set<string>();
    for (let i = 0; i < 2; i++) {
      const res = await api().get(concretePage(p)).set("Cookie", cookies[role]!).redirects(0);
      expectCommonHeaders(res);
      const nonce = expectPagePolicy(res);
      seen.add(nonce);
      if (res.status === 200) expectNoncedScripts(res, nonce);
      else expect(res.status, `${p} redirects a signed-in ${role}`).toBe(307);
    }
    expect(seen.size).toBe(2);
  });

  it("a page someone's role may not open (403) still carries the policy", async () => {
    const res = await api().get("/admin/users").set("Cookie", cookies.picker!).redirects(0);
    expect(res.status).toBe(403);
    expectCommonHeaders(res);
    expectNoncedScripts(res, expectPagePolicy(res), { stylesheet: false });
  });

  it("an address with no page (404) still carries the policy", async () => {
    const res = await api().get("/no-such-page").set("Cookie", cookies.planner!).redirects(0);
    expect(res.status).toBe(404);
    expectCommonHeaders(res);
    expectNoncedScripts(res, expectPagePolicy(res), { stylesheet: false });
  });
});

describe("route handlers and static files", () => {
  it.each([
    ["/api/health", 200],
    ["/api/items", 401],
  ])("%s: the common headers and a policy that lets nothing run", async (url, status) => {
    const res = await api().get(url);
    expect(res.status).toBe(status);
    expectCommonHeaders(res);
    const d = cspDirectives(res.headers["content-security-policy"]);
    expect(d.get("default-src")).toEqual(["'none'"]);
    expect(d.get("frame-ancestors")).toEqual(["'none'"]);
    expect(res.headers["content-type"]).toMatch(/^application\/json/);
  });

  it("Next's script chunks get the common headers", async () => {
    const page = await api().get("/sign-in");
    const src = scriptTags(page.text)
      .map((t) => t.match(/src="([^"]+)"/)?.[1])
      .find(Boolean);
    expect(src).toMatch(/^\/_next\/static\//);
    const res = await api().get(src!);
    expect(res.status).toBe(200);
    expectCommonHeaders(res);
  });
});
