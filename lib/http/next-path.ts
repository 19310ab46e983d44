/** Only same-site paths may follow sign-in; anything else (//host, https://…) is dropped. */
export function safeNextPath(next: string | undefined | null): string | null {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return null;
  if (next.startsWith("/sign-in") || next.startsWith("/api/")) return null;
  return next;
}
