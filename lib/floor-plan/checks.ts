import { binAccessCell, type GridDrawing } from "@/lib/routing/drawing";
import type { EditorDocument, RackRun } from "./document";
import { bayAt, MAX_CODE_LENGTH, rackRunBins, rackRunCells, unusedCustomCodes } from "./bin-codes";
import { toGridDrawing } from "./to-drawing";
import { connectedTo, groupsOf, reachableFrom, reachingTo } from "./reachability";
import { engineOnlyProblems, graphSizeProblems } from "./engine-checks";
import type { Problem } from "./problems";

export { hasErrors, type Problem, type ProblemKind } from "./problems";

/**
 * Live checks of a floor plan. Pure, and linear in the cell count apart from one search per
 * depot, so it runs on every edit and on the server before publishing.
 */
export function checkDocument(doc: EditorDocument): Problem[] {
  const d = toGridDrawing(doc);
  const problems: Problem[] = [
    ...idProblems(doc),
    ...pointProblems(doc, d),
    ...overlapProblems(doc),
    ...codeProblems(doc),
    ...codeLengthProblems(doc),
    ...faceProblems(doc, d),
    ...walkProblems(doc, d),
    ...markProblems(doc, d),
  ];
  for (const run of doc.rackRuns) {
    const unused = unusedCustomCodes(run);
    if (unused.length > 0) {
      problems.push({
        kind: "custom-code-unused",
        severity: "warning",
        runId: run.id,
        cells: runCells(doc, run),
        message: `${runName(run)} has ${count(unused.length, "imported code")} for bays or levels it no longer has (${unused
          .slice(0, 3)
          .map((c) => c.code)
          .join(", ")}${unused.length > 3 ? ", …" : ""}). Import its bins again or ignore them.`,
      });
    }
  }
  if (doc.rackRuns.length === 0) {
    problems.push({
      kind: "no-bins",
      severity: "warning",
      cells: [],
      message: "There are no rack runs yet, so there is nothing to pick. Draw rack runs with the rack run tool.",
    });
  }
  problems.push(...engineOnlyProblems(d, problems), ...graphSizeProblems(d));
  // Errors first; otherwise the order the checks found them, so the list does not jump while editing.
  return [...problems.filter((p) => p.severity === "error"), ...problems.filter((p) => p.severity === "warning")];
}

function idProblems(doc: EditorDocument): Problem[] {
  const out: Problem[] = [];
  const runIds = new Set<string>();
  for (const run of doc.rackRuns) {
    if (runIds.has(run.id))
      out.push({
        kind: "duplicate-id",
        severity: "error",
        runId: run.id,
        cells: runCells(doc, run),
        message: `Two rack runs share the id “${run.id}”. Delete one of them and draw it again.`,
      });
    runIds.add(run.id);
  }
  // Batches name their depot and drop-off by id, and a drop-off may be a depot, so the ids share one namespace.
  const pointIds = new Set<string>();
  for (const p of [...doc.depots, ...doc.dropoffs]) {
    if (pointIds.has(p.id))
      out.push({
        kind: "duplicate-id",
        severity: "error",
        cells: [cellOf(doc, p.x, p.y)],
        message: `Two depots or drop-offs share the id “${p.id}”. Delete one and place it again.`,
      });
    pointIds.add(p.id);
  }
  return out;
}

function pointProblems(doc: EditorDocument, d: GridDrawing): Problem[] {
  const out: Problem[] = [];
  if (doc.depots.length === 0)
    out.push({
      kind: "no-depot",
      severity: "error",
      cells: [],
      message: "There is no depot. Place one with the depot tool where pickers collect their carts.",
    });
  if (doc.dropoffs.length === 0)
    out.push({
      kind: "no-dropoff",
      severity: "error",
      cells: [],
      message: "There is no drop-off. Place one with the drop-off tool where carts are taken for packing.",
    });
  const check = (p: EditorDocument["depots"][number], what: string) => {
    const c = cellOf(doc, p.x, p.y);
    if (d.cells[c] !== "floor") {
      out.push({
        kind: "point-not-on-floor",
        severity: "error",
        cells: [c],
        message: `The ${what} “${p.name}” ${where(doc, c)} is not on walkable floor. Move it onto the floor or paint floor under it.`,
      });
    }
  };
  for (const p of doc.depots) check(p, "depot");
  for (const p of doc.dropoffs) check(p, "drop-off");
  return out;
}

function overlapProblems(doc: EditorDocument): Problem[] {
  const owner = new Map<number, RackRun>();
  const pairs = new Map<string, { a: RackRun; b: RackRun; cells: number[] }>();
  for (const run of doc.rackRuns) {
    for (const c of runCells(doc, run)) {
      const other = owner.get(c);
      if (!other) {
        owner.set(c, run);
        continue;
      }
      const key = `${other.id}\u0000${run.id}`;
      const pair = pairs.get(key) ?? { a: other, b: run, cells: [] };
      pair.cells.push(c);
      pairs.set(key, pair);
    }
  }
  return [...pairs.values()].map(({ a, b, cells }) => ({
    kind: "rack-overlap" as const,
    severity: "error" as const,
    runId: b.id,
    cells,
    message: `${runName(b)} overlaps ${runName(a, false)} on ${count(cells.length, "cell")} ${where(doc, cells[0] as number)}. Move or shorten one of them.`,
  }));
}

