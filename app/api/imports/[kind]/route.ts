import { route } from "@/lib/http/route";
import { importSheet } from "@/lib/imports/import-sheet";
import { kindOf, readImportRequest } from "@/lib/imports/request";

export const POST = route({ access: "waves.plan" }, async ({ user, params, req }) => {
  const { result, created } = await importSheet(user, await readImportRequest(req, kindOf(params)));
  return Response.json(result, { status: created ? 201 : 200 });
});
