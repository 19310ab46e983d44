import * as XLSX from "xlsx";
import { escapeFormula } from "./formula-escape";

/** Cells that a spreadsheet would run as a formula get a leading apostrophe (formula injection). */
export function safeCell(value: string | number): string | number {
  return typeof value === "number" ? value : escapeFormula(value);
}

// Workbook text reads "_x0041_" as an escaped "A"; the reader (and Excel) take "_x005F_" for a
// literal "_", so text that merely looks like such an escape comes back as it was.
const xmlEscapeLookalike = (value: string | number) =>
  typeof value === "string" ? value.replace(/_(?=x[0-9a-f]{4}_)/gi, "_x005F_") : value;

export function workbookBytes(sheetName: string, rows: (string | number)[][]): Buffer {
  const sheet = XLSX.utils.aoa_to_sheet(rows.map((r) => r.map((v) => xmlEscapeLookalike(safeCell(v)))));
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, sheet, sheetName.slice(0, 31));
  return XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
}

export function csvText(rows: (string | number)[][]): string {
  const cell = (v: string | number) => {
    const s = String(safeCell(v));
    // Quoted separators are not counted when a reader guesses which one a file uses.
    return /[",;|\t\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return rows.map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}

export function downloadResponse(body: Buffer | string, filename: string, kind: "xlsx" | "csv"): Response {
  const type =
    kind === "xlsx" ? "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" : "text/csv; charset=utf-8";
  return new Response(typeof body === "string" ? body : new Uint8Array(body), {
    headers: {
      "content-type": type,
      "content-disposition": `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, "_")}"`,
      "cache-control": "no-store",
    },
  });
}
