import type { Metadata } from "next";
import Link from "next/link";
import { AuthShell } from "@/components/password/AuthShell";
import { ForgotPasswordForm } from "@/components/password/ForgotPasswordForm";

export const metadata: Metadata = { title: "Forgot your password?" };

// Public, and answers the same whether or not the address has an account.
export default function ForgotPasswordPage() {
  return (
    <AuthShell
      title="Forgot your password?"
      footer={
        <Link href="/sign-in" className="underline">
          Back to sign-in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </AuthShell>
  );
}
