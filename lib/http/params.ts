import { z } from "zod";

const noSuch = (what: string) => `No such ${what}. Check the link or go back to the list.`;

// A record's id in a URL: at most nine digits, so it always fits the INT columns ids live in.
const ID_PATTERN = /^\d{1,9}$/;

/** The id of a stored record in the URL as a number, or null when the text cannot be one. */
export function parseId(raw: unknown): number | null {
  const n = typeof raw === "string" && ID_PATTERN.test(raw) ? Number(raw) : NaN;
  return Number.isSafeInteger(n) && n >= 1 ? n : null;
}

/** A route param naming a stored record, for `route({ params: z.object({ id: idParam("wave") }) })`: a mangled link points at nothing (404). */
export const idParam = (what: string) =>
  z
    .unknown()
    .optional()
    .transform((raw, ctx) => {
      const id = parseId(raw);
      if (id === null) {
        ctx.addIssue({ code: "custom", message: noSuch(what) });
        return z.NEVER;
      }
      return id;
    });

/** A route param as text ("" when absent), for `route({ params })`. */
export const textParam = () =>
  z
    .unknown()
    .optional()
    .transform((raw) => (typeof raw === "string" ? raw : ""));
