// One phase of handheld traffic through autocannon: one connection per handheld, each connection
// bound to its handheld's session through its URL (autocannon gives connection i the i-th URL, and
// setupRequest sees that URL's path before it replaces it with the real request).
import autocannon from "autocannon";
import type { Handheld, Shot } from "./handheld";
import { PhaseStats } from "./stats";

type Context = { shot?: Shot; handheld?: Handheld };

// The parts of autocannon's client (lib/httpClient.js of the pinned 9.0.0) that its rate limit uses.
type PacedClient = {
  opts: { path?: string };
  rateInterval?: ReturnType<typeof setInterval>;
  reqsMadeThisSecond: number;
  paused?: boolean;
  destroyed?: boolean;
  _doRequest(): void;
};

/**
 * autocannon paces a connection by allowing `connectionRate` requests per 1 s window, and every
 * connection's window timer starts in the same instant: left so, all 50 handhelds would send in
 * lockstep, 50 requests at once every second, which no floor of pickers does. Each handheld here gets
 * windows of 1/rate s (one request each) starting at its own phase, spread evenly over a window.
 */
function spreadPacing(client: autocannon.Client, ratePerHandheld: number, count: number) {
  const c = client as unknown as PacedClient;
  const i = Number(/^\/handheld\/(\d+)/.exec(c.opts.path ?? "")?.[1] ?? 0);
  const period = 1000 / ratePerHandheld;
  // autocannon starts its own 1 s timer right after this hook returns: stop it at once.
  setImmediate(() => c.rateInterval && clearInterval(c.rateInterval));
  setTimeout(
    () => {
      if (c.destroyed) return;
      c.rateInterval = setInterval(() => {
        c.reqsMadeThisSecond = 0;
        if (c.paused) c._doRequest();
        c.paused = false;
      }, period);
    },
    (i / count) * period,
  );
}

export async function runPhase(
  origin: string,
  handhelds: Handheld[],
  opts: { seconds: number; ratePerHandheld?: number },
): Promise<{ stats: PhaseStats; result: autocannon.Result }> {
  const stats = new PhaseStats();
  let answered: { shot: Shot; status: number; verdict: ReturnType<Handheld["answered"]> } | null = null;
  const urls = handhelds.map((_, i) => `${origin}/handheld/${i}`);
  let finish: (r: autocannon.Result) => void = () => undefined;
  let fail: (e: unknown) => void = () => undefined;
  const done = new Promise<autocannon.Result>((resolve, reject) => {
    finish = resolve;
    fail = reject;
  });
  const instance = autocannon(
    {
      // autocannon takes a list of URLs (lib/run.js); its type definitions only know one.
      url: urls as unknown as string,
      connections: handhelds.length,
      duration: opts.seconds,
      // One request per pacing window; the windows are set up per handheld in setupClient.
      ...(opts.ratePerHandheld
        ? {
            connectionRate: 1,
            setupClient: (client: autocannon.Client) => spreadPacing(client, opts.ratePerHandheld!, handhelds.length),
          }
        : {}),
      timeout: 10,
      requests: [
        {
          setupRequest: (req, ctx) => {
            const context = ctx as Context;
            const i = Number(/^\/handheld\/(\d+)/.exec(req.path ?? "")?.[1]);
            const h = handhelds[i];
            if (!h) throw new Error(`no handheld for ${req.path}`);
            const shot = h.next();
            context.shot = shot;
            context.handheld = h;
            const headers = {
              ...req.headers,
              cookie: h.account.cookie,
              origin,
              ...(shot.body ? { "content-type": "application/json" } : {}),
            };
            return { ...req, method: shot.method, path: shot.path, headers, body: shot.body };
          },
          onResponse: (status, body, ctx, headers) => {
            const { shot, handheld } = ctx as Context;
            if (!shot || !handheld) return;
            answered = {
              shot,
              status,
              verdict: handheld.answered(shot, status, body, (headers ?? {}) as Record<string, unknown>),
            };
          },
        },
      ],
    },
    (err, result) => (err ? fail(err) : finish(result)),
  );
  // autocannon emits "response" (with its own latency measure) right after onResponse for the same
  // answer, synchronously, so the answer just judged is the one this latency belongs to.
  instance.on("response", (_client, status, _bytes, responseTime) => {
    if (answered && answered.status === status)
      stats.record(answered.shot.kind, status, responseTime, answered.verdict);
    answered = null;
  });
  instance.on("reqError", (err: Error) => {
    if (/timed out/.test(err.message)) stats.timeouts++;
    else {
      stats.socketErrors++;
      if (stats.problems.length < 20) stats.problems.push(`socket error: ${err.message}`);
    }
  });
  const result = await done;
  stats.seconds = result.duration;
  stats.endedAt = performance.now();
  return { stats, result };
}

/**
 * After a phase: each handheld sends again what it had in flight when the phase stopped, as its
 * offline queue does on reconnecting, so every key ends with an answer the check can hold it to.
 */
export async function drain(origin: string, handhelds: Handheld[]): Promise<{ sent: number; bad: string[] }> {
  let sent = 0;
  const bad: string[] = [];
  await Promise.all(
    handhelds.map(async (h) => {
      for (let tries = 0; h.inFlight && tries < 3; tries++) {
        const shot = h.inFlight;
        sent++;
        try {
          const res = await fetch(origin + shot.path, {
            method: shot.method,
            headers: { cookie: h.account.cookie, origin, ...(shot.body ? { "content-type": "application/json" } : {}) },
            body: shot.body,
            signal: AbortSignal.timeout(30_000),
          });
          const v = h.answered(shot, res.status, await res.text(), Object.fromEntries(res.headers));
          if (!v.ok) bad.push(v.why ?? `${shot.kind} answered ${res.status}`);
        } catch (e) {
          bad.push(`${shot.kind}: ${(e as Error).message}`);
        }
        // A fresh confirmation that came back 200 leaves nothing in flight; anything else is tried again.
        if (h.inFlight === null) break;
      }
      // Whatever the handheld chose next was never sent: forget it.
      h.inFlight = null;
    }),
  );
  return { sent, bad };
}
