import type { Access } from "./permissions";

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/**
 * Who may reach each page and each route handler method. The access test walks app/ and fails for any
 * page or handler missing here, so a new route cannot ship without a decision. The handlers and pages
 * enforce this themselves through requireRole(); the table is what the test holds them to.
 */
export const PAGE_ACCESS: Record<string, Access> = {
  "/": "signed-in",
  "/sign-in": "public",
  "/floor-plans": "floorplans.read",
  "/waves": "waves.read",
  "/my-batches": "picks.work",
  "/admin/users": "users.manage",
};

export const API_ACCESS: Record<string, Partial<Record<Method, Access>>> = {
  "/api/health": { GET: "public" },
  "/api/session": { GET: "signed-in", POST: "public", DELETE: "signed-in" },
  "/api/users": { GET: "users.manage", POST: "users.manage" },
  "/api/users/[id]": { PATCH: "users.manage" },
};
