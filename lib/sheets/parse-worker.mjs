// Runs in its own worker thread (plain JavaScript: worker threads do not inherit tsx's loader).
// xlsx 0.18.5, the newest on npm, has a prototype-pollution and a ReDoS advisory on crafted files;
// freezing the built-in prototypes before it loads stops the first, and the parent's time limit
// (worker.terminate) stops the second.
import { parentPort, workerData } from "node:worker_threads";
import { createRequire } from "node:module";

for (const proto of [Object.prototype, Array.prototype, Function.prototype, String.prototype]) Object.freeze(proto);

// maxRows counts data rows; the header row comes on top.
const { bytes, text, maxRows, maxColumns } = workerData;

try {
  const XLSX = createRequire(import.meta.url)("xlsx");
  const common = {
    dense: true,
    sheetRows: maxRows + 2,
    cellFormula: false,
    cellHTML: false,
    cellStyles: false,
    bookVBA: false,
  };
  // CSV arrives decoded; raw keeps "007" as typed instead of turning it into the number 7.
  const book =
    text !== undefined
      ? XLSX.read(text, { ...common, type: "string", raw: true })
      : XLSX.read(bytes, { ...common, type: "buffer" });
  const name = book.SheetNames[0];
  const sheet = name ? book.Sheets[name] : undefined;
  if (!sheet) {
    parentPort.postMessage({ ok: false, message: "The file has no sheet to read." });
  } else {
    const rows = XLSX.utils.sheet_to_json(sheet, { header: 1, raw: false, defval: "", blankrows: true });
    // Blank rows stay, so the row numbers reported back match the sheet. Copy into plain strings: none of the parser's own objects leave this thread.
    const out = rows
      .slice(0, maxRows + 1)
      .map((r) => (Array.isArray(r) ? r.slice(0, maxColumns).map((c) => (c == null ? "" : String(c))) : []));
    parentPort.postMessage({ ok: true, rows: out, truncated: rows.length > maxRows + 1 });
  }
} catch (e) {
  parentPort.postMessage({
    ok: false,
    message: `The file could not be read as a spreadsheet (${String(e && e.message).slice(0, 200)}).`,
  });
}
