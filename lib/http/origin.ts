import { verifyRequestOrigin } from "lucia";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A state-changing request must say where it comes from, and that must be this host: a missing Origin
 * is refused too, because browsers always send it on cross-site POSTs and a form we serve always has it.
 */
export function originAllowed(method: string, headers: Headers): boolean {
  if (SAFE_METHODS.has(method.toUpperCase())) return true;
  const origin = headers.get("origin");
  const host = headers.get("host");
  if (!origin || !host) return false;
  return verifyRequestOrigin(origin, [host]);
}
