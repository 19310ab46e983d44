import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeUser } from "../support/app";
import { startSecondServer, type SecondServer } from "../support/second-server";
import { auditedSince, auditMark } from "../support/audit";
import { closeDb } from "@/db/knex";
import { listOutbox } from "@/db/outbox";
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_IP } from "@/lib/auth/throttle";
import { MAX_RESETS_PER_ACCOUNT } from "@/lib/mail/reset-throttle";

// Throttles under parallel requests, and what they say about accounts. These run on a second server
// that names the test client (127.0.0.1) as a trusted proxy (README, "Settings"), so each test can
// stand for a client address of its own (X-Forwarded-For) and what it locks out stays out of the way
// of every other test signing in from 127.0.0.1 on the main server.

let server: SecondServer;
beforeAll(async () => {
  server = await startSecondServer({ TRUSTED_PROXIES: "127.0.0.1" }, "auth-throttle");
}, 90_000);
afterAll(async () => {
  await server?.stop();
  await closeDb();
});

let address = 0;
/** A client address no other test uses (from 198.18.0.0/15, set aside for tests, RFC 2544). */
const freshAddress = () => {
  const a = ++address;
  return `198.18.${Math.floor(a / 250)}.${(a % 250) + 1}`;
};

const post = (path: string, from: string, body: object) =>
  server.api().post(path).set("Origin", server.origin).set("X-Forwarded-For", from).send(body);
const signInFrom = (from: string, email: string, password: string) => post("/api/session", from, { email, password });
const resetFrom = (from: string, email: string) => post("/api/password/reset-request", from, { email });

const tally = (statuses: number[]) =>
  statuses.reduce<Record<number, number>>((t, s) => ({ ...t, [s]: (t[s] ?? 0) + 1 }), {});
/** The words with the clock and the counts taken out, to compare two answers given a moment apart. */
const shape = (message: string) => message.replace(/\d+/g, "#");

let n = 0;
const unknownAddress = () => `nobody-${Date.now()}-${++n}@tests.example`;

describe("sign-in throttle under parallel requests", () => {
  it(`200 wrong passwords at once, then the right one: at most ${MAX_FAILURES_PER_ACCOUNT} are checked, all the rest and the right one are refused`, async () => {
    const u = await makeUser("picker");
    const from = freshAddress();
    const wrong = Array.from({ length: 200 }, (_, i) => signInFrom(from, u.email, `wrong password ${i}`));
    // Sent while the wrong ones are still being checked: a throttle that counts after answering lets it in.
    const right = signInFrom(from, u.email, u.password);
    const answers = await Promise.all(wrong);
    const rightAnswer = await right;
    const t = tally(answers.map((r) => r.status));
    expect(t[401]).toBeLessThanOrEqual(MAX_FAILURES_PER_ACCOUNT);
    expect((t[401] ?? 0) + (t[429] ?? 0)).toBe(200);
    expect(rightAnswer.status).toBe(429);
    expect(rightAnswer.headers["set-cookie"]).toBeUndefined();
    // Once the dust settles the account is still locked, right password or not.
    const after = await signInFrom(from, u.email, u.password);
    expect(after.status).toBe(429);
    expect(after.body.error).toMatch(/Try again at \d\d:\d\d/);
  });

  it(`${MAX_FAILURES_PER_IP + 30} wrong passwords at once for as many accounts from one address: at most ${MAX_FAILURES_PER_IP} are checked`, async () => {
    const from = freshAddress();
    const answers = await Promise.all(
      Array.from({ length: MAX_FAILURES_PER_IP + 30 }, () => signInFrom(from, unknownAddress(), "wrong password")),
    );
    const t = tally(answers.map((r) => r.status));
    expect(t[401]).toBeLessThanOrEqual(MAX_FAILURES_PER_IP);
    expect((t[401] ?? 0) + (t[429] ?? 0)).toBe(MAX_FAILURES_PER_IP + 30);
    // Another place is not locked by it.
    const u = await makeUser("picker");
    expect((await signInFrom(freshAddress(), u.email, u.password)).status).toBe(200);
  });

  it("right passwords sent at once are told to try again in a few seconds, not locked out, and get in when they do", async () => {
    const u = await makeUser("picker");
    const from = freshAddress();
    const answers = await Promise.all(
      Array.from({ length: MAX_FAILURES_PER_ACCOUNT + 15 }, () => signInFrom(from, u.email, u.password)),
    );
    const refused = answers.filter((r) => r.status !== 200);
    for (const r of refused) {
      expect(r.status).toBe(429);
      expect(r.body.error).toMatch(/Try again in a few seconds/);
      expect(r.body.error).not.toMatch(/failed/);
    }
    for (let i = 0; i < refused.length; i++) expect((await signInFrom(from, u.email, u.password)).status).toBe(200);
  });

  it("successful sign-ins are taken back, so they do not use up the account's or the address's allowance", async () => {
    const u = await makeUser("picker");
    const from = freshAddress();
    // An attempt counts while its password is being checked, so a handful at a time, well under both caps.
    const rounds = Math.ceil((MAX_FAILURES_PER_IP + 5) / 5);
    for (let i = 0; i < rounds; i++) {
      const answers = await Promise.all(Array.from({ length: 5 }, () => signInFrom(from, u.email, u.password)));
      expect(tally(answers.map((r) => r.status))).toEqual({ 200: 5 });
    }
  });
});

