"use client";

import { FailureNotice } from "@/components/FailureNotice";
import { usePostForm } from "@/components/usePostForm";

export function SignInForm({ next }: { next?: string }) {
  const { onSubmit, failure, busy } = usePostForm<{ home: string }>({
    url: "/api/session",
    body: (form) => ({ email: String(form.get("email") ?? ""), password: String(form.get("password") ?? ""), next }),
    onDone: (r) => window.location.assign(r.home),
    leaves: true,
  });

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      <div>
        <label htmlFor="email" className="label">
          E-mail address
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      <div>
        <label htmlFor="password" className="label">
          Password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="field"
        />
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
