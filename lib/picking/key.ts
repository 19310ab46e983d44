// Idempotency keys made on the handheld. crypto.randomUUID exists only in secure contexts (HTTPS or
// localhost); a handheld on the site's LAN over plain HTTP has only crypto.getRandomValues.

/** 128 random bits as 32 hex digits. */
export function newIdempotencyKey(c: Pick<Crypto, "getRandomValues"> = globalThis.crypto): string {
  const bytes = c.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, "0")).join("");
}
