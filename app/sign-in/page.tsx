import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { Logo } from "@/components/Logo";
import { SignInForm } from "@/components/SignInForm";
import { currentUser } from "@/lib/auth/guard";
import { ROLE_HOME } from "@/lib/auth/permissions";
import { safeNextPath } from "@/lib/http/next-path";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const user = await currentUser();
  if (user) redirect(ROLE_HOME[user.role]);
  const raw = (await searchParams).next;
  const next = safeNextPath(typeof raw === "string" ? raw : null) ?? undefined;
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
        <h1 className="mb-5">Sign in</h1>
        <SignInForm next={next} />
      </div>
      <p className="mt-6 text-sm text-ink-soft">
        <Link href="/forgot-password" className="underline">Forgot your password?</Link> Locked out? Ask your site&apos;s layout admin.
      </p>
    </main>
  );
}
