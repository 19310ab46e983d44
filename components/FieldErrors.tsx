import type { FieldIssue } from "@/lib/http/zod-issues";

export function FieldErrors({ issues }: { issues?: FieldIssue[] }) {
  if (!issues?.length) return null;
  return (
    <ul className="mt-1 list-disc pl-5 text-sm">
      {issues.map((i) => (
        <li key={i.path + i.message}>
          <span className="font-semibold">{i.path}</span>: {i.message}
        </li>
      ))}
    </ul>
  );
}
