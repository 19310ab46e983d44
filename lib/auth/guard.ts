import "server-only";
import { cache } from "react";
import { cookies, headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { SESSION_COOKIE } from "./lucia";
import { validateSessionId, type SignedInUser } from "./session";
import { roleMay, type Access } from "./permissions";
import { audit } from "@/db/audit";
import { auditNoSession } from "./refusals";
import { PATH_HEADER } from "@/lib/http/path-header";
import { clientIp } from "@/lib/http/client-ip";

/** The signed-in user of this request, or null; validated once per render. */
export const currentUser = cache(async (): Promise<SignedInUser | null> => {
  const id = (await cookies()).get(SESSION_COOKIE)?.value;
  if (!id) return null;
  return (await validateSessionId(id))?.user ?? null;
});

/**
 * No live session: to the sign-in page, coming back here afterwards. The layout and the page both
 * end up here in the same render; `cache` makes that one audit entry, not two. proxy.ts puts the
 * requested path in PATH_HEADER (replacing any the browser sent).
 */
export const signInFirst = cache(async (): Promise<never> => {
  const h = await headers();
  const requested = h.get(PATH_HEADER) ?? "/";
  await auditNoSession((await cookies()).get(SESSION_COOKIE)?.value ?? null, requested.split("?")[0]!, clientIp(h));
  redirect(`/sign-in?next=${encodeURIComponent(requested)}`);
});

/**
 * Every page starts with this. Anonymous → the sign-in page; signed in without the permission → 403
 * (and an audit entry). Deny by default: a page that forgets to call it is caught by the access test.
 */
export async function requireRole(access: Access, path: string): Promise<SignedInUser> {
  const user = await currentUser();
  if (!user) return signInFirst();
  if (!roleMay(user.role, access)) {
    await audit({
      event: "access.denied",
      actorUserId: user.id,
      subject: path,
      ip: clientIp(await headers()),
      detail: { access },
    });
    forbidden();
  }
  return user;
}
