// What the floor plan checks report, apart from the checks themselves: checks.ts and engine-checks.ts
// both build problems, and the editor panels only show them.

export type ProblemKind =
  | "no-depot"
  | "no-dropoff"
  | "point-not-on-floor"
  | "duplicate-id"
  | "rack-overlap"
  | "duplicate-code"
  | "code-too-long"
  | "too-many-junctions"
  | "bin-unreachable"
  | "no-path"
  | "one-way-trap"
  | "floor-cut-off"
  | "one-way-off-floor"
  | "custom-code-unused"
  | "no-bins";

export interface Problem {
  kind: ProblemKind;
  /** A sentence a person can act on. */
  message: string;
  /** Cells (row-major) to highlight and zoom to; may be empty for whole-document problems. */
  cells: number[];
  /** Errors block publishing; warnings do not. */
  severity: "error" | "warning";
  /** The rack run the problem is about, so the editor can select it. */
  runId?: string;
}

/** Whether any problem blocks publishing. */
export function hasErrors(problems: readonly Problem[]): boolean {
  return problems.some((p) => p.severity === "error");
}
