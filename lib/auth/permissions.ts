// The one permission table. Pages, route handlers and server actions ask for a permission, never a
// role, so changing who may do what is a one-line change here (and the access tests follow it).
import type { Role } from "@/lib/contracts/users";

export { ROLES, type Role } from "@/lib/contracts/users";

export const PERMISSIONS = {
  "users.manage": ["admin"],
  "floorplans.read": ["admin", "planner"],
  "floorplans.edit": ["admin"],
  "waves.read": ["admin", "planner", "supervisor"],
  "waves.plan": ["admin", "planner"],
  "picks.work": ["admin", "picker"],
  // The shift on the floor: who holds which batch, moving batches between pickers, short-pick follow-up.
  "floor.watch": ["admin", "planner", "supervisor"],
  "batches.assign": ["admin", "planner", "supervisor"],
  "shortpicks.follow": ["admin", "planner", "supervisor"],
  // The site's own figures (time zone, formats, timing): estimates everywhere depend on them.
  "site.manage": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** "public": anyone; "signed-in": any role; otherwise a permission from the table. */
export type Access = Permission | "public" | "signed-in";

export function roleMay(role: Role, access: Access): boolean {
  if (access === "public" || access === "signed-in") return true;
  return (PERMISSIONS[access] as readonly Role[]).includes(role);
}

export const ROLE_HOME: Record<Role, string> = {
  admin: "/floor-plans",
  planner: "/waves",
  picker: "/my-batches",
  supervisor: "/floor",
};

export const ROLE_LABEL: Record<Role, string> = {
  admin: "Layout admin",
  planner: "Wave planner",
  picker: "Picker",
  supervisor: "Shift supervisor",
};
