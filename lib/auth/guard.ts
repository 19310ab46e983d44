import "server-only";
import { cache } from "react";
import { cookies, headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { SESSION_COOKIE } from "./lucia";
import { validateSessionId, type SignedInUser } from "./session";
import { roleMay, type Access } from "./permissions";
import { audit } from "@/db/audit";
import { auditNoSession } from "./refusals";
import { clientIp } from "@/lib/http/client-ip";

/** The signed-in user of this request, or null; validated once per render. */
export const currentUser = cache(async (): Promise<SignedInUser | null> => {
  const id = (await cookies()).get(SESSION_COOKIE)?.value;
  if (!id) return null;
  return (await validateSessionId(id))?.user ?? null;
});

/**
 * Every page starts with this. Anonymous → the sign-in page; signed in without the permission → 403
 * (and an audit entry). Deny by default: a page that forgets to call it is caught by the access test.
 */
export async function requireRole(access: Access, path: string): Promise<SignedInUser> {
  const user = await currentUser();
  if (!user) {
    await auditNoSession((await cookies()).get(SESSION_COOKIE)?.value ?? null, path, clientIp(await headers()));
    redirect(`/sign-in?next=${encodeURIComponent(path)}`);
  }
  if (!roleMay(user.role, access)) {
    await audit({ event: "access.denied", actorUserId: user.id, subject: path, ip: clientIp(await headers()), detail: { access } });
    forbidden();
  }
  return user;
}
