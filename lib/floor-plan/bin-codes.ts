import type { DrawingBin, CellRef } from "@/lib/routing/drawing";
import type { RackRun } from "./document";

export interface BinPosition {
  aisle: number;
  bay: number;
  level: number;
}

/** A bin as the editor lists it: the engine's bin plus the rack run it belongs to. */
export interface RunBin extends DrawingBin {
  runId: string;
}

/** Longest location code the database stores (layout_bins.code is VARCHAR(32)). */
export const MAX_CODE_LENGTH = 32;

const PLACEHOLDER = /\{(aisle|bay|level)(?::(\d))?\}/g;

/** Fills a location code pattern such as "{aisle:2}-{bay:3}-{level}"; ":n" pads with zeros to n digits. */
export function formatCode(pattern: string, p: BinPosition): string {
  return pattern.replace(PLACEHOLDER, (_all, name: "aisle" | "bay" | "level", width: string | undefined) =>
    String(p[name]).padStart(width ? Number(width) : 0, "0"),
  );
}

/** The rack cells of a run, in increasing x (horizontal) or y (vertical). */
export function rackRunCells(run: Pick<RackRun, "x" | "y" | "orientation" | "length">): CellRef[] {
  const cells: CellRef[] = [];
  for (let i = 0; i < run.length; i++) {
    cells.push(run.orientation === "h" ? { x: run.x + i, y: run.y } : { x: run.x, y: run.y + i });
  }
  return cells;
}

/** Bay number of the i-th cell of a run (counted in increasing x or y). */
export function bayAt(run: Pick<RackRun, "length" | "firstBay" | "bayStep" | "bayDirection">, i: number): number {
  const k = run.bayDirection === "forward" ? i : run.length - 1 - i;
  return run.firstBay + k * run.bayStep;
}

/** Lowest and highest bay numbers of a run. */
export function bayRange(run: Pick<RackRun, "length" | "firstBay" | "bayStep">): [number, number] {
  return [run.firstBay, run.firstBay + (run.length - 1) * run.bayStep];
}

function customKey(bay: number, level: number): string {
  return `${bay}:${level}`;
}

/** Every bin of a run: cell by cell along the run, level 1 upwards; custom codes replace the pattern's. */
export function rackRunBins(run: RackRun): RunBin[] {
  const custom = new Map(run.customCodes.map((c) => [customKey(c.bay, c.level), c.code]));
  const bins: RunBin[] = [];
  rackRunCells(run).forEach((cell, i) => {
    const bay = bayAt(run, i);
    for (let level = 1; level <= run.levels; level++) {
      const code = custom.get(customKey(bay, level)) ?? formatCode(run.pattern, { aisle: run.aisle, bay, level });
      bins.push({ code, aisle: run.aisle, bay, level, x: cell.x, y: cell.y, runId: run.id });
    }
  });
  return bins;
}

/** The bins of every run of a document, in run order. */
export function documentBins(doc: { rackRuns: RackRun[] }): RunBin[] {
  return doc.rackRuns.flatMap(rackRunBins);
}

/** Custom codes naming a bay or level the run does not have (left over after the run was shortened). */
export function unusedCustomCodes(run: RackRun): RackRun["customCodes"] {
  const bays = new Set(rackRunCells(run).map((_c, i) => bayAt(run, i)));
  return run.customCodes.filter((c) => !bays.has(c.bay) || c.level > run.levels);
}
