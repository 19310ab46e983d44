import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import * as XLSX from "xlsx";
import { readSheet, SheetError, MAX_COLUMNS, MAX_ROWS } from "@/lib/sheets/read";

// Hostile bytes into the spreadsheet reader: whatever arrives, the answer is rows of strings or the
// reader's own SheetError (its time cap and caps included), and no built-in prototype changes.
// Every case that reaches the parse worker costs a worker start (~0.3 s here), so the counts below
// are sized to keep this file near a minute and a half on a busy 2-core machine (measured: 360 cases,
// 60-100 s); cases refused by the signature or zip checks cost nothing. Each test gets its own
// timeout: the cases are many, and a slow parse may run into the reader's own 15 s cap.
const TEST_TIMEOUT_MS = 240_000;
const SEED = 20261207;
const RUNS = { randomBytes: 200, randomText: 15, mutatedXlsx: 80, mutatedCsv: 25, splicedZips: 40 } as const;

const PROTOTYPES = {
  Object: Object.prototype,
  Array: Array.prototype,
  String: String.prototype,
  Function: Function.prototype,
};
type Shape = Record<string, Record<string, unknown>>;
function prototypeShape(): Shape {
  const out: Shape = {};
  for (const [name, proto] of Object.entries(PROTOTYPES)) {
    const desc: Record<string, unknown> = {};
    for (const key of Reflect.ownKeys(proto)) {
      const d = Object.getOwnPropertyDescriptor(proto, key)!;
      desc[String(key)] = { value: d.value, get: d.get, set: d.set, writable: d.writable, enumerable: d.enumerable };
    }
    out[name] = { keys: Reflect.ownKeys(proto).map(String), extensible: Object.isExtensible(proto), desc };
  }
  return out;
}
const before = prototypeShape();

function workbook(
  rows: (string | number | boolean)[][],
  opts: { sheets?: number; compression?: boolean } = {},
): Uint8Array {
  const book = XLSX.utils.book_new();
  for (let s = 0; s < (opts.sheets ?? 1); s++)
    XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(rows), `S${s + 1}`);
  return new Uint8Array(
    XLSX.write(book, { type: "buffer", bookType: "xlsx", compression: opts.compression ?? true }) as Buffer,
  );
}
const utf8 = (s: string) => new TextEncoder().encode(s);

const FIXTURE_CSV = new Uint8Array(
  readFileSync(path.join(process.cwd(), "tests/fixtures/sheets/prototype-pollution.csv")),
);
const ORDER_ROWS = [
  ["Order number", "Line", "SKU", "Quantity", "Cut-off", "Priority"],
  ["SO-1001", 1, "BOLT-M8", 12, "2026-12-01 10:00", 1],
  ["SO-1001", 2, "__proto__", 3, "2026-12-01 10:00", 2],
  ["SO-1002", 1, "constructor", "007", "", 3],
];
const XLSX_SEEDS = [
  workbook(ORDER_ROWS),
  workbook(ORDER_ROWS, { compression: false }),
  workbook(
    [
      ["__proto__", "constructor", "prototype"],
      ["=1+1", "@SUM(A1)", true],
    ],
    { sheets: 2 },
  ),
  workbook([["SKU", "Description"], ...Array.from({ length: 30 }, (_, i) => [`SKU-${i}`, "x".repeat(i * 3)])]),
];
const CSV_SEEDS = [
  FIXTURE_CSV,
  utf8('\uFEFFcode,qty\nÅ-1,007\n\n,\n"a,b","say ""hi"""\n'),
  utf8(XLSX.utils.sheet_to_csv(XLSX.utils.aoa_to_sheet(ORDER_ROWS))),
];

/** A workbook written fresh for the case, from generated cells. */
const freshWorkbook = fc
  .array(fc.array(fc.oneof(fc.string({ maxLength: 12 }), fc.integer(), fc.boolean()), { minLength: 1, maxLength: 5 }), {
    minLength: 1,
    maxLength: 6,
  })
  .map((rows) => workbook(rows));
const xlsxSeed = fc.oneof(fc.constantFrom(...XLSX_SEEDS), freshWorkbook);

