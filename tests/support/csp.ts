/** The directives of a Content-Security-Policy header, by name (sources in the order sent). */
export function cspDirectives(header: string | undefined): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const part of (header ?? "").split(";")) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name.toLowerCase(), sources);
  }
  return out;
}

/** The nonce a policy's script-src allows, if any. */
export function scriptNonce(header: string | undefined): string | undefined {
  const source = cspDirectives(header)
    .get("script-src")
    ?.find((s) => /^'nonce-.+'$/.test(s));
  return source?.slice("'nonce-".length, -1);
}

/** Every <script …> opening tag of an HTML page. */
export const scriptTags = (html: string) => html.match(/<script\b[^>]*>/gi) ?? [];
