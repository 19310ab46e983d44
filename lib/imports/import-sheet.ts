import "server-only";
import { rowsNeedFixing } from "@/lib/http/sheet-rows";
import type { SignedInUser } from "@/lib/auth/session";
import { analyseImport } from "./analyse";
import { alreadyImported, commitImport } from "./commit";
import type { AlreadyImported, ImportCounts } from "@/lib/contracts/imports";
import type { ImportRequest } from "./request";

/**
 * Checks the file exactly as the preview does, then writes it in one transaction or not at all; a
 * sheet with bad rows is refused whole. `created` is false when nothing new was written.
 */
export async function importSheet(
  user: SignedInUser,
  input: ImportRequest,
): Promise<{ result: { counts: ImportCounts } | AlreadyImported; created: boolean }> {
  const analysis = await analyseImport(user.siteId, input);
  // A repeated submit of the same order lines (a retry on flaky Wi-Fi) answers like the first did.
  if (input.kind === "orders" && analysis.duplicate)
    return { result: await alreadyImported(analysis.duplicate), created: false };
  if (analysis.problems.length)
    throw rowsNeedFixing(new Set(analysis.problems.map((p) => p.row)).size, "nothing was imported", analysis.problems);
  const result = await commitImport(user.siteId, user.id, input, analysis);
  return { result, created: !("alreadyImported" in result) };
}
