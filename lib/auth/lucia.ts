import "server-only";
import { Lucia, TimeSpan } from "lucia";
import { sessionAdapter } from "@/db/sessions";
import type { Role } from "./permissions";

/** Idle time after which a session ends; lucia slides it forward on use (common practice: a few hours). */
export const SESSION_IDLE = new TimeSpan(4, "h");
/** Hard cap from sign-in, whatever the activity: a shift plus overtime. */
export const SESSION_ABSOLUTE_MS = 12 * 60 * 60 * 1000;

// Over HTTPS the __Host- prefix pins the cookie to this host and path; on loopback http it cannot be used.
const secure = process.env.COOKIE_SECURE === "true";

function createLucia() {
  return new Lucia(sessionAdapter(), {
    sessionExpiresIn: SESSION_IDLE,
    sessionCookie: {
      name: secure ? "__Host-trailbin_session" : "trailbin_session",
      // The server decides when a session ends; the cookie just carries the id.
      expires: false,
      attributes: { secure, sameSite: "lax" },
    },
    getSessionAttributes: (a) => ({ createdAt: a.created_at }),
    getUserAttributes: (a) => ({
      email: a.email,
      displayName: a.display_name,
      role: a.role,
      siteId: a.site_id,
      disabled: a.disabled_at !== null,
    }),
  });
}

type TrailbinLucia = ReturnType<typeof createLucia>;
const globalForLucia = globalThis as unknown as { trailbinLucia?: TrailbinLucia };

export function lucia(): TrailbinLucia {
  globalForLucia.trailbinLucia ??= createLucia();
  return globalForLucia.trailbinLucia;
}

export const SESSION_COOKIE = secure ? "__Host-trailbin_session" : "trailbin_session";

interface DatabaseUserAttributes {
  email: string;
  display_name: string;
  role: Role;
  site_id: number;
  disabled_at: Date | null;
}
interface DatabaseSessionAttributes {
  created_at: Date | string;
}

declare module "lucia" {
  interface Register {
    Lucia: TrailbinLucia;
    DatabaseUserAttributes: DatabaseUserAttributes;
    DatabaseSessionAttributes: DatabaseSessionAttributes;
  }
}
