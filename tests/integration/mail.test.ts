import net from "node:net";
import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs, APP_URL } from "../support/app";
import { auditedSince, auditMark } from "../support/audit";
import { db } from "@/db/knex";
import { enqueueMail, getOutboxMailByKey, listOutbox } from "@/db/outbox";
import { sinkMessagesTo } from "@/db/mail-sink";
import { linkIn, tokenOf, uniqueAddress, waitForMail } from "../support/mailbox";
import { createInvitedUser } from "@/db/tokens";
import { sendDueMail } from "@/lib/mail/sender";
import { smtpTransport } from "@/lib/mail/transport";
import { LINK_DEAD, RESET_ANSWER } from "@/lib/mail/answers";
import { newId } from "@/lib/auth/session";
import { InvalidAddressError } from "@/lib/mail/headers";
import { MAX_RESETS_PER_ACCOUNT } from "@/lib/mail/reset-throttle";

afterAll(async () => {
  await db().destroy();
});

const setPassword = (token: string, password: string) =>
  api().post("/api/password/set").set("Origin", ORIGIN).send({ token, password });
const signInStatus = async (email: string, password: string) =>
  (await api().post("/api/session").set("Origin", ORIGIN).send({ email, password })).status;

/** A port on loopback where nothing listens: an SMTP server that is down. */
async function closedPort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, "127.0.0.1", () => r()));
  const port = (s.address() as net.AddressInfo).port;
  await new Promise<void>((r) => s.close(() => r()));
  return port;
}

describe("invitation", () => {
  it("an admin adds a user without a password; the mail's link sets it once, then is dead", async () => {
    const admin = await signInAs("admin");
    const email = uniqueAddress("invitee");
    const res = await api()
      .post("/api/users")
      .set("Origin", ORIGIN)
      .set("Cookie", admin)
      .send({ email, displayName: "Ife Invited", role: "picker" });
    expect(res.status).toBe(201);
    expect(res.body.invited).toBe(true);

    const [mail] = await waitForMail(email);
    expect(mail!.subject).toMatch(/Trailbin account/);
    expect(mail!.to).toContain("Ife Invited");
    const link = linkIn(mail!.text);
    expect(new URL(link).origin).toBe(new URL(APP_URL).origin);
    const token = tokenOf(link);
    // Only the hash is stored.
    expect(await db()("password_tokens").where({ token_sha256: token }).first()).toBeUndefined();

    const page = await api().get(new URL(link).pathname + new URL(link).search);
    expect(page.status).toBe(200);
    expect(page.text).toContain("Choose your password");
    expect(page.text).toContain(email);

    // No password yet: nothing signs in.
    expect(await signInStatus(email, "any password at all")).toBe(401);

    const short = await setPassword(token, "short");
    expect(short.status).toBe(400);
    expect(short.body.issues[0].message).toMatch(/12 characters/);

    const ok = await setPassword(token, "my own chosen password");
    expect(ok.status).toBe(200);
    expect(await signIn(email, "my own chosen password")).toMatch(/^trailbin_session=/);

    const mark = await auditMark();
    const again = await setPassword(token, "someone else's password");
    expect(again.status).toBe(400);
    expect(await auditedSince(mark, "password.set_refused")).toHaveLength(1);
    expect(again.body.error).toBe(LINK_DEAD);
    expect(await signInStatus(email, "someone else's password")).toBe(401);
    const deadPage = await api().get(new URL(link).pathname + new URL(link).search);
    expect(deadPage.status).toBe(200);
    expect(deadPage.text).toContain(LINK_DEAD);
  });

  it("unknown, malformed and expired links all get the same answer", async () => {
    const unknown = await setPassword("A".repeat(43), "long enough password");
    const malformed = await setPassword("not a token", "long enough password");
    let token = "";
    const email = uniqueAddress("expired");
    await createInvitedUser(
      { id: newId(), siteId: 1, email, displayName: "Old Invite", role: "picker" },
      (t) => {
        token = t;
        return { to: email, subject: "test invitation", text: "x" };
      },
      new Date(Date.now() - 73 * 60 * 60 * 1000),
    );
    const expired = await setPassword(token, "long enough password");
    for (const r of [unknown, malformed, expired]) {
      expect(r.status).toBe(400);
      expect(r.body.error).toBe(LINK_DEAD);
    }
    expect((await api().get("/set-password")).status).toBe(200);
  });
});

