import { appOrigin } from "@/lib/mail/config";

const sameOrigin = (target: string, origin: URL) => {
  try {
    return new URL(target, origin).origin === origin.origin;
  } catch {
    return false;
  }
};

function decoded(path: string): string {
  try {
    return decodeURIComponent(path);
  } catch {
    return path;
  }
}

/**
 * Where to go after sign-in: a path of this site, or null. `next` is resolved the way a browser will
 * resolve it (the WHATWG URL parser drops tabs and newlines and reads a backslash as a slash, so
 * "/\t/evil.example" is another host), and only a result on this origin is kept, as its path. The
 * path is checked once more, because one like "//evil.example" (from "/.//evil.example") would
 * leave again when the browser reads it.
 */
export function safeNextPath(next: string | undefined | null, origin: string = appOrigin()): string | null {
  if (!next) return null;
  const base = new URL(origin);
  if (!sameOrigin(next, base)) return null;
  const url = new URL(next, base);
  const path = url.pathname + url.search + url.hash;
  if (!path.startsWith("/") || !sameOrigin(path, base) || new URL(path, base).href !== url.href) return null;
  const plainPath = decoded(url.pathname);
  if (plainPath.startsWith("/sign-in") || plainPath.startsWith("/api/")) return null;
  return path;
}
