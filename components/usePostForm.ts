"use client";

import { useState } from "react";
import { postJson, type ApiFailure } from "@/lib/client/fetch-json";

export type PostForm<T> = {
  /** The address the form posts to. */
  url: string;
  /** The JSON body, read from the form's fields. */
  body: (form: FormData) => unknown;
  /** A refusal before anything is sent (shown like the server's), or null to send. */
  check?: (form: FormData) => string | null;
  /** What success does with the answer. */
  onDone: (data: T) => void;
  /** Success opens another page: the button stays busy until it has. */
  leaves?: boolean;
};

/**
 * The submit of a small form that posts JSON: one request at a time, the button busy meanwhile, and
 * the server's refusal (or the check's) kept for FailureNotice.
 */
export function usePostForm<T>({ url, body, check, onDone, leaves = false }: PostForm<T>) {
  const [failure, setFailure] = useState<ApiFailure | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (busy) return;
    const form = new FormData(e.currentTarget);
    const refusal = check?.(form) ?? null;
    if (refusal !== null) return setFailure({ ok: false, status: 0, message: refusal });
    setBusy(true);
    setFailure(null);
    const r = await postJson<T>(url, body(form));
    if (!r.ok) {
      setFailure(r);
      setBusy(false);
      return;
    }
    if (!leaves) setBusy(false);
    onDone(r.data);
  }

  return { onSubmit, failure, busy };
}
