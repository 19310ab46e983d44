import { afterAll, describe, expect, it } from "vitest";
import { api, demoAccount, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { latestAudit } from "@/db/audit";
import { countUserSessions } from "@/db/sessions";
import { startSession, validateSessionId } from "@/lib/auth/session";
import { SESSION_ABSOLUTE_MS, SESSION_IDLE } from "@/lib/auth/lucia";
import { MAX_FAILURES_PER_ACCOUNT } from "@/lib/auth/throttle";
import { db } from "@/db/knex";

afterAll(async () => {
  await db().destroy();
});

const me = (cookie: string) => api().get("/api/session").set("Cookie", cookie);

describe("sign-in", () => {
  it("a demo planner signs in, is sent to waves, and the session works", async () => {
    const a = demoAccount("planner");
    const res = await api()
      .post("/api/session")
      .set("Origin", ORIGIN)
      .send({ email: a.email.toUpperCase(), password: a.password });
    expect(res.status).toBe(200);
    expect(res.body.home).toBe("/waves");
    const setCookie = String([res.headers["set-cookie"]].flat()[0]);
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    const cookie = setCookie.split(";")[0]!;
    const who = await me(cookie);
    expect(who.status).toBe(200);
    expect(who.body.user).toMatchObject({ email: a.email, role: "planner" });
    expect(who.body.user.passwordHash).toBeUndefined();
  });

  it("a wrong password gets 401 with a message a person can act on, and is audited", async () => {
    const u = await makeUser("picker");
    const res = await api()
      .post("/api/session")
      .set("Origin", ORIGIN)
      .send({ email: u.email, password: "wrong password!" });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/do not match/);
    expect(res.headers["set-cookie"]).toBeUndefined();
    const [last] = await latestAudit(1, "sign_in.failure");
    expect(last?.subject).toBe(u.email);
  });

  it("an unknown account gets the same answer as a wrong password", async () => {
    const res = await api()
      .post("/api/session")
      .set("Origin", ORIGIN)
      .send({ email: "nobody@tests.example", password: "whatever it is" });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/do not match/);
  });

  it("a malformed body gets 400 naming the fields", async () => {
    const res = await api().post("/api/session").set("Origin", ORIGIN).send({ email: "not-an-address", password: "" });
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(["email", "password"]);
  });

  it("a body that is not JSON gets 400", async () => {
    const res = await api()
      .post("/api/session")
      .set("Origin", ORIGIN)
      .set("content-type", "application/json")
      .send("{oops");
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/not valid JSON/);
  });

  it("a successful sign-in is audited", async () => {
    const u = await makeUser("planner");
    await signIn(u.email, u.password);
    const [last] = await latestAudit(1, "sign_in.success");
    expect(last?.subject).toBe(u.email);
  });
});

describe("sign-out", () => {
  it("deletes the session on the server, so the old cookie is dead", async () => {
    const cookie = await signInAs("picker");
    expect((await me(cookie)).status).toBe(200);
    const out = await api().delete("/api/session").set("Cookie", cookie).set("Origin", ORIGIN);
    expect(out.status).toBe(200);
    expect(String([out.headers["set-cookie"]].flat()[0])).toMatch(/Max-Age=0/i);
    expect((await me(cookie)).status).toBe(401);
  });
});

describe("throttling", () => {
  it(`after ${MAX_FAILURES_PER_ACCOUNT} failures in 15 minutes even the right password waits, with a time to try again`, async () => {
    const u = await makeUser("picker");
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) {
      const r = await api()
        .post("/api/session")
        .set("Origin", ORIGIN)
        .send({ email: u.email, password: `wrong-${i}` });
      expect(r.status).toBe(401);
    }
    const res = await api().post("/api/session").set("Origin", ORIGIN).send({ email: u.email, password: u.password });
    expect(res.status).toBe(429);
    expect(res.body.error).toMatch(/Try again at \d\d:\d\d/);
    const retryAt = new Date(res.body.retryAt).getTime();
    expect(retryAt).toBeGreaterThan(Date.now() + 14 * 60 * 1000);
    expect(retryAt).toBeLessThanOrEqual(Date.now() + 15 * 60 * 1000 + 1000);
    const [last] = await latestAudit(1, "sign_in.throttled");
    expect(last?.subject).toBe(u.email);
  });

  it("another account from the same place is not locked by it", async () => {
    const u = await makeUser("picker");
    expect(await signIn(u.email, u.password)).toMatch(/^trailbin_session=/);
  });
});

