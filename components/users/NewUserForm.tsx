"use client";

import Link from "next/link";
import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";
import { FailureNotice } from "@/components/FailureNotice";
import { ROLE_LABEL, ROLES } from "@/lib/auth/permissions";
import type { UserDTO } from "@/lib/contracts/users";

export function NewUserForm({ onCreated }: { onCreated: (u: UserDTO) => Promise<void> }) {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);
  // By default the person gets an invitation mail and chooses their own password.
  const [invite, setInvite] = useState(true);
  const [done, setDone] = useState<string | null>(null);

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const formEl = e.currentTarget;
    const f = new FormData(formEl);
    setBusy(true);
    setDone(null);
    const r = await postJson<{ user: UserDTO; invited: boolean }>("/api/users", {
      email: String(f.get("email") ?? ""),
      displayName: String(f.get("displayName") ?? ""),
      role: String(f.get("role") ?? ""),
      ...(invite ? {} : { password: String(f.get("password") ?? "") }),
    });
    setBusy(false);
    if (!r.ok) return setFailure(r);
    setFailure(null);
    formEl.reset();
    setDone(
      r.data.invited
        ? `${r.data.user.displayName} was added. An invitation mail with a link to choose a password (valid 72 hours) is on its way to ${r.data.user.email}.`
        : `${r.data.user.displayName} was added with the first password you gave.`,
    );
    await onCreated(r.data.user);
  }

  return (
    <form onSubmit={submit} className="card max-w-3xl space-y-4" noValidate aria-labelledby="new-user-title">
      <h2 id="new-user-title">Add a user</h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <label>
          <span className="label">Name</span>
          <input name="displayName" className="field" required maxLength={120} />
        </label>
        <label>
          <span className="label">E-mail address</span>
          <input name="email" type="email" className="field" required />
        </label>
        <label>
          <span className="label">Role</span>
          <select name="role" className="field" defaultValue="picker">
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABEL[r]}
              </option>
            ))}
          </select>
        </label>
        <fieldset>
          <legend className="label">Password</legend>
          <label className="flex min-h-tap items-center gap-2">
            <input type="radio" name="how" checked={invite} onChange={() => setInvite(true)} />
            Send an invitation mail; they choose it
          </label>
          <label className="flex min-h-tap items-center gap-2">
            <input type="radio" name="how" checked={!invite} onChange={() => setInvite(false)} />I give a first password
          </label>
        </fieldset>
        {!invite && (
          <label>
            <span className="label">
              First password (at least 12 characters, not a common one, nor their name or address)
            </span>
            <input
              name="password"
              type="password"
              autoComplete="new-password"
              className="field"
              required
              minLength={12}
            />
          </label>
        )}
      </div>
      <FailureNotice failure={failure} />
      {done && (
        <p role="status" className="notice-info">
          {done} Sent mail is listed under{" "}
          <Link href="/admin/mail" className="underline">
            Mail
          </Link>
          .
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy}>
        {busy ? "Adding…" : invite ? "Add and invite" : "Add user"}
      </button>
    </form>
  );
}