type Mutation =
  | { kind: "flip"; at: number; bit: number }
  | { kind: "truncate"; at: number }
  | { kind: "insert"; at: number; bytes: Uint8Array }
  | { kind: "delete"; at: number; length: number };
// A position anywhere in the file: a large number taken modulo the length (fc.double leans to 0).
const at = fc.nat({ max: 1_000_000_007 });
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { arbitrary: fc.record({ kind: fc.constant("flip" as const), at, bit: fc.integer({ min: 0, max: 7 }) }), weight: 3 },
  fc.record({ kind: fc.constant("truncate" as const), at }),
  fc.record({ kind: fc.constant("insert" as const), at, bytes: fc.uint8Array({ minLength: 1, maxLength: 64 }) }),
  fc.record({ kind: fc.constant("delete" as const), at, length: fc.integer({ min: 1, max: 256 }) }),
);

function mutate(bytes: Uint8Array, ms: Mutation[]): Uint8Array {
  let b: Uint8Array = new Uint8Array(bytes);
  for (const m of ms) {
    const i = b.length ? m.at % b.length : 0;
    if (m.kind === "flip" && b.length) b[i] = b[i]! ^ (1 << m.bit);
    // Keep a byte at least: the empty file has its own test.
    else if (m.kind === "truncate") b = b.slice(0, Math.max(1, i));
    else if (m.kind === "insert") b = concat(b.subarray(0, i), m.bytes, b.subarray(i));
    else if (m.kind === "delete") b = concat(b.subarray(0, i), b.subarray(i + m.length));
  }
  return b;
}
function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) (out.set(p, o), (o += p.length));
  return out;
}

type ZipEntry = { local: Uint8Array; central: Uint8Array };
/** A zip's entries through its central directory (PKWARE APPNOTE 4.3.7, 4.3.12, 4.3.16): each local record and its directory record. */
function zipEntries(b: Uint8Array): ZipEntry[] {
  const v = new DataView(b.buffer, b.byteOffset, b.byteLength);
  let eocd = b.length - 22;
  while (eocd >= 0 && v.getUint32(eocd, true) !== 0x06054b50) eocd--;
  const out: ZipEntry[] = [];
  let o = v.getUint32(eocd + 16, true);
  for (let n = v.getUint16(eocd + 10, true); n > 0; n--) {
    const centralLength = 46 + v.getUint16(o + 28, true) + v.getUint16(o + 30, true) + v.getUint16(o + 32, true);
    const local = v.getUint32(o + 42, true);
    const localLength = 30 + v.getUint16(local + 26, true) + v.getUint16(local + 28, true) + v.getUint32(o + 20, true);
    out.push({ local: b.slice(local, local + localLength), central: b.slice(o, o + centralLength) });
    o += centralLength;
  }
  return out;
}
/** A well-formed zip of the given entries: the directory is right, what it points at may not fit together. */
function zipOf(entries: ZipEntry[]): Uint8Array {
  const centrals: Uint8Array[] = [];
  let offset = 0;
  for (const e of entries) {
    const c = new Uint8Array(e.central);
    new DataView(c.buffer).setUint32(42, offset, true);
    centrals.push(c);
    offset += e.local.length;
  }
  const dir = concat(...centrals);
  const end = new Uint8Array(22);
  const v = new DataView(end.buffer);
  v.setUint32(0, 0x06054b50, true);
  v.setUint16(8, entries.length, true);
  v.setUint16(10, entries.length, true);
  v.setUint32(12, dir.length, true);
  v.setUint32(16, offset, true);
  return concat(...entries.map((e) => e.local), dir, end);
}
/** Entries of two workbooks mixed: each slot of the first keeps its entry, takes the other's, is dropped or doubled. */
function splice(a: Uint8Array, b: Uint8Array, picks: number[]): Uint8Array {
  const ea = zipEntries(a);
  const eb = zipEntries(b);
  const out: ZipEntry[] = [];
  ea.forEach((e, i) => {
    const p = picks[i % picks.length]! % 4;
    if (p === 0) out.push(e);
    else if (p === 1) out.push(eb[i % eb.length]!);
    else if (p === 3) out.push(e, eb[(i + 1) % eb.length]!);
  });
  return zipOf(out);
}

