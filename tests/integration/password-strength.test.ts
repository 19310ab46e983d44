import { afterAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signIn, signInAs } from "../support/app";
import { linkIn, tokenOf, uniqueAddress, waitForMail } from "../support/mailbox";
import { db } from "@/db/knex";

afterAll(async () => {
  await db().destroy();
});

const addUser = async (body: object) =>
  api()
    .post("/api/users")
    .set("Origin", ORIGIN)
    .set("Cookie", await signInAs("admin"))
    .send({ role: "picker", ...body });
const setPassword = (token: string, password: string) =>
  api().post("/api/password/set").set("Origin", ORIGIN).send({ token, password });
const passwordIssue = (body: { issues?: { path: string; message: string }[] }) =>
  body.issues?.find((i) => i.path === "password")?.message ?? "";

describe("weak passwords are refused, with what to do instead", () => {
  it.each(["111111111111", "password1234", "qwertyuiopas", "abcdefghijkl", "Password123!"])(
    "a first password of %s",
    async (password) => {
      const res = await addUser({ email: uniqueAddress("weak"), displayName: "Wes Weak", password });
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(passwordIssue(res.body)).toMatch(/easy to guess/);
      expect(passwordIssue(res.body)).toMatch(/a few unrelated words/);
    },
  );

  it("a first password made of the person's own e-mail address or name", async () => {
    const email = uniqueAddress("zebulonardwick");
    const byEmail = await addUser({ email, displayName: "Zeb Ardwick", password: `${email.split("@")[0]}!` });
    expect(byEmail.status).toBe(400);
    expect(passwordIssue(byEmail.body)).toMatch(/e-mail address or name/);
    const byName = await addUser({
      email: uniqueAddress("name"),
      displayName: "Marguerite Quillfeather",
      password: "marguerite quillfeather 7",
    });
    expect(byName.status).toBe(400);
    expect(passwordIssue(byName.body)).toMatch(/e-mail address or name/);
    // Nothing was created by the refused requests.
    expect(await db()("users").where({ email }).first()).toBeUndefined();
  });

  it("through an invitation link: a weak one is refused and the link still works for a good one", async () => {
    const email = uniqueAddress("weak-invite");
    expect((await addUser({ email, displayName: "Ivo Invite" })).status).toBe(201);
    const [mail] = await waitForMail(email);
    const token = tokenOf(linkIn(mail!.text));
    const weak = await setPassword(token, "111111111111");
    expect(weak.status).toBe(400);
    expect(passwordIssue(weak.body)).toMatch(/easy to guess/);
    const own = await setPassword(token, `${email.split("@")[0]}`);
    expect(own.status).toBe(400);
    expect(passwordIssue(own.body)).toMatch(/e-mail address or name/);
    const good = await setPassword(token, "tin kettle under moss");
    expect(good.status, JSON.stringify(good.body)).toBe(200);
    expect(await signIn(email, "tin kettle under moss")).toMatch(/^trailbin_session=/);
  });
});
