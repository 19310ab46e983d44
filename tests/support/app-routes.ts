import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

const APP_DIR = path.resolve(process.cwd(), "app");

/** URL pattern of a file under app/: route groups "(x)" vanish, [id] stays as written. */
function urlOf(dir: string): string {
  const parts = path
    .relative(APP_DIR, dir)
    .split(path.sep)
    .filter((p) => p && !/^\(.*\)$/.test(p));
  return "/" + parts.join("/");
}

function walk(dir: string, out: string[] = []): string[] {
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) walk(full, out);
    else out.push(full);
  }
  return out;
}

/** Every page and route handler that exists in app/, read from the files themselves. */
export function discoverRoutes() {
  const files = walk(APP_DIR);
  const pages = files.filter((f) => /\/page\.tsx?$/.test(f)).map((f) => urlOf(path.dirname(f)));
  const handlers = files
    .filter((f) => /\/route\.ts$/.test(f))
    .map((f) => {
      const src = readFileSync(f, "utf8");
      const methods = [...src.matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map(
        (m) => m[1] as "GET" | "POST" | "PUT" | "PATCH" | "DELETE",
      );
      return { url: urlOf(path.dirname(f)), methods };
    });
  return { pages: pages.sort(), handlers };
}

/** A concrete URL for a pattern: dynamic segments get a value that exists nowhere. */
export const concrete = (pattern: string) => pattern.replace(/\[[^\]]+\]/g, "no-such-id");

/**
 * Pages render real records: the seeded demo floor plan is 1 and its first layout version is 1; wave 1
 * is Monday's, released, and its batch 1 (id 1) is assigned to the demo picker.
 */
export const concretePage = (pattern: string) => pattern.replace(/\[(id|number|batchId)\]/g, "1");