function codeProblems(doc: EditorDocument): Problem[] {
  const seen = new Map<string, { runId: string; cell: number }>();
  const groups = new Map<string, { runs: string[]; codes: string[]; cells: Set<number> }>();
  for (const run of doc.rackRuns) {
    for (const bin of rackRunBins(run)) {
      const cell = cellOf(doc, bin.x, bin.y);
      const first = seen.get(bin.code);
      if (!first) {
        seen.set(bin.code, { runId: run.id, cell });
        continue;
      }
      // Grouped by the pair of runs, so two runs numbered alike give one problem, not hundreds.
      const runs = first.runId === run.id ? [run.id] : [first.runId, run.id];
      const key = runs.join("\u0000");
      const g = groups.get(key) ?? { runs, codes: [], cells: new Set<number>() };
      g.codes.push(bin.code);
      g.cells.add(first.cell);
      g.cells.add(cell);
      groups.set(key, g);
    }
  }
  const byId = new Map(doc.rackRuns.map((r) => [r.id, r]));
  return [...groups.values()].map((g) => {
    const names = g.runs.map((id, i) => runName(byId.get(id) as RackRun, i === 0));
    const sample = g.codes.slice(0, 3).join(", ") + (g.codes.length > 3 ? ", …" : "");
    const whose =
      names.length === 1
        ? `${names[0]} gives the same location code twice`
        : `${names[0]} and ${names[1]} give the same location codes`;
    return {
      kind: "duplicate-code" as const,
      severity: "error" as const,
      runId: g.runs[g.runs.length - 1],
      cells: [...g.cells].sort((a, b) => a - b),
      message: `${whose} (${count(g.codes.length, "code")}: ${sample}). Change the aisle, first bay or pattern so every bin has its own code.`,
    };
  });
}

function codeLengthProblems(doc: EditorDocument): Problem[] {
  const out: Problem[] = [];
  for (const run of doc.rackRuns) {
    const long = rackRunBins(run).filter((b) => b.code.length > MAX_CODE_LENGTH);
    if (long.length === 0) continue;
    const longest = long.reduce((a, b) => (b.code.length > a.code.length ? b : a));
    out.push({
      kind: "code-too-long",
      severity: "error",
      runId: run.id,
      cells: [...new Set(long.map((b) => cellOf(doc, b.x, b.y)))],
      message: `${runName(run)}: the location code pattern “${run.pattern}” makes ${count(long.length, "code")} longer than ${MAX_CODE_LENGTH} characters, such as “${longest.code}” (${longest.code.length}); a location code may have at most ${MAX_CODE_LENGTH}. Shorten the pattern's text or its zero padding (the 3 in {bay:3}).`,
    });
  }
  return out;
}

function faceProblems(doc: EditorDocument, d: GridDrawing): Problem[] {
  const out: Problem[] = [];
  for (const run of doc.rackRuns) {
    const cells = rackRunCells(run);
    const blind = cells.map((c, i) => ({ c, i })).filter(({ c }) => binAccessCell(d, c) === null);
    if (blind.length === 0) continue;
    out.push({
      kind: "bin-unreachable",
      severity: "error",
      runId: run.id,
      cells: blind.map(({ c }) => cellOf(doc, c.x, c.y)),
      message: `${runName(run)}: ${bayList(
        run,
        blind.map((b) => b.i),
      )} open${blind.length === 1 ? "s" : ""} onto no walkable floor on the ${sideName(run.facing)} side. Paint floor in front of ${blind.length === 1 ? "it" : "them"} or turn the run to face the aisle.`,
    });
  }
  return out;
}

