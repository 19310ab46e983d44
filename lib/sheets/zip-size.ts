/** Offset of the end-of-central-directory record, which sits in the last 64 KiB + 22 bytes; -1 if none. */
export function endOfCentralDirectory(view: DataView): number {
  const stop = Math.max(0, view.byteLength - 65_557);
  for (let i = view.byteLength - 22; i >= stop; i--) if (view.getUint32(i, true) === 0x06054b50) return i;
  return -1;
}

/**
 * Sum of the uncompressed sizes in a zip's central directory, read before anything is unpacked, so a
 * small upload that would inflate to gigabytes is refused first. Null when the directory is unreadable.
 */
export function zipUnpackedBytes(bytes: Uint8Array): number | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const eocd = endOfCentralDirectory(view);
  if (eocd < 0) return null;
  const entries = view.getUint16(eocd + 10, true);
  let offset = view.getUint32(eocd + 16, true);
  let total = 0;
  for (let n = 0; n < entries; n++) {
    if (offset + 46 > bytes.length || view.getUint32(offset, true) !== 0x02014b50) return null;
    total += view.getUint32(offset + 24, true);
    const nameLen = view.getUint16(offset + 28, true);
    const extraLen = view.getUint16(offset + 30, true);
    const commentLen = view.getUint16(offset + 32, true);
    offset += 46 + nameLen + extraLen + commentLen;
  }
  return total;
}
