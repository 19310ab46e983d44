import { describe, expect, it } from "vitest";
import { z } from "zod";
import { zodIssues } from "@/lib/http/zod-issues";
import { rowVersion } from "@/lib/http/body-fields";

const issues = (schema: z.ZodType, input: unknown) => {
  const r = schema.safeParse(input);
  if (r.success) throw new Error("expected a refusal");
  return Object.fromEntries(zodIssues(r.error).map((i) => [i.path, i.message]));
};

describe("zod's messages in words a person can act on", () => {
  const schema = z.object({
    name: z.string().min(1).max(3),
    count: z.number().int().min(1).max(40),
    kind: z.enum(["first-come", "savings"]),
    at: z.iso.datetime(),
    email: z.string().email(),
    list: z.array(z.number()).min(1),
  });
  it("says what is missing and what kind of value a field takes", () => {
    expect(issues(schema, {})).toMatchObject({ name: "This is missing.", count: "This is missing." });
    expect(issues(schema, { name: 5, count: "3", list: {} })).toMatchObject({
      name: "Give text here.",
      count: "Give a number here.",
      list: "Give a list here.",
    });
    expect(issues(schema, { count: 1.5 })).toMatchObject({ count: "Give a whole number here." });
  });
  it("states limits, choices and formats", () => {
    expect(issues(schema, { name: "", count: 41, kind: "x", at: "tomorrow", email: "a@", list: [] })).toEqual({
      name: "This cannot be empty.",
      count: "At most 40.",
      kind: "Choose one of: first-come, savings.",
      at: "Give a date and time like 2026-12-01T14:00:00Z.",
      email: "Enter a valid e-mail address.",
      list: "Give at least one.",
    });
    expect(issues(schema, { name: "abcd" }).name).toBe("At most 3 characters.");
  });
  it("keeps a message the schema sets itself", () => {
    expect(issues(z.object({ version: rowVersion() }), { version: 2 ** 31 })).toEqual({
      version: "Reload the page: that is not a version Trailbin gave out.",
    });
    expect(issues(z.string().min(12, "Use at least 12 characters."), "short")).toEqual({
      "(body)": "Use at least 12 characters.",
    });
  });
});
