import { HttpError } from "./errors";

type Params = Record<string, string | string[] | undefined>;

/** A positive whole number from the URL, or a 404: a mangled link points at nothing. */
export function intParam(params: Params, name: string, what: string): number {
  const raw = params[name];
  const n = typeof raw === "string" && /^\d{1,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(n) || n < 1) throw new HttpError(404, `No such ${what}. Check the link or go back to the list.`);
  return n;
}

export function stringParam(params: Params, name: string): string {
  const raw = params[name];
  return typeof raw === "string" ? raw : "";
}
