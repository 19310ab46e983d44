import { inflateRaw } from "node:zlib";
import { endOfCentralDirectory } from "./zip-size";

export type Inflated = { ok: true; bytes: number } | { ok: false; reason: "damaged" | "too-large" };

const inflateBounded = (data: Uint8Array, maxOutputLength: number) =>
  new Promise<Buffer>((resolve, reject) =>
    inflateRaw(data, { maxOutputLength }, (e, out) => (e ? reject(e) : resolve(out))),
  );

/**
 * What a zip really unpacks to, measured by inflating every entry with a cap on the output, before the
 * parser sees it. The sizes in the directory are only claims: xlsx 0.18.5 inflates each entry from its
 * local header to the end of the deflate stream, sizing its buffer from the local header (growing it
 * without bound when that says 0), so a workbook that lies about its sizes would otherwise unpack in
 * full inside the parse worker, whose heap limit does not cover Buffers. Runs on libuv's thread pool.
 * Offsets per PKWARE APPNOTE 4.3.7 (local file header) and 4.3.12 (central directory header).
 */
export async function zipInflatedBytes(bytes: Uint8Array, limit: number): Promise<Inflated> {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const eocd = endOfCentralDirectory(view);
  if (eocd < 0) return { ok: false, reason: "damaged" };
  // The parser takes the last end-of-directory signature in the file; a second one after this makes
  // it read another directory than the one checked here.
  for (let i = eocd + 1; i + 4 <= bytes.length; i++)
    if (view.getUint32(i, true) === 0x06054b50) return { ok: false, reason: "damaged" };
  const entries = view.getUint16(eocd + 10, true);
  let offset = view.getUint32(eocd + 16, true);
  let total = 0;
  for (let n = 0; n < entries; n++) {
    if (offset + 46 > bytes.length || view.getUint32(offset, true) !== 0x02014b50)
      return { ok: false, reason: "damaged" };
    const compressed = view.getUint32(offset + 20, true);
    const unpacked = view.getUint32(offset + 24, true);
    const local = view.getUint32(offset + 42, true);
    offset +=
      46 + view.getUint16(offset + 28, true) + view.getUint16(offset + 30, true) + view.getUint16(offset + 32, true);
    if (local + 30 > bytes.length || view.getUint32(local, true) !== 0x04034b50)
      return { ok: false, reason: "damaged" };
    const flags = view.getUint16(local + 6, true);
    const method = view.getUint16(local + 8, true);
    const dataStart = local + 30 + view.getUint16(local + 26, true) + view.getUint16(local + 28, true);
    // With a data descriptor (flag bit 3) the local sizes may be 0; otherwise they must be the directory's.
    const localCompressed = view.getUint32(local + 18, true);
    const localUnpacked = view.getUint32(local + 22, true);
    if (!(flags & 8) && (localCompressed !== compressed || localUnpacked !== unpacked))
      return { ok: false, reason: "damaged" };
    if (
      flags & 8 &&
      !(
        (localCompressed === 0 && localUnpacked === 0) ||
        (localCompressed === compressed && localUnpacked === unpacked)
      )
    ) {
      return { ok: false, reason: "damaged" };
    }
    if (dataStart > bytes.length) return { ok: false, reason: "damaged" };
    if (method === 0) total += Math.min(localCompressed || compressed, bytes.length - dataStart);
    else if (method === 8) {
      try {
        // From the entry's data to the end of the file, as the parser reads it: the stream ends where it says.
        total += (await inflateBounded(bytes.subarray(dataStart), limit - total + 1)).length;
      } catch (e) {
        if ((e as { code?: string }).code === "ERR_BUFFER_TOO_LARGE") return { ok: false, reason: "too-large" };
        return { ok: false, reason: "damaged" };
      }
    } else return { ok: false, reason: "damaged" };
    if (total > limit) return { ok: false, reason: "too-large" };
  }
  return { ok: true, bytes: total };
}
