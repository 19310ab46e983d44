import type { RowProblem } from "@/lib/contracts/imports";

const SHOWN = 200;

/** Every row to fix, by sheet row number (the header is row 1). */
export function ProblemList({ problems }: { problems: RowProblem[] }) {
  if (problems.length === 0) return null;
  const rows = new Set(problems.map((p) => p.row)).size;
  return (
    <div role="alert" className="notice-error">
      <p className="font-semibold">
        {rows} {rows === 1 ? "row needs" : "rows need"} fixing before anything can be imported. Fix the sheet and choose
        it again.
      </p>
      <ul className="mt-2 max-h-72 space-y-1 overflow-y-auto pl-1">
        {problems.slice(0, SHOWN).map((p, i) => (
          <li key={`${p.row}-${i}`}>
            <span className="font-semibold">Row {p.row}:</span> {p.message}
          </li>
        ))}
      </ul>
      {problems.length > SHOWN && (
        <p className="mt-2">…and {problems.length - SHOWN} more. The first ones usually show the pattern.</p>
      )}
    </div>
  );
}
