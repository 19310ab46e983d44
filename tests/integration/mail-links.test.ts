import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { linkIn, tokenOf, uniqueAddress, waitForMail } from "../support/mailbox";
import { db } from "@/db/knex";

// The mail page stands in for people's own mailboxes: an admin reading it must not be able to take
// over someone else's account with the set-password link meant for them.

afterAll(async () => {
  await db().destroy();
});

const mailApi = (cookie: string) => api().get("/api/mail").set("Cookie", cookie);

describe("set-password links on the mail page", () => {
  it("an invitation to someone else: the admin sees the mail but not its token, anywhere in the answer", async () => {
    const admin = await signInAs("admin");
    const email = uniqueAddress("masked-invite");
    const res = await api()
      .post("/api/users")
      .set("Origin", ORIGIN)
      .set("Cookie", admin)
      .send({ email, displayName: "Mae Masked", role: "picker" });
    expect(res.status).toBe(201);
    const [mail] = await waitForMail(email);
    const token = tokenOf(linkIn(mail!.text));

    const list = await mailApi(admin);
    expect(list.status).toBe(200);
    const shown = list.body.messages.find((m: { id: number }) => m.id === mail!.id);
    expect(shown, "the invitation is listed").toBeTruthy();
    expect(shown.subject).toMatch(/Trailbin account/);
    expect(shown.text).toMatch(/link hidden/i);
    expect(shown.text).not.toMatch(/set-password\?token=/);
    // Not in the text, nor in any other field (raw source, headers, outbox rows).
    expect(JSON.stringify(list.body)).not.toContain(token);
    expect(list.body.messages.every((m: object) => !("raw" in m))).toBe(true);

    const page = await api().get("/admin/mail").set("Cookie", admin);
    expect(page.status).toBe(200);
    expect(page.text).not.toContain(token);

    // The link still works for its addressee.
    const set = await api()
      .post("/api/password/set")
      .set("Origin", ORIGIN)
      .send({ token, password: "copper lantern by the weir" });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
  });

  it("a reset link to the admin's own address is shown in full to that admin only", async () => {
    const own = await makeUser("admin");
    const ownCookie = await signIn(own.email, own.password);
    const req = await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email: own.email });
    expect(req.status).toBe(200);
    const [mail] = await waitForMail(own.email);
    const token = tokenOf(linkIn(mail!.text));

    const mine = (await mailApi(ownCookie)).body.messages.find((m: { id: number }) => m.id === mail!.id);
    expect(mine.text).toContain(`set-password?token=${token}`);

    const other = await mailApi(await signInAs("admin"));
    expect(other.body.messages.some((m: { id: number }) => m.id === mail!.id)).toBe(true);
    expect(JSON.stringify(other.body)).not.toContain(token);
  });
});
