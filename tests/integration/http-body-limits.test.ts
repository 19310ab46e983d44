import { afterAll, beforeAll, describe, expect, it } from "vitest";
import http from "node:http";
import { readFileSync } from "node:fs";
import path from "node:path";
import { APP_URL, ORIGIN, signInAs } from "../support/app";
import { closeDb } from "@/db/knex";

afterAll(closeDb);

// A JSON body may be at most 256 KiB. A client that sends far more, chunked (no Content-Length, so
// nothing to refuse up front), must get 413 while it is still sending: the server stopped reading.
const TOTAL = 64 * 1024 * 1024;
const HEAD = Buffer.from('{"email":"someone@example.com","password":"');
const CHUNK = Buffer.alloc(64 * 1024, "x".charCodeAt(0));

type Outcome = { status: number; body: { error?: string }; sentWhenAnswered: number };

/** Streams `TOTAL` bytes of a JSON-looking body with no Content-Length, until the server answers. */
function streamUntilAnswered(method: string, url: string, headers: Record<string, string>): Promise<Outcome> {
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = false;
    const req = http.request(
      new URL(url, APP_URL),
      { method, headers: { "Content-Type": "application/json", Origin: ORIGIN, ...headers } },
      (res) => {
        answered = true;
        const sentWhenAnswered = sent;
        let text = "";
        res.setEncoding("utf8");
        res.on("data", (c: string) => (text += c));
        res.on("end", () => {
          req.destroy();
          let body: Outcome["body"] = {};
          try {
            body = JSON.parse(text);
          } catch {
            body = { error: `not JSON: ${text.slice(0, 200)}` };
          }
          resolve({ status: res.statusCode ?? 0, body, sentWhenAnswered });
        });
      },
    );
    req.on("error", (e) => {
      // Once the answer is in, the server may close the connection on the rest of the body.
      if (!answered)
        reject(
          new Error(`${method} ${url}: the connection failed before any answer, after ${sent} bytes: ${e.message}`),
        );
    });
    const pump = () => {
      while (!answered && sent < TOTAL) {
        const chunk = sent === 0 ? HEAD : CHUNK;
        const more = req.write(chunk);
        sent += chunk.length;
        if (!more) return void req.once("drain", pump);
      }
      if (!answered) req.end('"}');
    };
    req.flushHeaders();
    pump();
  });
}

// The server's resident memory, for the figures in the log (never asserted: it depends on the machine).
function serverRssMiB(): number | null {
  try {
    const pid = readFileSync(path.resolve(process.cwd(), ".data/test/next.pid"), "utf8").trim();
    const kb = /VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1];
    return kb ? Math.round(Number(kb) / 1024) : null;
  } catch {
    return null;
  }
}

let admin = "";
beforeAll(async () => {
  admin = await signInAs("admin");
});

describe("request bodies are read only up to their cap", () => {
  it("four parallel chunked sign-in bodies of 64 MiB each get 413 before they are sent", async () => {
    const before = serverRssMiB();
    let peak = before ?? 0;
    const sampler = setInterval(() => (peak = Math.max(peak, serverRssMiB() ?? 0)), 20);
    let outcomes: Outcome[];
    try {
      outcomes = await Promise.all([1, 2, 3, 4].map(() => streamUntilAnswered("POST", "/api/session", {})));
    } finally {
      clearInterval(sampler);
    }
    console.info(
      `server RSS: ${before} MiB before, ${peak} MiB at most while 4 × ${TOTAL / 1024 / 1024} MiB chunked bodies came in, ${serverRssMiB()} MiB after; bytes sent before each answer: ${outcomes.map((o) => o.sentWhenAnswered).join(", ")}`,
    );
    for (const o of outcomes) {
      expect(o.status, JSON.stringify(o.body)).toBe(413);
      expect(o.body.error).toMatch(/larger than 256 KiB/);
      expect(o.sentWhenAnswered, "the answer came before the body was all sent").toBeLessThan(TOTAL);
    }
  });

  it("a signed-in JSON route (saving a draft) stops reading a chunked body at the cap too", async () => {
    const o = await streamUntilAnswered("PUT", "/api/floor-plans/1/draft", { Cookie: admin });
    expect(o.status, JSON.stringify(o.body)).toBe(413);
    expect(o.body.error).toMatch(/larger than 256 KiB/);
    expect(o.sentWhenAnswered).toBeLessThan(TOTAL);
  });

  it("a body within the cap, chunked, is still read whole", async () => {
    // Wrong password on purpose: the point is that the JSON arrived and was validated.
    const res = await new Promise<{ status: number; text: string }>((resolve, reject) => {
      const req = http.request(
        new URL("/api/session", APP_URL),
        { method: "POST", headers: { "Content-Type": "application/json", Origin: ORIGIN } },
        (r) => {
          let text = "";
          r.setEncoding("utf8");
          r.on("data", (c: string) => (text += c));
          r.on("end", () => resolve({ status: r.statusCode ?? 0, text }));
        },
      );
      req.on("error", reject);
      req.write('{"email":"not-an-address",');
      req.end(`"password":"${"p".repeat(1000)}"}`);
    });
    expect(res.status).toBe(400);
    expect(res.text).toMatch(/valid e-mail address/);
  });
});
