"use client";

/** A file picker that hands over one file and clears itself, so picking the same file again works. */
export function FileField({
  label,
  accept,
  disabled,
  onFile,
  hint,
}: {
  label: string;
  accept: string;
  disabled?: boolean;
  onFile: (f: File) => void;
  hint?: string;
}) {
  return (
    <label className="block">
      <span className="label">{label}</span>
      <input
        className="field py-2"
        type="file"
        accept={accept}
        disabled={disabled}
        onChange={(e) => {
          const f = e.target.files?.[0];
          e.target.value = "";
          if (f) onFile(f);
        }}
      />
      {hint && <span className="mt-1 block text-sm text-ink-soft">{hint}</span>}
    </label>
  );
}
