import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <h1>Page not found</h1>
      <p className="mt-3 text-ink-soft">
        There is no page at this address. It may have been moved, or the link was mistyped.
      </p>
      <Link href="/" className="btn-primary mt-6">
        Go to my start page
      </Link>
    </main>
  );
}
