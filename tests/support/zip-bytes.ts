import { crc32, deflateRawSync } from "node:zlib";

export type ZipInput = {
  name: string;
  data: Uint8Array;
  /** Sizes to write instead of the true ones, in the directory and the local header (a lying zip). */
  claim?: { unpacked: number; localUnpacked?: number };
};

/**
 * A zip written byte by byte (PKWARE APPNOTE 4.3.7 local header, 4.3.12 directory header, 4.3.16 end
 * record), every entry deflated, so a test can set sizes no zip library would write.
 */
export function zipBytes(entries: ZipInput[], opts: { repeatFirst?: number } = {}): Uint8Array {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  const records: { central: Buffer }[] = [];
  for (const e of entries) {
    const name = Buffer.from(e.name, "utf8");
    const packed = deflateRawSync(e.data, { level: 9 });
    const unpacked = e.claim?.unpacked ?? e.data.length;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc32(e.data), 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(e.claim?.localUnpacked ?? unpacked, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc32(e.data), 16);
    central.writeUInt32LE(packed.length, 20);
    central.writeUInt32LE(unpacked, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    const record = Buffer.concat([central, name]);
    records.push({ central: record });
    centrals.push(record);
    locals.push(local, name, packed);
    offset += local.length + name.length + packed.length;
  }
  // Directory records that all point at the first entry's data: overlapping entries, one stream unpacked many times.
  for (let i = 1; i < (opts.repeatFirst ?? 1); i++) centrals.push(records[0]!.central);
  const dir = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(centrals.length, 8);
  end.writeUInt16LE(centrals.length, 10);
  end.writeUInt32LE(dir.length, 12);
  end.writeUInt32LE(offset, 16);
  return new Uint8Array(Buffer.concat([...locals, dir, end]));
}
