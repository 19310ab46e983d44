import { route } from "@/lib/http/route";
import { kindOf } from "@/lib/imports/request";
import { templateHeader, templateWorkbook } from "@/lib/imports/template";
import { csvText, downloadResponse } from "@/lib/sheets/write";

export const GET = route({ access: "waves.plan" }, async ({ params, req }) => {
  const kind = kindOf(params);
  const name = kind === "items" ? "item-master-template" : "order-lines-template";
  if (new URL(req.url).searchParams.get("format") === "csv")
    return downloadResponse(csvText([templateHeader(kind)]), `${name}.csv`, "csv");
  return downloadResponse(templateWorkbook(kind), `${name}.xlsx`, "xlsx");
});
