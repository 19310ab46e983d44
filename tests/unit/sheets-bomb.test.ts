import { describe, expect, it, vi, beforeEach } from "vitest";
import { inflateRawSync } from "node:zlib";
import * as XLSX from "xlsx";
import { readSheet, MAX_UNPACKED_BYTES, MAX_UPLOAD_BYTES } from "@/lib/sheets/read";
import { zipUnpackedBytes } from "@/lib/sheets/zip-size";
import { zipBytes, type ZipInput } from "../support/zip-bytes";

// Counts the parse workers the reader starts, so a test can say a file was refused before parsing.
const started = vi.hoisted(() => ({ workers: 0 }));
vi.mock("node:worker_threads", async (importOriginal) => {
  const actual = await importOriginal<typeof import("node:worker_threads")>();
  class CountedWorker extends actual.Worker {
    constructor(...args: ConstructorParameters<typeof actual.Worker>) {
      super(...args);
      started.workers++;
    }
  }
  return { ...actual, default: { ...actual, Worker: CountedWorker }, Worker: CountedWorker };
});
beforeEach(() => {
  started.workers = 0;
});

/** The parts of a real workbook, so only the bomb entry is out of the ordinary. */
function workbookEntries(): ZipInput[] {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(
    book,
    XLSX.utils.aoa_to_sheet([
      ["SKU", "Quantity"],
      ["BOLT-M8", 12],
    ]),
    "S",
  );
  const files = XLSX.CFB.read(XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer, { type: "buffer" });
  const entries: ZipInput[] = files.FileIndex.map((f: { content: unknown }, i: number) => ({
    name: files.FullPaths[i]!.replace(/^[^/]*\//, ""),
    data: f.content as Uint8Array,
  }));
  return entries.filter((e) => e.data && e.data.length > 0 && !e.name.endsWith("/"));
}
// 60 MiB of one byte: deflate packs it about 1000 to 1 (RFC 1951 caps a match at 258 bytes).
const BOMB_DATA = new Uint8Array(60 * 1024 * 1024).fill(0x20);
const bomb = (claim?: ZipInput["claim"]): ZipInput => ({ name: "xl/worksheets/sheet2.xml", data: BOMB_DATA, claim });

function entryData(zip: Uint8Array): Uint8Array {
  // The first entry's deflate stream starts after its 30-byte local header and its name.
  const nameLength = zip[26]! | (zip[27]! << 8);
  return zip.subarray(30 + nameLength);
}

describe("zip bombs are refused before the parser starts", () => {
  it("an ordinary workbook written the same way is read (one parse worker)", async () => {
    const { rows } = await readSheet(zipBytes(workbookEntries()));
    expect(rows).toEqual([
      ["SKU", "Quantity"],
      ["BOLT-M8", "12"],
    ]);
    expect(started.workers).toBe(1);
  });

  it("a high-ratio deflate bomb that states its size: refused by the directory sum", async () => {
    const zip = zipBytes([bomb(), ...workbookEntries()]);
    expect(zip.length).toBeLessThan(MAX_UPLOAD_BYTES / 50);
    // It really unpacks far past the cap: zlib says so, independently of the reader.
    expect(inflateRawSync(entryData(zip)).length).toBeGreaterThan(MAX_UNPACKED_BYTES);
    expect(zipUnpackedBytes(zip)).toBeGreaterThan(MAX_UNPACKED_BYTES);
    await expect(readSheet(zip)).rejects.toMatchObject({
      status: 413,
      message: expect.stringMatching(/unpacks to .*MiB/),
    });
    expect(started.workers).toBe(0);
  });

  it.each([
    ["claims 1 KiB", { unpacked: 1024 }],
    ["claims 0 bytes (the parser would then grow its buffer without bound)", { unpacked: 0 }],
  ])("the same bomb whose directory and local header lie (%s): refused by measuring", async (_, claim) => {
    const zip = zipBytes([bomb(claim), ...workbookEntries()]);
    expect(zipUnpackedBytes(zip)).toBeLessThan(MAX_UNPACKED_BYTES);
    await expect(readSheet(zip)).rejects.toMatchObject({ status: 413 });
    expect(started.workers).toBe(0);
  });

  it("one 1 MiB stream listed 80 times in the directory (overlapping entries) counts 80 times", async () => {
    const zip = zipBytes(
      [{ name: "xl/media/a.bin", data: new Uint8Array(1024 * 1024), claim: { unpacked: 0 } }, ...workbookEntries()],
      { repeatFirst: 80 },
    );
    await expect(readSheet(zip)).rejects.toMatchObject({ status: 413 });
    expect(started.workers).toBe(0);
  });

  it("a local header that claims another size than the directory (4 GiB) is damaged", async () => {
    const zip = zipBytes([
      { name: "xl/a.xml", data: new Uint8Array(100), claim: { unpacked: 100, localUnpacked: 0xffffffff } },
      ...workbookEntries(),
    ]);
    await expect(readSheet(zip)).rejects.toMatchObject({ status: 415, message: expect.stringMatching(/damaged/) });
    expect(started.workers).toBe(0);
  });
});
