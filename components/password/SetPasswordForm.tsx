"use client";

import Link from "next/link";
import { useState } from "react";
import { FailureNotice } from "@/components/FailureNotice";
import { usePostForm } from "@/components/usePostForm";

export function SetPasswordForm({ token, email, minLength }: { token: string; email: string; minLength: number }) {
  const [done, setDone] = useState<string | null>(null);
  const { onSubmit, failure, busy } = usePostForm<{ message: string }>({
    url: "/api/password/set",
    check: (f) =>
      String(f.get("password") ?? "") === String(f.get("again") ?? "")
        ? null
        : "The two passwords differ. Type the same one twice.",
    body: (f) => ({ token, password: String(f.get("password") ?? "") }),
    onDone: (r) => setDone(r.message),
  });

  if (done) {
    return (
      <div className="space-y-4">
        <p role="status" className="notice-info">
          {done}
        </p>
        <Link href="/sign-in" className="btn-primary w-full">
          Sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      {/* Lets password managers store the new password under the right account. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <p>
        For <strong>{email}</strong>. Use at least {minLength} characters; a few unrelated words with spaces between
        them work well. Common passwords, patterns like 111111111111 and your own name or e-mail address are refused.
      </p>
      <div>
        <label htmlFor="password" className="label">
          New password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          minLength={minLength}
          className="field"
        />
      </div>
      <div>
        <label htmlFor="again" className="label">
          The same again
        </label>
        <input
          id="again"
          name="again"
          type="password"
          autoComplete="new-password"
          required
          minLength={minLength}
          className="field"
        />
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>
        {busy ? "Saving…" : "Set password"}
      </button>
    </form>
  );
}
