import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { AuthShell } from "@/components/password/AuthShell";
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
    <AuthShell
      title="Sign in"
      footer={
        <>
          <Link href="/forgot-password" className="underline">
            Forgot your password?
          </Link>{" "}
          Locked out? Ask your site&apos;s layout admin.
        </>
      }
    >
      <SignInForm next={next} />
    </AuthShell>
  );
}
