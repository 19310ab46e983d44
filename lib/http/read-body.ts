import { HttpError } from "./errors";

/**
 * The request body, never more than `maxBytes` of it: a declared Content-Length over the cap is
 * refused unread, and a body without one (chunked) is cut off the moment it passes the cap. Reading
 * it whole first (`request.text()`, `.formData()`) would let one client make the server hold
 * whatever it sends.
 */
export async function readBodyCapped(
  req: Request,
  maxBytes: number,
  tooLarge: string,
): Promise<Uint8Array<ArrayBuffer>> {
  if (Number(req.headers.get("content-length") ?? 0) > maxBytes) throw new HttpError(413, tooLarge);
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      // Nothing more of it is read; the answer goes out while the client may still be sending.
      void reader.cancel().catch(() => undefined);
      throw new HttpError(413, tooLarge);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}
