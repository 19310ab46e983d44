"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { ROLE_LABEL, ROLES } from "@/lib/auth/permissions";
import type { UserDTO } from "@/db/users";

export function NewUserForm({ onCreated }: { onCreated: (u: UserDTO) => Promise<void> }) {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const formEl = e.currentTarget;
    const f = new FormData(formEl);
    setBusy(true);
    const r = await postJson<{ user: UserDTO }>("/api/users", {
      email: String(f.get("email") ?? ""),
      displayName: String(f.get("displayName") ?? ""),
      role: String(f.get("role") ?? ""),
      password: String(f.get("password") ?? ""),
    });
    setBusy(false);
    if (!r.ok) return setFailure(r);
    setFailure(null);
    formEl.reset();
    await onCreated(r.data.user);
  }

  return (
    <form onSubmit={submit} className="card max-w-3xl space-y-4" noValidate aria-labelledby="new-user-title">
      <h2 id="new-user-title">Add a user</h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <label><span className="label">Name</span><input name="displayName" className="field" required maxLength={120} /></label>
        <label><span className="label">E-mail address</span><input name="email" type="email" className="field" required /></label>
        <label>
          <span className="label">Role</span>
          <select name="role" className="field" defaultValue="picker">
            {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
          </select>
        </label>
        <label>
          <span className="label">First password (at least 12 characters)</span>
          <input name="password" type="password" autoComplete="new-password" className="field" required minLength={12} />
        </label>
      </div>
      <FailureNotice failure={failure} />
      <button type="submit" className="btn-primary" disabled={busy}>{busy ? "Adding…" : "Add user"}</button>
    </form>
  );
}