describe("password reset", () => {
  it("works for an existing account, ends its sessions, and the old password stops working", async () => {
    const u = await makeUser("picker");
    const oldCookie = await signIn(u.email, u.password);
    const res = await api()
      .post("/api/password/reset-request")
      .set("Origin", ORIGIN)
      .send({ email: u.email.toUpperCase() });
    expect(res.status).toBe(200);
    expect(res.body.message).toBe(RESET_ANSWER);

    const [mail] = await waitForMail(u.email);
    expect(mail!.subject).toBe("Reset your Trailbin password");
    const ok = await setPassword(tokenOf(linkIn(mail!.text)), "a brand new password");
    expect(ok.status).toBe(200);

    expect((await api().get("/api/session").set("Cookie", oldCookie)).status).toBe(401);
    expect(await signInStatus(u.email, u.password)).toBe(401);
    expect(await signInStatus(u.email, "a brand new password")).toBe(200);
  });

  it("says exactly the same for an unknown address, and queues no mail", async () => {
    const email = uniqueAddress("nobody");
    const res = await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email });
    expect(res.status).toBe(200);
    expect(res.body.message).toBe(RESET_ANSWER);
    expect((await listOutbox(200)).some((m) => m.to === email)).toBe(false);
  });
});

describe("reset throttle", () => {
  it(`after ${MAX_RESETS_PER_ACCOUNT} requests for one address in 15 minutes the next waits (429), account or not`, async () => {
    const email = uniqueAddress("often");
    for (let i = 0; i < MAX_RESETS_PER_ACCOUNT; i++) {
      const r = await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email });
      expect(r.status).toBe(200);
    }
    const r = await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email });
    expect(r.status).toBe(429);
    expect(r.body.retryAt).toBeTruthy();
  });
});

describe("outbox", () => {
  // Rows are queued an hour ahead so the server's own sender (real clock) leaves them to this test,
  // which drives sendDueMail with its own clock.
  const later = (ms: number) => new Date(Date.now() + 60 * 60 * 1000 + ms);

  it("retries with backoff while the SMTP server is down and delivers exactly once when it is back", async () => {
    const to = uniqueAddress("retry");
    const key = `test:retry:${to}`;
    const t0 = later(0);
    const at = (ms: number) => new Date(t0.getTime() + ms);
    const queued = await db().transaction((trx) =>
      enqueueMail(trx, { dedupeKey: key, to, subject: "Retry me", text: "hello", notBefore: t0 }),
    );
    const twice = await db().transaction((trx) =>
      enqueueMail(trx, { dedupeKey: key, to, subject: "Retry me", text: "hello", notBefore: t0 }),
    );
    expect([queued, twice]).toEqual([true, false]);
    const id = (await getOutboxMailByKey(key))!.id;

    const down = smtpTransport(await closedPort());
    try {
      expect(await sendDueMail({ now: t0, transport: down, ids: [id] })).toEqual({ sent: [], failed: [id] });
      let row = (await getOutboxMailByKey(key))!;
      expect(row).toMatchObject({ status: "pending", attempts: 1 });
      expect(row.lastError).toBeTruthy();
      expect(new Date(row.nextAttemptAt).getTime()).toBe(t0.getTime() + 10_000);
      // Not due again before the backoff is over.
      expect(await sendDueMail({ now: at(5_000), transport: down, ids: [id] })).toEqual({ sent: [], failed: [] });
      expect(await sendDueMail({ now: at(10_000), transport: down, ids: [id] })).toEqual({ sent: [], failed: [id] });
      row = (await getOutboxMailByKey(key))!;
      expect(row).toMatchObject({ status: "pending", attempts: 2 });
      expect(new Date(row.nextAttemptAt).getTime()).toBe(t0.getTime() + 10_000 + 20_000);
    } finally {
      down.close();
    }

    // The sink is up (the real SMTP_PORT): delivered, and never again.
    expect(await sendDueMail({ now: at(10 * 60_000), ids: [id] })).toEqual({ sent: [id], failed: [] });
    expect(await sendDueMail({ now: at(20 * 60_000), ids: [id] })).toEqual({ sent: [], failed: [] });
    const row = (await getOutboxMailByKey(key))!;
    expect(row.status).toBe("sent");
    expect(row.attempts).toBeGreaterThan(1);
    expect(row.text).toBe("");
    await waitForMail(to);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await sinkMessagesTo(to)).toHaveLength(1);
  });

  it("two senders racing for the same row send it once", async () => {
    const to = uniqueAddress("race");
    const t0 = later(0);
    await db().transaction((trx) =>
      enqueueMail(trx, { dedupeKey: `test:race:${to}`, to, subject: "Once", text: "only once", notBefore: t0 }),
    );
    const id = (await getOutboxMailByKey(`test:race:${to}`))!.id;
    const [a, b] = await Promise.all([sendDueMail({ now: t0, ids: [id] }), sendDueMail({ now: t0, ids: [id] })]);
    expect([...a.sent, ...b.sent]).toEqual([id]);
    await waitForMail(to);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await sinkMessagesTo(to)).toHaveLength(1);
  });

  it("a mail queued in a transaction that rolls back is never sent", async () => {
    const to = uniqueAddress("rollback");
    await expect(
      db().transaction(async (trx) => {
        await enqueueMail(trx, { dedupeKey: `test:rollback:${to}`, to, subject: "Never", text: "x" });
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await getOutboxMailByKey(`test:rollback:${to}`)).toBeNull();
  });
});

