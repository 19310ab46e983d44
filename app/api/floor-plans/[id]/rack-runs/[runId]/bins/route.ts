import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam, textParam } from "@/lib/http/params";
import { uploadedFile } from "@/lib/http/upload";
import { getDraft } from "@/db/floor-plans";
import { readSheet, SheetError, MAX_UPLOAD_BYTES } from "@/lib/sheets/read";
import { csvText, downloadResponse, workbookBytes } from "@/lib/sheets/write";
import { binSheetRows, parseBinSheet } from "@/lib/layout-versions/rack-run-bins";
import type { SignedInUser } from "@/lib/auth/session";

const Params = z.object({ id: idParam("floor plan"), runId: textParam() });

async function runOfDraft(user: SignedInUser, { id, runId }: z.output<typeof Params>) {
  const draft = await getDraft(user.siteId, id);
  if (!draft) throw new HttpError(404, "No such floor plan at this site.");
  const run = draft.document.rackRuns.find((r) => r.id === runId);
  if (!run) throw new HttpError(404, `The saved draft has no rack run ${runId}. Save the draft first, then try again.`);
  return { draft, run };
}

export const GET = route({ access: "floorplans.read", params: Params }, async ({ user, params, req }) => {
  const { run } = await runOfDraft(user, params);
  const format = new URL(req.url).searchParams.get("format") === "csv" ? "csv" : "xlsx";
  const rows = binSheetRows(run);
  const name = `bins-aisle-${run.aisle}-${run.id}.${format}`;
  return format === "csv"
    ? downloadResponse(csvText(rows), name, "csv")
    : downloadResponse(workbookBytes("Bins", rows), name, "xlsx");
});

// Reads and checks the sheet; the editor applies the codes as an (undoable) edit and saves the draft.
export const POST = route({ access: "floorplans.edit", params: Params }, async ({ user, params, req }) => {
  const { draft, run } = await runOfDraft(user, params);
  const bytes = await uploadedFile(req, MAX_UPLOAD_BYTES, "spreadsheet");
  let rows: string[][];
  try {
    rows = (await readSheet(bytes)).rows;
  } catch (e) {
    if (e instanceof SheetError) throw new HttpError(e.status, e.message);
    throw e;
  }
  return Response.json({ customCodes: parseBinSheet(draft.document, run, rows) });
});
