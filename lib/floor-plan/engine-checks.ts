import { validateDrawing, type DrawingIssue, type IssueCode } from "@/lib/routing/diagnostics";
import type { GridDrawing } from "@/lib/routing/drawing";
import { junctionCount } from "@/lib/routing/build-graph";
import { MAX_JUNCTIONS } from "@/lib/routing/limits";
import type { Problem, ProblemKind } from "./problems";

/** Problems that leave no walk at all from a depot to a drop-off, so every bin and floor cell follows from them. */
const ROOT: ProblemKind[] = ["no-depot", "no-dropoff", "point-not-on-floor", "no-path"];

/** Which editor problems stand for each of the routing engine's own issue codes (the first one names it). */
const COVERED_BY: Record<IssueCode, ProblemKind[]> = {
  "bad-shape": [],
  "missing-depot": ["no-depot"],
  "missing-dropoff": ["no-dropoff"],
  "point-not-on-floor": ["point-not-on-floor"],
  "duplicate-bin-code": ["duplicate-code"],
  "bin-without-access": ["bin-unreachable"],
  "bin-unreachable": ["bin-unreachable", ...ROOT],
  "unreachable-floor": ["floor-cut-off", "one-way-trap", ...ROOT],
  "one-way-trap": ["one-way-trap", ...ROOT],
};

/**
 * The routing engine's issues that the editor's checks did not already report, as problems. The
 * engine's validator is the last word on what it can publish, so publishing is never let through
 * on a drawing the engine would reject even if the editor's own checks missed a case.
 */
export function engineOnlyProblems(d: GridDrawing, found: readonly Problem[]): Problem[] {
  return validateDrawing(d)
    .filter(
      (issue) =>
        !COVERED_BY[issue.code].some((kind) =>
          found.some((p) => p.kind === kind && (issue.severity === "warning" || p.severity === "error")),
        ),
    )
    .map((issue) => toProblem(d, issue));
}

function toProblem(d: GridDrawing, issue: DrawingIssue): Problem {
  const kind: ProblemKind = COVERED_BY[issue.code][0] ?? "floor-cut-off";
  const text = issue.message.charAt(0).toUpperCase() + issue.message.slice(1);
  return {
    kind,
    severity: issue.severity,
    cells: (issue.cells ?? []).map((c) => c.y * d.width + c.x),
    message: `${text}.`,
  };
}

/**
 * Refuses a floor plan whose walking graph is too big to publish on this server (the Floyd–Warshall
 * step is cubic in the junctions; see MAX_JUNCTIONS), before the admin waits for a publish to fail.
 */
export function graphSizeProblems(d: GridDrawing): Problem[] {
  const n = junctionCount(d);
  if (n <= MAX_JUNCTIONS) return [];
  const fmt = (v: number) => v.toLocaleString("en-US");
  return [
    {
      kind: "too-many-junctions",
      severity: "error",
      cells: [],
      message: `This floor plan has ${fmt(n)} junctions (places where walks meet, turn or stop); Trailbin can publish at most ${fmt(MAX_JUNCTIONS)}. Open floor compresses well, but rows of building columns, many short rack runs or aisles wider than one cell each add junctions: make aisles one cell wide, paint floor nobody walks on as blocked, or split the building into several floor plans.`,
    },
  ];
}
