"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";

export function ForgotPasswordForm() {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<string | null>(null);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const f = new FormData(e.currentTarget);
    setBusy(true);
    setFailure(null);
    const r = await postJson<{ message: string }>("/api/password/reset-request", { email: String(f.get("email") ?? "") });
    setBusy(false);
    if (!r.ok) return setFailure(r);
    setDone(r.data.message);
  }

  if (done) return <p role="status" className="notice-info">{done}</p>;

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      <p>Enter the e-mail address you sign in with. We send a link to choose a new password.</p>
      <div>
        <label htmlFor="email" className="label">E-mail address</label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>{busy ? "Sending…" : "Send the link"}</button>
    </form>
  );
}