describe("reset-mail cap under parallel requests", () => {
  async function mailsTo(email: string, expected: number): Promise<number> {
    // The mail is queued after the answer (so a real account takes no longer to answer than an
    // unknown one): wait for the expected count, then report what is there.
    for (let i = 0; i < 50; i++) {
      const found = (await listOutbox(500)).filter((m) => m.to === email).length;
      if (found >= expected) return found;
      await new Promise((r) => setTimeout(r, 100));
    }
    return (await listOutbox(500)).filter((m) => m.to === email).length;
  }

  it(`40 resets at once for a real account: no errors, ${MAX_RESETS_PER_ACCOUNT} accepted and mailed, the rest wait (429)`, async () => {
    const u = await makeUser("picker");
    const answers = await Promise.all(Array.from({ length: 40 }, () => resetFrom(freshAddress(), u.email)));
    const t = tally(answers.map((r) => r.status));
    expect(t).toEqual({ 200: MAX_RESETS_PER_ACCOUNT, 429: 40 - MAX_RESETS_PER_ACCOUNT });
    expect(await mailsTo(u.email, MAX_RESETS_PER_ACCOUNT)).toBe(MAX_RESETS_PER_ACCOUNT);
  });

  it("40 resets at once get the same answers for a real account as for an unknown one", async () => {
    const u = await makeUser("picker");
    const real = await Promise.all(Array.from({ length: 40 }, () => resetFrom(freshAddress(), u.email)));
    const nobody = unknownAddress();
    const unknown = await Promise.all(Array.from({ length: 40 }, () => resetFrom(freshAddress(), nobody)));
    expect(tally(real.map((r) => r.status))).toEqual(tally(unknown.map((r) => r.status)));
    // Which refusal a request gets (still settling, or the cap reached) depends on when it arrived,
    // never on the account: both draw on the same few sentences.
    const words = (rs: typeof real) => new Set(rs.map((r) => shape(r.body.message ?? r.body.error)));
    const said = new Set([...words(real), ...words(unknown)]);
    expect(said.size).toBeLessThanOrEqual(3);
    expect([...said].filter((w) => w.startsWith("If that address"))).toHaveLength(1);
  });

  it(`resets from one address are capped at the per-address limit under parallel requests`, async () => {
    const from = freshAddress();
    const answers = await Promise.all(Array.from({ length: 45 }, () => resetFrom(from, unknownAddress())));
    const t = tally(answers.map((r) => r.status));
    expect(t[200]).toBeLessThanOrEqual(30);
    expect((t[200] ?? 0) + (t[429] ?? 0)).toBe(45);
  });
});

describe("what a throttled sign-in says about the account", () => {
  async function lockOut(email: string, from: string) {
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++)
      expect((await signInFrom(from, email, `wrong ${i}`)).status).toBe(401);
    return signInFrom(from, email, "one more try");
  }

  it("a locked real account and a locked unknown one get the same status and the same words", async () => {
    const u = await makeUser("picker");
    const real = await lockOut(u.email, freshAddress());
    const unknown = await lockOut(unknownAddress(), freshAddress());
    expect(real.status).toBe(429);
    expect(unknown.status).toBe(429);
    expect(shape(real.body.error)).toBe(shape(unknown.body.error));
    expect(Object.keys(real.body).sort()).toEqual(Object.keys(unknown.body).sort());
  });
});

describe("client address behind a trusted proxy", () => {
  it("is the address the proxy appended, not what the client put before it", async () => {
    const mark = await auditMark();
    const forged = "6.6.6.6";
    const res = await server
      .api()
      .post("/api/session")
      .set("Origin", server.origin)
      .set("X-Forwarded-For", `${forged}, 198.51.100.20`)
      .send({ email: unknownAddress(), password: "wrong password" });
    expect(res.status).toBe(401);
    const [entry] = await auditedSince(mark, "sign_in.failure");
    expect(entry?.ip).toBe("198.51.100.20");
  });

  it("rotating what the client puts first does not spread its failures over several addresses", async () => {
    const from = freshAddress();
    const mark = await auditMark();
    for (let i = 0; i < 3; i++) {
      await server
        .api()
        .post("/api/session")
        .set("Origin", server.origin)
        .set("X-Forwarded-For", `10.9.9.${i}, ${from}`)
        .send({ email: unknownAddress(), password: "wrong password" });
    }
    const entries = await auditedSince(mark, "sign_in.failure");
    expect(entries.map((e) => e.ip)).toEqual([from, from, from]);
  });
});
