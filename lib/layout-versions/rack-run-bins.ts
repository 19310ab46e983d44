import "server-only";
import type { EditorDocument, RackRun } from "@/lib/floor-plan/document";
import { rackRunSchema } from "@/lib/floor-plan/document";
import { bayAt, documentBins, formatCode, rackRunBins, rackRunCells } from "@/lib/floor-plan/bin-codes";
import { cellOf, mapColumns, type RowProblem } from "@/lib/sheets/columns";
import { rowsNeedFixing } from "@/lib/http/sheet-rows";

export const BIN_SHEET_HEADER = ["Location code", "Aisle", "Bay", "Level"] as const;

export function binSheetRows(run: RackRun): (string | number)[][] {
  return [[...BIN_SHEET_HEADER], ...rackRunBins(run).map((b) => [b.code, b.aisle, b.bay, b.level])];
}

const codeRule = rackRunSchema.shape.customCodes.element.shape.code;

/**
 * A sheet of (code, bay, level) rows → the run's custom codes. Every bad row is reported with its
 * sheet row number in a 400; nothing is returned unless every row is good.
 */
export function parseBinSheet(doc: EditorDocument, run: RackRun, rows: string[][]): RackRun["customCodes"] {
  const refuse = (problems: RowProblem[]) => rowsNeedFixing(problems.length, "nothing was changed", problems);
  const [header, ...body] = rows;
  if (!header)
    throw refuse([{ row: 1, message: "The sheet is empty: it needs a header row with Location code, Bay and Level." }]);
  const { columns, problems } = mapColumns(
    header,
    { code: ["Location code", "code", "bin", "location"], bay: ["Bay"], level: ["Level"] },
    ["code", "bay", "level"],
  );
  if (problems.length) throw refuse(problems);
  const bays = new Set(rackRunCells(run).map((_c, i) => bayAt(run, i)));
  const otherCodes = new Set(
    documentBins(doc)
      .filter((b) => b.runId !== run.id)
      .map((b) => b.code),
  );
  const seenCodes = new Map<string, number>();
  const seenSlots = new Map<string, number>();
  const customCodes: RackRun["customCodes"] = [];
  body.forEach((r, i) => {
    const row = i + 2;
    if (r.every((c) => c.trim() === "")) return;
    const code = cellOf(r, columns, "code");
    const bay = Number(cellOf(r, columns, "bay"));
    const level = Number(cellOf(r, columns, "level"));
    const fail = (message: string) => problems.push({ row, message });
    if (!Number.isInteger(bay) || !bays.has(bay))
      return fail(
        `Bay “${cellOf(r, columns, "bay")}” is not a bay of this rack run (bays ${[...bays].sort((a, b) => a - b).join(", ")}).`,
      );
    if (!Number.isInteger(level) || level < 1 || level > run.levels)
      return fail(`Level “${cellOf(r, columns, "level")}” is not between 1 and ${run.levels}.`);
    const checked = codeRule.safeParse(code);
    if (!checked.success)
      return fail(code ? `Code “${code}”: ${checked.error.issues[0]?.message}` : "The location code is empty.");
    const slot = `${bay}:${level}`;
    if (seenSlots.has(slot))
      return fail(`Bay ${bay} level ${level} is listed twice (first on row ${seenSlots.get(slot)}).`);
    if (seenCodes.has(code)) return fail(`Code ${code} is used twice (first on row ${seenCodes.get(code)}).`);
    if (otherCodes.has(code)) return fail(`Code ${code} already belongs to a bin of another rack run.`);
    seenSlots.set(slot, row);
    seenCodes.set(code, row);
    if (code !== formatCode(run.pattern, { aisle: run.aisle, bay, level })) customCodes.push({ bay, level, code });
  });
  if (problems.length) throw refuse(problems);
  return customCodes;
}
