"use client";

// A page whose server part failed lands here. In production Next hides the cause from the browser,
// and the usual one on a working install is the database being restarted or unreachable, so the
// words point at waiting and trying again; the digest lets an admin find the entry in the server log.
export default function PageError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-xl px-5 py-16" data-testid="page-error">
      <h1>This page could not be shown</h1>
      <p className="mt-3 text-ink-soft">
        The server could not load what this page needs, usually because its database is being restarted or cannot be
        reached. Nothing you entered on the page was lost. Wait a minute and try again; if it keeps happening, tell your
        admin{error.digest ? ` (reference ${error.digest})` : ""}.
      </p>
      <button type="button" className="btn-primary mt-6" onClick={() => reset()}>
        Try again
      </button>
    </main>
  );
}
