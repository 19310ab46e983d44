import { route } from "@/lib/http/route";
import { analyseImport } from "@/lib/imports/analyse";
import { alreadyImported, commitImport } from "@/lib/imports/commit";
import { kindOf, readImportRequest } from "@/lib/imports/request";

export const dynamic = "force-dynamic";

// Checks the file exactly as the preview does, then writes it in one transaction or not at all.
export const POST = route({ access: "waves.plan" }, async ({ user, params, req }) => {
  const kind = kindOf(params);
  const input = await readImportRequest(req, kind);
  const analysis = await analyseImport(user.siteId, input);
  // A repeated submit of the same order lines (a retry on flaky Wi-Fi) answers like the first did.
  if (kind === "orders" && analysis.duplicate) return Response.json(await alreadyImported(analysis.duplicate));
  if (analysis.problems.length) {
    const n = new Set(analysis.problems.map((p) => p.row)).size;
    return Response.json({ error: `${n} row${n === 1 ? "" : "s"} of the sheet need${n === 1 ? "s" : ""} fixing; nothing was imported.`, rows: analysis.problems }, { status: 400 });
  }
  const result = await commitImport(user.siteId, user.id, input, analysis);
  return Response.json(result, { status: "alreadyImported" in result ? 200 : 201 });
});
