import request from "supertest";
import { DEMO_ACCOUNTS } from "@/db/seeds/demo/accounts";
import type { Role } from "@/lib/auth/permissions";

export const APP_URL = process.env.APP_URL ?? "";
if (!APP_URL) throw new Error("APP_URL is not set: run the integration suite through npm test");

export const ORIGIN = new URL(APP_URL).origin;
export const api = () => request(APP_URL);

export function demoAccount(role: Role) {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role);
  if (!a) throw new Error(`no demo account for ${role}`);
  return a;
}

/** Signs in over HTTP and returns the Cookie header value for the new session. */
export async function signIn(email: string, password: string): Promise<string> {
  const res = await api().post("/api/session").set("Origin", ORIGIN).send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = [res.headers["set-cookie"]]
    .flat()
    .find((c): c is string => typeof c === "string" && c.startsWith("trailbin_session="));
  if (!cookie) throw new Error("sign-in set no session cookie");
  return cookie.split(";")[0]!;
}

export const signInAs = (role: Role) => signIn(demoAccount(role).email, demoAccount(role).password);

let counter = 0;
/** A throwaway account made through the admin API, so tests never lock or alter the demo people. */
export async function makeUser(
  role: Role,
  password = "correct horse battery",
): Promise<{ id: string; email: string; password: string; version: number }> {
  const admin = await signInAs("admin");
  const email = `t${Date.now()}-${process.pid}-${++counter}@tests.example`;
  const res = await api()
    .post("/api/users")
    .set("Origin", ORIGIN)
    .set("Cookie", admin)
    .send({ email, displayName: `Test ${counter}`, role, password });
  if (res.status !== 201) throw new Error(`could not create user: ${res.status} ${JSON.stringify(res.body)}`);
  return { id: res.body.user.id, email, password, version: res.body.user.version };
}
