"use client";

import { useState } from "react";
import { requestJson } from "@/lib/client/fetch-json";

export function SignOutButton() {
  const [error, setError] = useState<string | null>(null);
  async function signOut() {
    const r = await requestJson("DELETE", "/api/session");
    // 401 means the session was already gone: the sign-in page is where the person belongs either way.
    if (r.ok || r.status === 401) window.location.assign("/sign-in");
    else setError(r.message);
  }
  return (
    <>
      <button
        type="button"
        onClick={signOut}
        className="btn min-h-tap border-paper bg-transparent text-paper hover:bg-ink-soft"
      >
        Sign out
      </button>
      {error && (
        <span role="alert" className="text-sm">
          {error}
        </span>
      )}
    </>
  );
}
