import type { Metadata } from "next";
import Link from "next/link";
import { AuthShell } from "@/components/password/AuthShell";
import { SetPasswordForm } from "@/components/password/SetPasswordForm";
import { peekToken } from "@/db/tokens";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { LINK_DEAD } from "@/lib/mail/answers";

export const metadata: Metadata = { title: "Choose a password", referrer: "no-referrer" };
// Public: the link in an invitation or reset mail is the only credential. Looking the token up here
// only decides what to show; POST /api/password/set checks it again and spends it.
export default async function SetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[] }>;
}) {
  const raw = (await searchParams).token;
  const token = typeof raw === "string" ? raw : "";
  const found = token ? await peekToken(token) : null;
  return (
    <AuthShell
      title={found?.purpose === "reset" ? "Choose a new password" : "Choose your password"}
      footer={
        <Link href="/sign-in" className="underline">
          Back to sign-in
        </Link>
      }
    >
      {found ? (
        <SetPasswordForm token={token} email={found.email} minLength={MIN_PASSWORD_LENGTH} />
      ) : (
        <div className="space-y-4">
          <p role="alert" className="notice-error">
            {token ? LINK_DEAD : "This link is missing its code or has expired. Ask for a new one."}
          </p>
          <p>
            <Link href="/forgot-password" className="underline">
              Send me a new link
            </Link>
            , or ask your site&apos;s layout admin to invite you again.
          </p>
        </div>
      )}
    </AuthShell>
  );
}
