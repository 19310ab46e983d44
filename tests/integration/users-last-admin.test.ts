import { afterAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signIn } from "../support/app";
import { db } from "@/db/knex";
import { hashPassword } from "@/lib/auth/password";
import { newId } from "@/lib/auth/session";

// The rule "a site keeps at least one active admin" must hold when two admins act on each other at
// the same instant. Each round uses a site of its own with exactly two active admins, so the demo
// site's admins never count and no other test is disturbed.

afterAll(async () => {
  await db().destroy();
});

const ROUNDS = 6;
const PASSWORD = "two admins at one site";
let passwordHash: Promise<string> | null = null;
let n = 0;

async function siteWithTwoAdmins() {
  const code = `LA${Date.now().toString(36)}${process.pid}${++n}`.slice(0, 32);
  const [siteId] = await db()("sites").insert({ code, name: `Last-admin test site ${code}` });
  passwordHash ??= hashPassword(PASSWORD);
  const admins = await Promise.all(
    ["a", "b"].map(async (who) => {
      const id = newId();
      const email = `last-admin-${who}-${code.toLowerCase()}@tests.example`;
      await db()("users").insert({
        id,
        site_id: siteId,
        email,
        display_name: `Admin ${who.toUpperCase()}`,
        role: "admin",
        password_hash: await passwordHash,
      });
      return { id, email, cookie: await signIn(email, PASSWORD) };
    }),
  );
  return { siteId: Number(siteId), a: admins[0]!, b: admins[1]! };
}

const patch = (cookie: string, id: string, body: object) =>
  api()
    .patch(`/api/users/${id}`)
    .set("Origin", ORIGIN)
    .set("Cookie", cookie)
    .send({ version: 1, ...body });

async function activeAdmins(siteId: number): Promise<number> {
  const r = await db()("users")
    .where({ site_id: siteId, role: "admin" })
    .whereNull("disabled_at")
    .count({ n: "*" })
    .first();
  return Number(r?.n ?? 0);
}

describe("the last active admin under concurrency", () => {
  for (const [name, aDoes, bDoes] of [
    ["two admins disable each other at once", { disabled: true }, { disabled: true }],
    ["two admins demote each other at once", { role: "planner" }, { role: "picker" }],
    ["one disables while the other demotes", { disabled: true }, { role: "planner" }],
  ] as const) {
    it(`${name}: one wins, the other is refused, and the site keeps an active admin (${ROUNDS} rounds)`, async () => {
      for (let round = 0; round < ROUNDS; round++) {
        const { siteId, a, b } = await siteWithTwoAdmins();
        const [byA, byB] = await Promise.all([patch(a.cookie, b.id, aDoes), patch(b.cookie, a.id, bDoes)]);
        expect(await activeAdmins(siteId), `round ${round}: answers ${byA.status} and ${byB.status}`).toBe(1);
        // The loser is refused by the rule, or (when its request came in after the winner had already
        // ended its sessions) by having no session left: either way it changed nothing.
        const [winner, loser] = byA.status === 200 ? [byA, byB] : [byB, byA];
        expect(winner.status, JSON.stringify([byA.body, byB.body])).toBe(200);
        expect([401, 409]).toContain(loser.status);
        if (loser.status === 409) expect(loser.body.error).toMatch(/last active admin/);
      }
    });
  }

  it("one admin alone may still not disable or demote themselves", async () => {
    const { siteId, a, b } = await siteWithTwoAdmins();
    expect((await patch(a.cookie, b.id, { disabled: true })).status).toBe(200);
    const self = await patch(a.cookie, a.id, { role: "planner" });
    expect(self.status).toBe(409);
    expect(self.body.error).toMatch(/last active admin/);
    expect(await activeAdmins(siteId)).toBe(1);
  });
});
