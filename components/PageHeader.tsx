export function PageHeader({ title, lead, children }: { title: string; lead?: string; children?: React.ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1>{title}</h1>
        {lead && <p className="mt-1 max-w-prose text-ink-soft">{lead}</p>}
      </div>
      {children}
    </div>
  );
}