describe("session lifetime", () => {
  it("a session older than the absolute lifetime is refused and deleted, however recently it was used", async () => {
    const u = await makeUser("picker");
    const signedInAt = new Date();
    const session = await startSession(u.id, signedInAt);
    expect(
      await validateSessionId(session.id, new Date(signedInAt.getTime() + SESSION_ABSOLUTE_MS - 60_000)),
    ).not.toBeNull();
    expect(
      await validateSessionId(session.id, new Date(signedInAt.getTime() + SESSION_ABSOLUTE_MS + 60_000)),
    ).toBeNull();
    expect(await countUserSessions(u.id)).toBe(0);
  });

  it("a session past its idle expiry is refused", async () => {
    const u = await makeUser("picker");
    const session = await startSession(u.id);
    await db()("sessions")
      .where({ id: session.id })
      .update({ expires_at: new Date(Date.now() - 1000) });
    expect(await validateSessionId(session.id)).toBeNull();
    expect(SESSION_IDLE.milliseconds()).toBeLessThan(SESSION_ABSOLUTE_MS);
  });
});

describe("user administration", () => {
  it("changing a role ends that user's sessions", async () => {
    const u = await makeUser("picker");
    const cookie = await signIn(u.email, u.password);
    const admin = await signInAs("admin");
    const res = await api()
      .patch(`/api/users/${u.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: u.version, role: "planner" });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe("planner");
    expect((await me(cookie)).status).toBe(401);
  });

  it("disabling a user ends their sessions and stops sign-in", async () => {
    const u = await makeUser("planner");
    const cookie = await signIn(u.email, u.password);
    const admin = await signInAs("admin");
    const res = await api()
      .patch(`/api/users/${u.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: u.version, disabled: true });
    expect(res.status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
    const again = await api().post("/api/session").set("Origin", ORIGIN).send({ email: u.email, password: u.password });
    expect(again.status).toBe(401);
  });

  it("a stale version gets 409 and changes nothing", async () => {
    const u = await makeUser("picker");
    const admin = await signInAs("admin");
    const first = await api()
      .patch(`/api/users/${u.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: u.version, role: "planner" });
    expect(first.status).toBe(200);
    const stale = await api()
      .patch(`/api/users/${u.id}`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: u.version, role: "admin" });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/Reload/);
    const list = await api().get("/api/users").set("Cookie", admin);
    expect(list.body.users.find((x: { id: string }) => x.id === u.id).role).toBe("planner");
  });

  it("a duplicate e-mail (any letter case) gets 409 with a message", async () => {
    const admin = await signInAs("admin");
    const res = await api().post("/api/users").set("Cookie", admin).set("Origin", ORIGIN).send({
      email: "PLANNER@bramblegate.example",
      displayName: "Twin",
      role: "picker",
      password: "long enough password",
    });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/already exists/);
  });

  it("a short first password is refused with the rule", async () => {
    const admin = await signInAs("admin");
    const res = await api()
      .post("/api/users")
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ email: "short@tests.example", displayName: "S", role: "picker", password: "short" });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].message).toMatch(/12 characters/);
  });
});

describe("health", () => {
  it("checks the database", async () => {
    const res = await api().get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: "ok", database: "ok" });
    expect(res.body.migrations).toBeGreaterThan(0);
  });
});
