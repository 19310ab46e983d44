import "server-only";
import { generateIdFromEntropySize, type Session, type User } from "lucia";
import { lucia, SESSION_ABSOLUTE_MS } from "./lucia";
import { audit } from "@/db/audit";

export type { SignedInUser } from "@/lib/contracts/users";
import type { SignedInUser } from "@/lib/contracts/users";

export function newId(): string {
  return generateIdFromEntropySize(10);
}

export async function startSession(userId: string, now = new Date()): Promise<Session> {
  return lucia().createSession(userId, { created_at: now });
}

/**
 * lucia handles the sliding idle expiry; the absolute lifetime and the disabled flag are ours.
 * `now` is injectable so the lifetime can be tested without waiting twelve hours.
 */
export async function validateSessionId(
  sessionId: string,
  now = new Date(),
): Promise<{ session: Session; user: SignedInUser } | null> {
  const { session, user } = await lucia().validateSession(sessionId);
  if (!session || !user) return null;
  const createdAt = new Date(session.createdAt);
  if (now.getTime() - createdAt.getTime() > SESSION_ABSOLUTE_MS || user.disabled) {
    await lucia().invalidateSession(session.id);
    await audit({
      event: "session.expired",
      actorUserId: user.id,
      detail: { reason: user.disabled ? "disabled" : "absolute lifetime" },
    });
    return null;
  }
  return { session, user: toSignedIn(user) };
}

function toSignedIn(user: User): SignedInUser {
  return { id: user.id, email: user.email, displayName: user.displayName, role: user.role, siteId: user.siteId };
}

export async function endSession(sessionId: string): Promise<void> {
  await lucia().invalidateSession(sessionId);
}
