// A small JSON client for the set-up and the planner: the product's own API, signed in by cookie,
// with the Origin header every state-changing request needs.

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: unknown,
    what: string,
  ) {
    super(`${what}: HTTP ${status} ${JSON.stringify(body).slice(0, 400)}`);
  }
}

export type Api = {
  origin: string;
  call<T = Record<string, unknown>>(
    method: string,
    path: string,
    opts?: { cookie?: string; json?: unknown; form?: FormData; expect?: number[] },
  ): Promise<{ status: number; body: T; ms: number }>;
};

export function api(origin: string): Api {
  return {
    origin,
    async call(method, path, opts = {}) {
      const headers: Record<string, string> = { origin };
      if (opts.cookie) headers.cookie = opts.cookie;
      let body: string | FormData | undefined;
      if (opts.json !== undefined) {
        headers["content-type"] = "application/json";
        body = JSON.stringify(opts.json);
      } else if (opts.form) body = opts.form;
      const t0 = performance.now();
      const res = await fetch(origin + path, { method, headers, body, signal: AbortSignal.timeout(120_000) });
      const text = await res.text();
      const ms = performance.now() - t0;
      let parsed: unknown = text;
      try {
        parsed = JSON.parse(text);
      } catch {
        // A non-JSON answer is kept as text for the error message.
      }
      const expect = opts.expect ?? [200, 201, 202];
      if (!expect.includes(res.status)) throw new ApiError(res.status, parsed, `${method} ${path}`);
      return { status: res.status, body: parsed as never, ms };
    },
  };
}

/** Signs in and returns the Cookie header value of the new session. */
export async function signIn(origin: string, email: string, password: string): Promise<string> {
  const res = await fetch(origin + "/api/session", {
    method: "POST",
    headers: { origin, "content-type": "application/json" },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new ApiError(res.status, await res.text(), `sign-in as ${email}`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith("trailbin_session="));
  if (!cookie) throw new Error(`sign-in as ${email} set no session cookie`);
  return cookie.split(";")[0]!;
}