function walkProblems(doc: EditorDocument, d: GridDrawing): Problem[] {
  const out: Problem[] = [];
  const onFloor = (p: { x: number; y: number }) => d.cells[cellOf(doc, p.x, p.y)] === "floor";
  const depots = doc.depots.filter(onFloor);
  const dropoffs = doc.dropoffs.filter(onFloor);
  if (depots.length === 0 && dropoffs.length === 0) return out;
  const depotCells = depots.map((p) => cellOf(doc, p.x, p.y));
  const dropCells = dropoffs.map((p) => cellOf(doc, p.x, p.y));
  // Ignoring one-way marks tells floor that is walled off from floor that the marks close off.
  const nearDepot = connectedTo(d, depotCells);
  const nearDrop = connectedTo(d, dropCells);
  for (const group of groupsOf(d, (c) => !nearDepot[c] && !nearDrop[c])) {
    out.push({
      kind: "floor-cut-off",
      severity: "warning",
      cells: group,
      message: `${count(group.length, "floor cell")} ${where(doc, group[0] as number)} ${group.length === 1 ? "is" : "are"} cut off from the depot and drop-off. Open a way to them, or paint them blocked if nobody walks there.`,
    });
  }
  if (depots.length === 0 || dropoffs.length === 0) return out;

  const fromDepot = reachableFrom(d, depotCells);
  const toDropoff = reachingTo(d, dropCells);
  for (const depot of depots) {
    const reach = depots.length === 1 ? fromDepot : reachableFrom(d, [cellOf(doc, depot.x, depot.y)]);
    const joined = depots.length === 1 ? nearDepot : connectedTo(d, [cellOf(doc, depot.x, depot.y)]);
    // A depot that reaches some drop-off still serves batches that end there, so a missing pair only warns.
    const reachesAny = dropoffs.some((p) => reach[cellOf(doc, p.x, p.y)]);
    for (const drop of dropoffs) {
      const c = cellOf(doc, drop.x, drop.y);
      if (reach[c]) continue;
      const fix = joined[c]
        ? "One-way marks block every way between them: turn or remove a mark."
        : "Connect them with walkable floor.";
      out.push({
        kind: "no-path",
        severity: reachesAny ? "warning" : "error",
        cells: [cellOf(doc, depot.x, depot.y), c],
        message: `There is no walk from the depot “${depot.name}” to the drop-off “${drop.name}”. ${fix}`,
      });
    }
  }

  for (const group of groupsOf(d, (c) => !!nearDepot[c] && !!nearDrop[c] && !(fromDepot[c] && toDropoff[c]))) {
    const trapped = group.some((c) => fromDepot[c]);
    const closed = group.some((c) => toDropoff[c]);
    const what =
      trapped && !closed
        ? "can be walked into but have no way back to a drop-off"
        : closed && !trapped
          ? "cannot be entered from a depot"
          : "cannot be entered from a depot nor left towards a drop-off";
    out.push({
      kind: "one-way-trap",
      severity: "error",
      cells: group,
      message: `One-way marks cut off ${count(group.length, "floor cell")} ${where(doc, group[0] as number)}: they ${what}. Turn or remove a one-way mark so the aisle leads back to a cross-aisle.`,
    });
  }

  for (const run of doc.rackRuns) {
    const cut = rackRunCells(run)
      .map((c, i) => ({ c, i, access: binAccessCell(d, c) }))
      .filter(
        ({ access }) =>
          access !== null &&
          !(fromDepot[cellOf(doc, access.x, access.y)] && toDropoff[cellOf(doc, access.x, access.y)]),
      );
    if (cut.length === 0) continue;
    out.push({
      kind: "bin-unreachable",
      severity: "error",
      runId: run.id,
      cells: cut.map(({ c }) => cellOf(doc, c.x, c.y)),
      message: `${runName(run)}: ${bayList(
        run,
        cut.map((b) => b.i),
      )} cannot be reached on a walk from a depot to a drop-off. Connect the floor in front of ${cut.length === 1 ? "it" : "them"} to the aisles.`,
    });
  }
  return out;
}

function markProblems(doc: EditorDocument, d: GridDrawing): Problem[] {
  const stray = doc.oneWay.filter((m) => d.cells[m.cell] !== "floor").map((m) => m.cell);
  if (stray.length === 0) return [];
  return [
    {
      kind: "one-way-off-floor",
      severity: "warning",
      cells: stray,
      message: `${count(stray.length, "one-way mark")} ${stray.length === 1 ? "lies" : "lie"} on rack or blocked cells and ${stray.length === 1 ? "is" : "are"} ignored. Remove ${stray.length === 1 ? "it" : "them"} with the one-way tool.`,
    },
  ];
}

function cellOf(doc: Pick<EditorDocument, "width">, x: number, y: number): number {
  return y * doc.width + x;
}

function runCells(doc: EditorDocument, run: RackRun): number[] {
  return rackRunCells(run).map((c) => cellOf(doc, c.x, c.y));
}

export function runName(run: Pick<RackRun, "id" | "aisle">, capital = true): string {
  return `${capital ? "R" : "r"}ack run ${run.id} (aisle ${run.aisle})`;
}

function bayList(run: RackRun, indices: number[]): string {
  const bays = indices.map((i) => bayAt(run, i)).sort((a, b) => a - b);
  const shown = bays.slice(0, 6).join(", ") + (bays.length > 6 ? `, … (${bays.length} bays)` : "");
  return `${bays.length === 1 ? "bay" : "bays"} ${shown}`;
}

function sideName(s: RackRun["facing"]): string {
  return { N: "north", E: "east", S: "south", W: "west" }[s];
}

function count(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? "" : "s"}`;
}

/** Where a cell is, in the metres the editor's rulers show (from the top-left corner). */
export function where(doc: Pick<EditorDocument, "width" | "cellMm">, cell: number): string {
  const x = cell % doc.width;
  const y = (cell - x) / doc.width;
  const m = (v: number) => String(Math.round((v * doc.cellMm) / 100) / 10);
  return `near ${m(x)} m across, ${m(y)} m down`;
}
