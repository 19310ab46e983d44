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
  "/floor-plans/[id]": "floorplans.read",
  "/floor-plans/[id]/versions/[number]": "floorplans.read",
  "/waves": "waves.read",
  "/my-batches": "picks.work",
  "/pick/[batchId]": "picks.work",
  "/floor": "floor.watch",
  "/admin/users": "users.manage",
  "/admin/mail": "users.manage",
  "/set-password": "public",
  "/forgot-password": "public",
  "/items": "waves.read",
  "/orders": "waves.read",
  "/waves/[id]": "waves.read",
  "/waves/[id]/batches/[number]": "waves.read",
  "/waves/[id]/batches/[number]/print": "waves.read",
  "/waves/[id]/print": "waves.read",
};

export const API_ACCESS: Record<string, Partial<Record<Method, Access>>> = {
  "/api/health": { GET: "public" },
  "/api/session": { GET: "signed-in", POST: "public", DELETE: "signed-in" },
  "/api/users": { GET: "users.manage", POST: "users.manage" },
  "/api/users/[id]": { PATCH: "users.manage" },
  "/api/mail": { GET: "users.manage" },
  "/api/password/reset-request": { POST: "public" },
  "/api/password/set": { POST: "public" },
  "/api/floor-plans": { GET: "floorplans.read", POST: "floorplans.edit" },
  "/api/floor-plans/[id]/draft": { GET: "floorplans.read", PUT: "floorplans.edit" },
  "/api/floor-plans/[id]/publish": { POST: "floorplans.edit" },
  "/api/floor-plans/[id]/versions": { GET: "floorplans.read" },
  "/api/floor-plans/[id]/versions/[number]": { GET: "floorplans.read" },
  "/api/floor-plans/[id]/background": { POST: "floorplans.edit" },
  "/api/floor-plans/[id]/background/[fileId]": { GET: "floorplans.read" },
  "/api/floor-plans/[id]/rack-runs/[runId]/bins": { GET: "floorplans.read", POST: "floorplans.edit" },
  "/api/layout-versions/[id]/distance": { GET: "floorplans.read" },
  "/api/jobs/[id]": { GET: "signed-in", DELETE: "signed-in" },
  "/api/items": { GET: "waves.read" },
  "/api/items/export": { GET: "waves.read" },
  "/api/orders": { GET: "waves.read" },
  "/api/imports/[kind]": { POST: "waves.plan" },
  "/api/imports/[kind]/preview": { POST: "waves.plan" },
  "/api/imports/[kind]/template": { GET: "waves.plan" },
  "/api/my-batches": { GET: "picks.work" },
  "/api/batches/[batchId]/take": { POST: "picks.work" },
  "/api/batches/[batchId]/give-back": { POST: "picks.work" },
  "/api/batches/[batchId]/pick": { GET: "picks.work" },
  "/api/batches/[batchId]/confirm": { POST: "picks.work" },
  "/api/floor": { GET: "floor.watch" },
  "/api/floor/batches/[batchId]/assign": { POST: "batches.assign" },
  "/api/waves": { GET: "waves.read", POST: "waves.plan" },
  "/api/waves/preview": { GET: "waves.plan" },
  "/api/waves/[id]": { GET: "waves.read" },
  "/api/waves/[id]/plan": { POST: "waves.plan" },
  "/api/waves/[id]/release": { POST: "waves.plan" },
  "/api/waves/[id]/discard": { POST: "waves.plan" },
  "/api/waves/[id]/printed": { POST: "waves.plan" },
};
