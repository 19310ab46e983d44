import "server-only";
import { audit } from "@/db/audit";

/**
 * A request for something protected without a live session. A cookie that no longer names a session
 * (signed out, revoked by an admin, expired, or forged) is worth telling apart from no cookie at all:
 * the first is how a stolen or replayed cookie shows up in the log.
 */
export async function auditNoSession(sessionId: string | null, subject: string, ip: string): Promise<void> {
  await audit(
    sessionId
      ? {
          event: "session.refused",
          subject,
          ip,
          detail: { reason: "the session cookie names no live session (signed out, ended, expired or unknown)" },
        }
      : { event: "access.anonymous", subject, ip },
  );
}
