import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <h1>Not for your role</h1>
      <p className="mt-3 text-ink-soft">
        Your account cannot open this page. If you need it for your work, ask your site&apos;s layout admin to change
        your role.
      </p>
      <Link href="/" className="btn-primary mt-6">
        Go to my start page
      </Link>
    </main>
  );
}
