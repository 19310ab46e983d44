// Accounts as the users API and the admin screens see them. The roles live here, not in lib/auth,
// so that db/ and the browser can name a role without importing the server's permission code.

export const ROLES = ["admin", "planner", "picker", "supervisor"] as const;
export type Role = (typeof ROLES)[number];

export type UserDTO = {
  id: string;
  siteId: number;
  email: string;
  displayName: string;
  role: Role;
  disabled: boolean;
  lastSignInAt: string | null;
  createdAt: string;
  version: number;
};

/** The person a session belongs to, as pages and handlers see them. */
export type SignedInUser = { id: string; email: string; displayName: string; role: Role; siteId: number };
