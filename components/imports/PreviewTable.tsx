import type { PreviewAnswer } from "@/lib/contracts/imports";

/** The first rows as Trailbin reads them, under the field names (scrolls sideways on a phone). */
export function PreviewTable({ answer }: { answer: PreviewAnswer }) {
  if (answer.preview.length === 0) return null;
  return (
    <div>
      <p className="label">First {answer.preview.length} rows as they will be read</p>
      <div className="overflow-x-auto rounded-lg border border-rack-light bg-paper-raised">
        <table className="w-full border-collapse text-left text-sm">
          <thead className="bg-paper-sunk">
            <tr>
              {answer.fields.map((f) => (
                <th key={f.key} scope="col" className="whitespace-nowrap px-3 py-2 font-semibold">
                  {f.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {answer.preview.map((row, i) => (
              <tr key={i} className="border-t border-rack-light">
                {row.map((c, j) => (
                  <td key={j} className="whitespace-nowrap px-3 py-2">
                    {c || <span className="text-ink-faint">—</span>}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
