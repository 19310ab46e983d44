import "server-only";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { zipUnpackedBytes } from "./zip-size";
import { zipInflatedBytes } from "./zip-inflate";

export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
export const MAX_UNPACKED_BYTES = 50 * 1024 * 1024;
/** Data rows below the header: a day of order lines at a busy site fits with room to spare. */
export const MAX_ROWS = 50_000;
export const MAX_COLUMNS = 40;
const PARSE_TIME_LIMIT_MS = 15_000;

export class SheetError extends Error {
  constructor(
    readonly status: 400 | 413 | 415 | 422,
    message: string,
  ) {
    super(message);
  }
}

export type SheetKind = "xlsx" | "csv";

/** What the bytes are, from their first bytes, not from the name someone gave the file. */
export function sniffSheet(bytes: Uint8Array): SheetKind {
  if (bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04)
    return "xlsx";
  const head = bytes.subarray(0, Math.min(bytes.length, 64 * 1024));
  if (head.includes(0))
    throw new SheetError(415, "This is not a spreadsheet: upload an .xlsx workbook or a .csv file.");
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(
      head.length < bytes.length ? head.subarray(0, head.length - 4) : head,
    );
  } catch {
    throw new SheetError(
      415,
      "This is not a spreadsheet: a .csv file must be UTF-8 text. Save it as CSV UTF-8 or as .xlsx.",
    );
  }
  return "csv";
}

/** Reads the first sheet into rows of strings, in a sandboxed worker with a time limit. */
export async function readSheet(bytes: Uint8Array): Promise<{ kind: SheetKind; rows: string[][] }> {
  if (bytes.length === 0) throw new SheetError(400, "The file is empty.");
  if (bytes.length > MAX_UPLOAD_BYTES)
    throw new SheetError(
      413,
      `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MiB. Split it into smaller files.`,
    );
  const kind = sniffSheet(bytes);
  if (kind === "xlsx") {
    const unpacked = zipUnpackedBytes(bytes);
    if (unpacked === null)
      throw new SheetError(415, "The workbook is damaged (its zip directory cannot be read). Save it again and retry.");
    if (unpacked > MAX_UNPACKED_BYTES)
      throw new SheetError(
        413,
        `The workbook unpacks to ${Math.round(unpacked / 1024 / 1024)} MiB, more than the ${MAX_UNPACKED_BYTES / 1024 / 1024} MiB allowed.`,
      );
    // The directory's sizes are claims; this measures them (bounded) before the parser unpacks anything.
    const inflated = await zipInflatedBytes(bytes, MAX_UNPACKED_BYTES);
    if (!inflated.ok && inflated.reason === "too-large")
      throw new SheetError(
        413,
        `The workbook unpacks to more than the ${MAX_UNPACKED_BYTES / 1024 / 1024} MiB allowed.`,
      );
    if (!inflated.ok)
      throw new SheetError(
        415,
        "The workbook is damaged (its zip entries do not match their directory). Save it again and retry.",
      );
  }
  // CSV is decoded here as UTF-8 (the parser would read it as Latin-1), without a byte-order mark.
  const text = kind === "csv" ? new TextDecoder("utf-8").decode(bytes).replace(/^\uFEFF/, "") : undefined;
  const result = await parseInWorker(bytes, text);
  if (!result.ok) throw new SheetError(422, result.message);
  if (result.truncated)
    throw new SheetError(
      413,
      `The sheet has more than ${MAX_ROWS.toLocaleString("en")} rows below its header. Split it into smaller files.`,
    );
  return { kind, rows: result.rows };
}

type WorkerAnswer = { ok: true; rows: string[][]; truncated: boolean } | { ok: false; message: string };

function parseInWorker(bytes: Uint8Array, text: string | undefined): Promise<WorkerAnswer> {
  return new Promise((resolve) => {
    const worker = new Worker(path.join(/*turbopackIgnore: true*/ process.cwd(), "lib/sheets/parse-worker.mjs"), {
      workerData:
        text === undefined
          ? { bytes, maxRows: MAX_ROWS, maxColumns: MAX_COLUMNS }
          : { text, maxRows: MAX_ROWS, maxColumns: MAX_COLUMNS },
      resourceLimits: { maxOldGenerationSizeMb: 512 },
    });
    const timer = setTimeout(() => {
      void worker.terminate();
      resolve({
        ok: false,
        message: `Reading the file took longer than ${PARSE_TIME_LIMIT_MS / 1000} s and was stopped. Check it is an ordinary spreadsheet.`,
      });
    }, PARSE_TIME_LIMIT_MS);
    const finish = (a: WorkerAnswer) => {
      clearTimeout(timer);
      void worker.terminate();
      resolve(a);
    };
    worker.once("message", (m: WorkerAnswer) => finish(m));
    worker.once("error", (e) =>
      finish({ ok: false, message: `The file could not be read (${e.message.slice(0, 200)}).` }),
    );
    worker.once("exit", () =>
      finish({
        ok: false,
        message: "The file could not be read: the reader stopped unexpectedly (too large or damaged?).",
      }),
    );
  });
}
