"use client";

import Link from "next/link";
import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";

export function SetPasswordForm({ token, email, minLength }: { token: string; email: string; minLength: number }) {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<string | null>(null);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const f = new FormData(e.currentTarget);
    const password = String(f.get("password") ?? "");
    if (password !== String(f.get("again") ?? "")) {
      setFailure({ ok: false, status: 0, message: "The two passwords differ. Type the same one twice." });
      return;
    }
    setBusy(true);
    setFailure(null);
    const r = await postJson<{ message: string }>("/api/password/set", { token, password });
    setBusy(false);
    if (!r.ok) return setFailure(r);
    setDone(r.data.message);
  }

  if (done) {
    return (
      <div className="space-y-4">
        <p role="status" className="notice-info">{done}</p>
        <Link href="/sign-in" className="btn-primary w-full">Sign in</Link>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      {/* Lets password managers store the new password under the right account. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <p>
        For <strong>{email}</strong>. Use at least {minLength} characters; a few unrelated words with spaces between them work well.
        Common passwords, patterns like 111111111111 and your own name or e-mail address are refused.
      </p>
      <div>
        <label htmlFor="password" className="label">New password</label>
        <input id="password" name="password" type="password" autoComplete="new-password" required minLength={minLength} className="field" />
      </div>
      <div>
        <label htmlFor="again" className="label">The same again</label>
        <input id="again" name="again" type="password" autoComplete="new-password" required minLength={minLength} className="field" />
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>{busy ? "Saving…" : "Set password"}</button>
    </form>
  );
}
