import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { intParam, stringParam } from "@/lib/http/params";
import { uploadedFile } from "@/lib/http/upload";
import { getDraft } from "@/db/floor-plans";
import { readSheet, SheetError, MAX_UPLOAD_BYTES } from "@/lib/sheets/read";
import { csvText, downloadResponse, workbookBytes } from "@/lib/sheets/write";
import { binSheetRows, parseBinSheet } from "@/lib/layout-versions/rack-run-bins";
import type { SignedInUser } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

async function runOfDraft(user: SignedInUser, params: Record<string, string | string[] | undefined>) {
  const draft = await getDraft(user.siteId, intParam(params, "id", "floor plan"));
  if (!draft) throw new HttpError(404, "No such floor plan at this site.");
  const runId = stringParam(params, "runId");
  const run = draft.document.rackRuns.find((r) => r.id === runId);
  if (!run) throw new HttpError(404, `The saved draft has no rack run ${runId}. Save the draft first, then try again.`);
  return { draft, run };
}

export const GET = route({ access: "floorplans.read" }, async ({ user, params, req }) => {
  const { run } = await runOfDraft(user, params);
  const format = new URL(req.url).searchParams.get("format") === "csv" ? "csv" : "xlsx";
  const rows = binSheetRows(run);
  const name = `bins-aisle-${run.aisle}-${run.id}.${format}`;
  return format === "csv" ? downloadResponse(csvText(rows), name, "csv") : downloadResponse(workbookBytes("Bins", rows), name, "xlsx");
});

// Reads and checks the sheet; the editor applies the codes as an (undoable) edit and saves the draft.
export const POST = route({ access: "floorplans.edit" }, async ({ user, params, req }) => {
  const { draft, run } = await runOfDraft(user, params);
  const bytes = await uploadedFile(req, MAX_UPLOAD_BYTES, "spreadsheet");
  let rows: string[][];
  try {
    rows = (await readSheet(bytes)).rows;
  } catch (e) {
    if (e instanceof SheetError) throw new HttpError(e.status, e.message);
    throw e;
  }
  const parsed = parseBinSheet(draft.document, run, rows);
  if (!parsed.ok) {
    const n = parsed.problems.length;
    return Response.json({ error: `${n} row${n === 1 ? "" : "s"} of the sheet need${n === 1 ? "s" : ""} fixing; nothing was changed.`, rows: parsed.problems }, { status: 400 });
  }
  return Response.json({ customCodes: parsed.customCodes });
});
