import { Logo } from "@/components/Logo";

/** The frame of the pages people see before they are signed in (like the sign-in page). */
export function AuthShell({
  title,
  children,
  footer,
}: {
  title: string;
  children: React.ReactNode;
  footer?: React.ReactNode;
}) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-5 py-10">
      <div className="mb-8 flex items-center gap-3">
        <Logo className="h-12 w-12" />
        <div>
          <p className="text-2xl font-bold">Trailbin</p>
          <p className="text-ink-soft">Shorter walks, stop by stop.</p>
        </div>
      </div>
      <div className="card">
        <h1 className="mb-5">{title}</h1>
        {children}
      </div>
      {footer && <div className="mt-6 text-sm text-ink-soft">{footer}</div>}
    </main>
  );
}
