export function EmptyState({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="rounded-lg border-2 border-dashed border-rack bg-paper-raised px-6 py-10 text-center">
      <p className="text-lg font-semibold">{title}</p>
      <div className="mx-auto mt-2 max-w-prose text-ink-soft">{children}</div>
    </div>
  );
}
