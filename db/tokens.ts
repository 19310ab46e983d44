import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { enqueueMail, type OutgoingMail } from "./outbox";
import { createUser } from "./users";
import type { Role, UserDTO } from "@/lib/contracts/users";
import { INVITE_LIFETIME_MS, looksLikeToken, newLinkToken, RESET_LIFETIME_MS, tokenSha256 } from "@/lib/mail/token";

export type TokenPurpose = "invite" | "reset";

/** Builds the mail for a freshly made link token (the raw token exists only in this call and the mail). */
export type MailForToken = (token: string) => Omit<OutgoingMail, "dedupeKey">;

async function insertToken(
  trx: Knex.Transaction,
  userId: string,
  purpose: TokenPurpose,
  now: Date,
): Promise<{ token: string; sha: string }> {
  const token = newLinkToken();
  const sha = tokenSha256(token);
  const lifetime = purpose === "invite" ? INVITE_LIFETIME_MS : RESET_LIFETIME_MS;
  await trx("password_tokens").insert({
    user_id: userId,
    token_sha256: sha,
    purpose,
    expires_at: new Date(now.getTime() + lifetime),
    created_at: now,
  });
  return { token, sha };
}

/**
 * A new account without a password, its invitation token and the invitation mail, in one transaction:
 * there is never a user who was invited but got no mail, nor a mail for a user who does not exist.
 */
export function createInvitedUser(
  input: { id: string; siteId: number; email: string; displayName: string; role: Role },
  mail: MailForToken,
  now = new Date(),
): Promise<UserDTO> {
  return createUser({ ...input, passwordHash: null }, async (trx) => {
    const { token, sha } = await insertToken(trx, input.id, "invite", now);
    await enqueueMail(trx, { ...mail(token), dedupeKey: `invite:${sha.slice(0, 40)}` });
  });
}

/**
 * A reset token and its mail in one transaction; earlier unused reset links of the user stop working.
 * The user's row is locked first, so parallel requests for one account queue behind each other
 * instead of deadlocking on each other's token rows.
 */
export async function issueResetToken(userId: string, mail: MailForToken, now = new Date()): Promise<void> {
  await db().transaction(async (trx) => {
    await trx("users").where({ id: userId }).forUpdate().first("id");
    await trx("password_tokens")
      .where({ user_id: userId, purpose: "reset" })
      .whereNull("used_at")
      .update({ used_at: now });
    const { token, sha } = await insertToken(trx, userId, "reset", now);
    await enqueueMail(trx, { ...mail(token), dedupeKey: `reset:${sha.slice(0, 40)}` });
  });
}

type TokenRow = { id: number; user_id: string; purpose: TokenPurpose; expires_at: Date; used_at: Date | null };

function usable(row: TokenRow | undefined, now: Date): row is TokenRow {
  return !!row && row.used_at === null && row.expires_at.getTime() > now.getTime();
}

/** For the set-password page: is this link still good, and for whom. Reads only. */
export async function peekToken(
  token: string,
  now = new Date(),
): Promise<{ purpose: TokenPurpose; email: string } | null> {
  if (!looksLikeToken(token)) return null;
  const row = (await db()("password_tokens")
    .where({ token_sha256: tokenSha256(token) })
    .first()) as TokenRow | undefined;
  if (!usable(row, now)) return null;
  const user = await db()("users").where({ id: row.user_id }).whereNull("disabled_at").first("email");
  return user ? { purpose: row.purpose, email: user.email as string } : null;
}

/**
 * Spends a link: sets the password, marks this and every other open link of the user used and ends
 * all their sessions, in one transaction. The row lock makes a double submit spend the link once.
 * Null for an unknown, used or expired link, or a disabled account (the caller says the same for all).
 */
export async function setPasswordWithToken(
  token: string,
  passwordHash: string,
  now = new Date(),
): Promise<{ userId: string; purpose: TokenPurpose; email: string } | null> {
  if (!looksLikeToken(token)) return null;
  return db().transaction(async (trx) => {
    const row = (await trx("password_tokens")
      .where({ token_sha256: tokenSha256(token) })
      .forUpdate()
      .first()) as TokenRow | undefined;
    if (!usable(row, now)) return null;
    const user = await trx("users")
      .where({ id: row.user_id })
      .whereNull("disabled_at")
      .forUpdate()
      .first("id", "email");
    if (!user) return null;
    await trx("users")
      .where({ id: row.user_id })
      .update({ password_hash: passwordHash, updated_at: trx.fn.now(3) });
    await trx("password_tokens").where({ user_id: row.user_id }).whereNull("used_at").update({ used_at: now });
    await trx("sessions").where({ user_id: row.user_id }).delete();
    return { userId: row.user_id, purpose: row.purpose, email: user.email as string };
  });
}
