"use client";

import { useState } from "react";
import { FailureNotice } from "@/components/FailureNotice";
import { usePostForm } from "@/components/usePostForm";

export function ForgotPasswordForm() {
  const [done, setDone] = useState<string | null>(null);
  const { onSubmit, failure, busy } = usePostForm<{ message: string }>({
    url: "/api/password/reset-request",
    body: (f) => ({ email: String(f.get("email") ?? "") }),
    onDone: (r) => setDone(r.message),
  });

  if (done)
    return (
      <p role="status" className="notice-info">
        {done}
      </p>
    );

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      <p>Enter the e-mail address you sign in with. We send a link to choose a new password.</p>
      <div>
        <label htmlFor="email" className="label">
          E-mail address
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>
        {busy ? "Sending…" : "Send the link"}
      </button>
    </form>
  );
}
