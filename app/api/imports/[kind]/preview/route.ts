import { route } from "@/lib/http/route";
import { analyseImport } from "@/lib/imports/analyse";
import { kindOf, readImportRequest } from "@/lib/imports/request";

// Writes nothing: the headers, the mapping in use, the first rows and every row problem.
export const POST = route({ access: "waves.plan" }, async ({ user, params, req }) => {
  const kind = kindOf(params);
  const a = await analyseImport(user.siteId, await readImportRequest(req, kind));
  const duplicate = a.duplicate ? { importedAt: a.duplicate.importedAt, filename: a.duplicate.filename } : null;
  return Response.json({
    headers: a.headers,
    mapping: a.mapping,
    fields: a.fields,
    preview: a.preview,
    problems: a.problems,
    counts: a.counts,
    duplicate,
  });
});
