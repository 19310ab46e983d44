/**
 * next start appends the socket address to X-Forwarded-For, so the last entry is the one a client
 * cannot forge; earlier entries are whatever the client sent.
 */
export function clientIp(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for");
  const last = forwarded?.split(",").map((s) => s.trim()).filter(Boolean).at(-1);
  return last ?? headers.get("x-real-ip") ?? "unknown";
}
