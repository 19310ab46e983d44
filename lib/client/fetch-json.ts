import type { FieldIssue } from "@/lib/http/zod-issues";

export type ApiFailure = { ok: false; status: number; message: string; issues?: FieldIssue[]; body?: unknown };
export type ApiResult<T> = { ok: true; status: number; data: T } | ApiFailure;

/** Turns any answer (or no answer) into something the screen can show a person. */
export async function requestJson<T>(method: string, url: string, body?: unknown): Promise<ApiResult<T>> {
  let res: Response;
  // A FormData body goes as multipart (the browser sets the boundary); anything else as JSON.
  const form = body instanceof FormData;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined || form ? {} : { "content-type": "application/json" },
      body: body === undefined ? undefined : form ? body : JSON.stringify(body),
      credentials: "same-origin",
    });
  } catch {
    return { ok: false, status: 0, message: "No connection to Trailbin. Check the Wi-Fi and try again." };
  }
  const data = (await res.json().catch(() => null)) as (T & { error?: string; issues?: FieldIssue[] }) | null;
  if (res.ok) return { ok: true, status: res.status, data: data as T };
  return {
    ok: false,
    status: res.status,
    message: data?.error ?? `The server answered ${res.status}. Try again in a moment.`,
    issues: data?.issues,
    body: data,
  };
}

export const postJson = <T>(url: string, body: unknown) => requestJson<T>("POST", url, body);

/** Multipart upload of one file in the field "file", answered like any other request. */
export function uploadFile<T>(url: string, file: File): Promise<ApiResult<T>> {
  const form = new FormData();
  form.append("file", file);
  return requestJson<T>("POST", url, form);
}
export const patchJson = <T>(url: string, body: unknown) => requestJson<T>("PATCH", url, body);

/** SWR fetcher: throws an Error whose message is the server's. */
export async function swrFetcher<T>(url: string): Promise<T> {
  const r = await requestJson<T>("GET", url);
  if (!r.ok) throw Object.assign(new Error(r.message), { status: r.status });
  return r.data;
}