const tally: Record<string, Record<string, number>> = {};
/** Reads the bytes and checks the answer is one of the two allowed kinds; counts what happened. */
async function readsSafely(property: string, bytes: Uint8Array): Promise<void> {
  const t = (tally[property] ??= {});
  let outcome: string;
  try {
    const { kind, rows } = await readSheet(bytes);
    expect(["xlsx", "csv"]).toContain(kind);
    expect(rows.length).toBeLessThanOrEqual(MAX_ROWS + 1);
    for (const r of rows) {
      expect(r.length).toBeLessThanOrEqual(MAX_COLUMNS);
      for (const c of r) expect(typeof c).toBe("string");
    }
    outcome = "rows";
  } catch (e) {
    if (!(e instanceof SheetError)) throw e;
    expect([400, 413, 415, 422]).toContain(e.status);
    expect(e.message.length).toBeGreaterThan(10);
    outcome = String(e.status);
  }
  t[outcome] = (t[outcome] ?? 0) + 1;
  expect(prototypeShape()).toEqual(before);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
}

async function check<T>(property: keyof typeof RUNS, arb: fc.Arbitrary<T>, toBytes: (v: T) => Uint8Array) {
  await fc.assert(
    fc.asyncProperty(arb, (v) => readsSafely(property, toBytes(v))),
    { seed: SEED, numRuns: RUNS[property] },
  );
  const tried = Object.values(tally[property] ?? {}).reduce((a, b) => a + b, 0);
  console.log(`sheet reader, ${property}: ${tried} cases`, tally[property]);
  expect(tried).toBe(RUNS[property]);
}

afterAll(() => expect(prototypeShape()).toEqual(before));

describe("the sheet reader under hostile bytes", () => {
  it(
    `random bytes, bare and behind a zip signature (${RUNS.randomBytes} cases)`,
    async () => {
      await check(
        "randomBytes",
        fc.tuple(fc.boolean(), fc.uint8Array({ minLength: 1, maxLength: 4096 })),
        ([zip, b]) => (zip ? concat(new Uint8Array([0x50, 0x4b, 3, 4]), b) : b),
      );
    },
    TEST_TIMEOUT_MS,
  );

  it(
    `random text read as CSV (${RUNS.randomText} cases)`,
    async () => {
      await check("randomText", fc.string({ unit: "binary", minLength: 1, maxLength: 2000 }), utf8);
      // Text with no NUL is CSV; the parser must have answered for most of it.
      expect((tally.randomText!.rows ?? 0) + (tally.randomText!["422"] ?? 0)).toBeGreaterThan(RUNS.randomText / 2);
    },
    TEST_TIMEOUT_MS,
  );

  it(
    `workbooks with flipped bits, truncated, with byte ranges inserted or deleted (${RUNS.mutatedXlsx} cases)`,
    async () => {
      await check("mutatedXlsx", fc.tuple(xlsxSeed, fc.array(mutation, { minLength: 1, maxLength: 3 })), ([b, ms]) =>
        mutate(b, ms),
      );
      // Some damage lands in cell data the directory check cannot see, so the parser itself is exercised.
      expect(tally.mutatedXlsx!.rows ?? 0).toBeGreaterThan(0);
    },
    TEST_TIMEOUT_MS,
  );

  it(
    `CSV files with the same mutations (${RUNS.mutatedCsv} cases)`,
    async () => {
      await check(
        "mutatedCsv",
        fc.tuple(fc.constantFrom(...CSV_SEEDS), fc.array(mutation, { minLength: 1, maxLength: 3 })),
        ([b, ms]) => mutate(b, ms),
      );
      expect(tally.mutatedCsv!.rows ?? 0).toBeGreaterThan(0);
    },
    TEST_TIMEOUT_MS,
  );

  it(
    `workbooks whose zip entries are mixed from two, dropped or doubled, some then mutated (${RUNS.splicedZips} cases)`,
    async () => {
      await check(
        "splicedZips",
        fc.tuple(
          xlsxSeed,
          xlsxSeed,
          fc.array(fc.nat(), { minLength: 1, maxLength: 12 }),
          fc.array(mutation, { maxLength: 1 }),
        ),
        ([a, b, picks, ms]) => mutate(splice(a, b, picks), ms),
      );
    },
    TEST_TIMEOUT_MS,
  );
});
