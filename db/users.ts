import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { isDuplicateKey, iso } from "./rows";
import type { Role, UserDTO } from "@/lib/contracts/users";

type UserRow = {
  id: string;
  site_id: number;
  email: string;
  display_name: string;
  role: Role;
  password_hash: string | null;
  disabled_at: Date | null;
  last_sign_in_at: Date | null;
  created_at: Date;
  version: number;
};

function toDTO(r: UserRow): UserDTO {
  return {
    id: r.id,
    siteId: r.site_id,
    email: r.email,
    displayName: r.display_name,
    role: r.role,
    disabled: r.disabled_at !== null,
    lastSignInAt: iso(r.last_sign_in_at),
    createdAt: r.created_at.toISOString(),
    version: r.version,
  };
}

/** The collation is case-insensitive, but the UNIQUE index and the throttle key both want one spelling. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserForSignIn(email: string): Promise<(UserDTO & { passwordHash: string | null }) | null> {
  const row = await db()<UserRow>("users")
    .where({ email: normaliseEmail(email) })
    .first();
  return row ? { ...toDTO(row), passwordHash: row.password_hash } : null;
}

export async function getUser(id: string): Promise<UserDTO | null> {
  const row = await db()<UserRow>("users").where({ id }).first();
  return row ? toDTO(row) : null;
}

export async function listUsers(siteId: number): Promise<UserDTO[]> {
  const rows = await db()<UserRow>("users")
    .where({ site_id: siteId })
    .orderBy([{ column: "role" }, { column: "email" }]);
  return rows.map(toDTO);
}

export class DuplicateEmailError extends Error {}

/**
 * Inserts the user; `alongside` runs in the same transaction (an invitation's token and mail), so
 * both happen or neither does.
 */
export async function createUser(
  input: { id: string; siteId: number; email: string; displayName: string; role: Role; passwordHash: string | null },
  alongside?: (trx: Knex.Transaction) => Promise<void>,
): Promise<UserDTO> {
  try {
    await db().transaction(async (trx) => {
      await trx("users").insert({
        id: input.id,
        site_id: input.siteId,
        email: normaliseEmail(input.email),
        display_name: input.displayName.trim(),
        role: input.role,
        password_hash: input.passwordHash,
      });
      await alongside?.(trx);
    });
  } catch (e) {
    if (isDuplicateKey(e)) throw new DuplicateEmailError(input.email);
    throw e;
  }
  const created = await getUser(input.id);
  if (!created) throw new Error("user vanished after insert");
  return created;
}

export type UserChange = { role?: Role; disabled?: boolean; displayName?: string };

/** The change would leave the user's site without an active admin. */
export class LastAdminError extends Error {}

const takesAdminAway = (change: UserChange) =>
  (change.role !== undefined && change.role !== "admin") || change.disabled === true;

/**
 * Optimistic update: returns null when `version` is stale (someone else changed the user first).
 * Throws LastAdminError rather than leave the site without an active admin.
 * Role changes and disabling end every session of the user in the same transaction, so a demoted
 * or disabled account cannot keep using a cookie it already holds.
 */
export async function updateUser(id: string, version: number, change: UserChange): Promise<UserDTO | null> {
  return db().transaction(async (trx) => {
    let activeAdminIds: string[] | null = null;
    if (takesAdminAway(change)) {
      // Two admins disabling or demoting each other at once would each count two admins and both
      // succeed. Locking every active admin row of the site, before the target's and in one order,
      // makes the second wait and then count what the first left.
      const site = await trx<UserRow>("users").where({ id }).first("site_id");
      if (site) {
        const rows = await trx<UserRow>("users")
          .where({ site_id: site.site_id, role: "admin" })
          .whereNull("disabled_at")
          .orderBy("id")
          .forUpdate()
          .select("id");
        activeAdminIds = rows.map((r) => r.id);
      }
    }
    const current = await trx<UserRow>("users").where({ id }).forUpdate().first();
    if (!current || current.version !== version) return null;
    if (activeAdminIds?.includes(id) && !activeAdminIds.some((other) => other !== id)) throw new LastAdminError();
    const patch: Record<string, unknown> = { version: version + 1, updated_at: trx.fn.now(3) };
    if (change.role !== undefined) patch.role = change.role;
    if (change.displayName !== undefined) patch.display_name = change.displayName.trim();
    if (change.disabled !== undefined) patch.disabled_at = change.disabled ? (current.disabled_at ?? new Date()) : null;
    await trx("users").where({ id }).update(patch);
    const roleChanged = change.role !== undefined && change.role !== current.role;
    const disabledNow = change.disabled === true && current.disabled_at === null;
    if (roleChanged || disabledNow) await trx("sessions").where({ user_id: id }).delete();
    const row = await trx<UserRow>("users").where({ id }).first();
    return row ? toDTO(row) : null;
  });
}

export async function recordSignIn(id: string, at: Date): Promise<void> {
  await db()("users").where({ id }).update({ last_sign_in_at: at });
}

export async function setPasswordHash(id: string, passwordHash: string): Promise<void> {
  await db()("users")
    .where({ id })
    .update({ password_hash: passwordHash, updated_at: db().fn.now(3) });
}
