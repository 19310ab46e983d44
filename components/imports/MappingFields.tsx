import { columnLetter } from "./import-text";
import type { PreviewAnswer } from "@/lib/contracts/imports";

/** One select per field: which column of the person's sheet holds it. */
export function MappingFields({
  answer,
  disabled,
  onChange,
}: {
  answer: PreviewAnswer;
  disabled: boolean;
  onChange: (key: string, column: number | null) => void;
}) {
  return (
    <fieldset className="grid gap-3 sm:grid-cols-2">
      <legend className="label">Which column holds each field</legend>
      {answer.fields.map((f) => {
        const at = answer.mapping[f.key];
        return (
          <label key={f.key} className="block">
            <span className="mb-1 block text-sm font-semibold">
              {f.label}
              {f.required ? " (required)" : " (optional)"}
            </span>
            <select
              className="field"
              disabled={disabled}
              value={at === null || at === undefined ? "" : String(at)}
              onChange={(e) => onChange(f.key, e.target.value === "" ? null : Number(e.target.value))}
            >
              <option value="">— not in this sheet —</option>
              {answer.headers.map((h, i) => (
                <option key={i} value={i}>
                  Column {columnLetter(i)}: {h || "(no header)"}
                </option>
              ))}
            </select>
          </label>
        );
      })}
    </fieldset>
  );
}
