const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

// Where people open this site, from APP_ORIGIN (scripts/start.sh and scripts/test.sh set it). The
// Host header cannot serve: the client chooses it, so a foreign page's request naming its own host
// there would pass.
const DEV_DEFAULT = "http://127.0.0.1:3000";
const EXAMPLE = `for example APP_ORIGIN=${DEV_DEFAULT}, or a comma-separated list such as ${DEV_DEFAULT},http://trailbin.lan:3000 to serve handhelds on a LAN host name too`;

export class OriginSettingError extends Error {}

/**
 * APP_ORIGIN as a list of serialised origins; the first is where links in mail point. Throws with
 * words that say what to set, for a server that should not start with it.
 */
export function parsePublicOrigins(value: string): string[] {
  const entries = value
    .split(",")
    .map((e) => e.trim())
    .filter((e) => e !== "");
  if (entries.length === 0)
    throw new OriginSettingError(`APP_ORIGIN is not set: give the address people open Trailbin at, ${EXAMPLE}.`);
  const origins = entries.map((entry) => {
    let url: URL;
    try {
      url = new URL(entry);
    } catch {
      throw new OriginSettingError(
        `APP_ORIGIN entry "${entry}" is not an address: start it with http:// or https://, ${EXAMPLE}.`,
      );
    }
    if (url.protocol !== "http:" && url.protocol !== "https:") {
      throw new OriginSettingError(`APP_ORIGIN entry "${entry}" must start with http:// or https://, ${EXAMPLE}.`);
    }
    if (url.pathname !== "/" || url.search || url.hash || url.username || url.password) {
      throw new OriginSettingError(
        `APP_ORIGIN entry "${entry}" may have no path, query or user name: just scheme, host and port, ${EXAMPLE}.`,
      );
    }
    return url.origin;
  });
  // A site is served over HTTP or over HTTPS (its session cookie is named for one of them); a list
  // mixing both would let a page on the other one act on this site.
  if (new Set(origins.map((o) => new URL(o).protocol)).size > 1) {
    throw new OriginSettingError(
      `APP_ORIGIN mixes http:// and https:// entries (${origins.join(", ")}): a site is served with one scheme, so list them all with the one it uses.`,
    );
  }
  return [...new Set(origins)];
}

let cached: { value: string | undefined; origins: string[] } | null = null;

/** The configured public origins; outside production a missing APP_ORIGIN means npm start's address. */
export function publicOrigins(): string[] {
  const value = process.env.APP_ORIGIN;
  if (cached === null || cached.value !== value) {
    const fallback = process.env.NODE_ENV === "production" ? "" : DEV_DEFAULT;
    cached = { value, origins: parsePublicOrigins(value?.trim() ? value : fallback) };
  }
  return cached.origins;
}

/**
 * A state-changing request must say where it comes from, and that must be one of the configured
 * public origins, scheme and port included: a missing Origin is refused too, because browsers always
 * send it on cross-site POSTs and a form we serve always has it.
 */
export function originAllowed(method: string, headers: Headers, allowed: string[] = publicOrigins()): boolean {
  if (SAFE_METHODS.has(method.toUpperCase())) return true;
  const origin = headers.get("origin");
  if (!origin) return false;
  // Browsers send the origin serialised; anything else (a path, "null", upper case) is not one of ours.
  let serialised: string;
  try {
    serialised = new URL(origin).origin;
  } catch {
    return false;
  }
  return serialised === origin && allowed.includes(origin);
}
