import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { concrete, concretePage, discoverRoutes } from "../support/app-routes";
import { auditedSince, auditMark } from "../support/audit";
import { API_ACCESS, PAGE_ACCESS } from "@/lib/auth/access-table";
import { startSession } from "@/lib/auth/session";
import { SESSION_ABSOLUTE_MS } from "@/lib/auth/lucia";
import { db } from "@/db/knex";

afterAll(() => db().destroy());

const { pages, handlers } = discoverRoutes();
const protectedCalls = handlers.flatMap((h) =>
  h.methods.filter((m) => API_ACCESS[h.url]![m] !== "public").map((method) => ({ url: h.url, method })),
);
const protectedPages = pages.filter((p) => PAGE_ACCESS[p] !== "public" && p !== "/");

let deadCookie: Promise<string> | undefined;
/** A cookie whose session was ended by signing out: what a stolen or replayed cookie looks like. */
function signedOutCookie(): Promise<string> {
  deadCookie ??= (async () => {
    const cookie = await signInAs("admin");
    const out = await api().delete("/api/session").set("Cookie", cookie).set("Origin", ORIGIN);
    expect(out.status).toBe(200);
    return cookie;
  })();
  return deadCookie;
}

const sessionCookie = (id: string) => `trailbin_session=${id}`;
const me = (cookie: string) => api().get("/api/my-batches").set("Cookie", cookie);

describe("a cookie of an ended session opens nothing, and each refusal is audited", () => {
  it("there are protected routes and pages to check", () => {
    expect(protectedCalls.length).toBeGreaterThan(10);
    expect(protectedPages.length).toBeGreaterThan(5);
  });

  it.each(protectedCalls)("signed out: $method $url → 401", async ({ url, method }) => {
    const cookie = await signedOutCookie();
    const mark = await auditMark();
    const req = api()[method.toLowerCase() as "post"](concrete(url)).set("Cookie", cookie).set("Origin", ORIGIN);
    const res = await (method === "GET" ? req : req.send({ version: 1 }));
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/sign in/i);
    expect((await auditedSince(mark, "session.refused")).map((e) => e.subject)).toContain(`${method} ${concrete(url)}`);
  });

  it.each(protectedPages)("signed out: page %s → sign-in", async (p) => {
    const cookie = await signedOutCookie();
    const mark = await auditMark();
    const res = await api().get(concretePage(p)).set("Cookie", cookie).redirects(0);
    expect(res.status).toBe(307);
    expect(res.headers.location).toContain("/sign-in");
    expect((await auditedSince(mark, "session.refused")).map((e) => e.subject)).toContain(concretePage(p));
  });
});

describe("expired, revoked and forged sessions", () => {
  it("past its idle expiry: refused and audited", async () => {
    const u = await makeUser("picker");
    const session = await startSession(u.id);
    expect((await me(sessionCookie(session.id))).status).toBe(200);
    await db()("sessions")
      .where({ id: session.id })
      .update({ expires_at: new Date(Date.now() - 1000) });
    const mark = await auditMark();
    const res = await me(sessionCookie(session.id));
    expect(res.status).toBe(401);
    expect(await auditedSince(mark, "session.refused")).toHaveLength(1);
  });

  it("past the absolute lifetime: refused, the session deleted, both audited", async () => {
    const u = await makeUser("picker");
    const session = await startSession(u.id, new Date(Date.now() - SESSION_ABSOLUTE_MS - 60_000));
    const mark = await auditMark();
    expect((await me(sessionCookie(session.id))).status).toBe(401);
    const expired = await auditedSince(mark, "session.expired");
    expect(expired.map((e) => e.actorUserId)).toEqual([u.id]);
    expect(await auditedSince(mark, "session.refused")).toHaveLength(1);
    expect(await db()("sessions").where({ id: session.id }).first()).toBeUndefined();
  });

  it("revoked by an admin disabling the account: the old cookie is refused and audited", async () => {
    const u = await makeUser("picker");
    const cookie = await signIn(u.email, u.password);
    expect((await me(cookie)).status).toBe(200);
    const admin = await signInAs("admin");
    const off = await api()
      .patch(`/api/users/${u.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: u.version, disabled: true });
    expect(off.status).toBe(200);
    const mark = await auditMark();
    expect((await me(cookie)).status).toBe(401);
    expect((await auditedSince(mark, "session.refused")).map((e) => e.subject)).toEqual(["GET /api/my-batches"]);
  });

  it("a made-up session id is refused and audited, no cookie at all is audited as anonymous", async () => {
    const mark = await auditMark();
    expect((await me(sessionCookie("forgedforgedforgedforged"))).status).toBe(401);
    expect((await api().get("/api/my-batches")).status).toBe(401);
    expect(await auditedSince(mark, "session.refused")).toHaveLength(1);
    expect((await auditedSince(mark, "access.anonymous")).map((e) => e.subject)).toEqual(["GET /api/my-batches"]);
  });
});
