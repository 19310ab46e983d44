import type { z } from "zod";

export type FieldIssue = { path: string; message: string };

type Issue = z.core.$ZodIssue;

const TYPE_WORDS: Record<string, string> = {
  number: "a number",
  int: "a whole number",
  string: "text",
  boolean: "true or false",
  array: "a list",
  object: "a group of fields",
};

const things = (origin: unknown) => (origin === "string" ? "characters" : origin === "array" ? "entries" : "");

/**
 * zod's own English messages ("Invalid input: expected number, received undefined") in words a
 * person can act on. Messages a schema sets itself are kept as they are.
 */
function plainMessage(i: Issue): string {
  if (!/^(Invalid|Too big:|Too small:|Unrecognized)/.test(i.message)) return i.message;
  switch (i.code) {
    case "invalid_type":
      if (/received undefined$/.test(i.message)) return "This is missing.";
      return `Give ${TYPE_WORDS[i.expected] ?? "another kind of value"} here.`;
    case "too_big": {
      const unit = things(i.origin);
      if (i.origin === "int" || i.origin === "number" || i.origin === "bigint")
        return `At most ${Number(i.maximum).toLocaleString("en")}.`;
      return `At most ${Number(i.maximum).toLocaleString("en")} ${unit || "items"}.`;
    }
    case "too_small": {
      const unit = things(i.origin);
      if (i.origin === "string" && Number(i.minimum) === 1) return "This cannot be empty.";
      if (i.origin === "array" && Number(i.minimum) === 1) return "Give at least one.";
      if (unit) return `At least ${Number(i.minimum).toLocaleString("en")} ${unit}.`;
      return i.inclusive
        ? `At least ${Number(i.minimum).toLocaleString("en")}.`
        : `More than ${Number(i.minimum).toLocaleString("en")}.`;
    }
    case "invalid_format":
      if (i.format === "email") return "Enter a valid e-mail address.";
      if (i.format === "datetime") return "Give a date and time like 2026-12-01T14:00:00Z.";
      return "This has characters that are not allowed here.";
    case "invalid_value":
      return i.values.length <= 6
        ? `Choose one of: ${i.values.map(String).join(", ")}.`
        : "Choose one of the offered values.";
    case "unrecognized_keys":
      return `Unknown field${i.keys.length === 1 ? "" : "s"}: ${i.keys.slice(0, 5).join(", ")}.`;
    default:
      return "This value is not accepted here.";
  }
}

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({
    path: i.path.map(String).join(".") || "(body)",
    message: plainMessage(i as Issue),
  }));
}