describe("header injection", () => {
  it("a line break in a new user's name or address is refused", async () => {
    const admin = await signInAs("admin");
    const byName = await api()
      .post("/api/users")
      .set("Origin", ORIGIN)
      .set("Cookie", admin)
      .send({ email: uniqueAddress("inject"), displayName: "a\r\nBcc: x@y", role: "picker" });
    expect(byName.status).toBe(400);
    expect(byName.body.issues.map((i: { path: string }) => i.path)).toContain("displayName");
    const byAddress = await api()
      .post("/api/users")
      .set("Origin", ORIGIN)
      .set("Cookie", admin)
      .send({ email: "victim@tests.example\r\nBcc: x@tests.example", displayName: "V", role: "picker" });
    expect(byAddress.status).toBe(400);
  });

  it("the outbox strips line breaks from names and subjects, and refuses an address with one", async () => {
    const to = uniqueAddress("stripped");
    const evil = uniqueAddress("evil");
    const t0 = new Date(Date.now() + 60 * 60 * 1000);
    const key = `test:inject:${to}`;
    await db().transaction((trx) =>
      enqueueMail(trx, {
        dedupeKey: key,
        to,
        toName: `a\r\nBcc: ${evil}`,
        subject: `Hi\r\nBcc: ${evil}`,
        text: "x",
        notBefore: t0,
      }),
    );
    const row = (await getOutboxMailByKey(key))!;
    expect(row.toName).toBe(`a Bcc: ${evil}`);
    expect(row.subject).toBe(`Hi Bcc: ${evil}`);
    expect((await sendDueMail({ now: t0, ids: [row.id] })).sent).toEqual([row.id]);
    const [mail] = await waitForMail(to);
    expect(mail!.envelopeTo).toEqual([to]);
    const raw = (await db()("mail_sink_messages").where({ id: mail!.id }).first("raw")).raw as string;
    expect(raw).not.toMatch(/^bcc:/im);
    expect(await sinkMessagesTo(evil)).toEqual([]);

    await expect(
      db().transaction((trx) =>
        enqueueMail(trx, { dedupeKey: `test:inject2:${to}`, to: `${to}\r\nBcc: ${evil}`, subject: "x", text: "x" }),
      ),
    ).rejects.toBeInstanceOf(InvalidAddressError);
  });
});

describe("mail page", () => {
  it("the admin sees received mail, newest first; others may not", async () => {
    const admin = await signInAs("admin");
    const res = await api().get("/api/mail").set("Cookie", admin);
    expect(res.status).toBe(200);
    const ids = res.body.messages.map((m: { id: number }) => m.id);
    expect(ids.length).toBeGreaterThan(0);
    expect([...ids].sort((a: number, b: number) => b - a)).toEqual(ids);
    expect((await api().get("/admin/mail").set("Cookie", admin)).status).toBe(200);
    expect(
      (
        await api()
          .get("/api/mail")
          .set("Cookie", await signInAs("planner"))
      ).status,
    ).toBe(403);
  });
});
