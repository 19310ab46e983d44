import type { z } from "zod";

export type FieldIssue = { path: string; message: string };

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join(".") || "(body)", message: i.message }));
}
