import { HttpError } from "./errors";

/** The 400 for a sheet with bad rows: every row problem goes back, and nothing was written. */
export function rowsNeedFixing(n: number, nothing: string, rows: unknown[]): HttpError {
  return new HttpError(
    400,
    `${n} row${n === 1 ? "" : "s"} of the sheet need${n === 1 ? "s" : ""} fixing; ${nothing}.`,
    { rows },
  );
}
