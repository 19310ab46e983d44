import { afterAll, beforeAll, describe, expect, it } from "vitest";
import http from "node:http";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { api, APP_URL, ORIGIN, signInAs } from "../support/app";
import { zipBytes } from "../support/zip-bytes";
import { API_ACCESS } from "@/lib/auth/access-table";
import { ROLES, roleMay, type Access } from "@/lib/auth/permissions";
import { closeDb } from "@/db/knex";
import { databaseSnapshot } from "@/db/snapshot";

afterAll(closeDb);

// Every route that takes a file, found from the sources: a handler that calls uploadedFile() or
// readImportRequest() (which calls it). Each must refuse an upload by its headers, before the body
// arrives, and a lying Content-Length must not get a file through.
function uploadRoutes(): string[] {
  const app = path.resolve(process.cwd(), "app");
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      if (e.isDirectory()) walk(full);
      else if (e.name === "route.ts" && /\b(uploadedFile|readImportRequest)\(/.test(readFileSync(full, "utf8")))
        out.push("/" + path.relative(app, dir).split(path.sep).join("/"));
    }
  };
  walk(app);
  return out.sort();
}
const ROUTES = uploadRoutes();

let cookies: Record<string, string> = {};
let runId = "";
let layoutVersionId = 0;
const concreteUpload = (pattern: string) =>
  pattern
    .replace("[id]", "1")
    .replace("[runId]", runId)
    .replace("[kind]", pattern.includes("preview") ? "items" : "orders");
const cookieFor = (pattern: string) => {
  const access = API_ACCESS[pattern]!.POST as Access;
  return cookies[ROLES.find((r) => roleMay(r, access))!]!;
};

beforeAll(async () => {
  cookies = Object.fromEntries(await Promise.all(ROLES.map(async (r) => [r, await signInAs(r)])));
  const draft = await api().get("/api/floor-plans/1/draft").set("Cookie", cookies.admin!);
  runId = draft.body.draft.document.rackRuns[0].id;
  const v = await api().get("/api/floor-plans/1/versions/1").set("Cookie", cookies.planner!);
  layoutVersionId = v.body.version.id;
});

const BOUNDARY = "----trailbin-upload-test";
const formHead = (name: string) =>
  `--${BOUNDARY}\r\nContent-Disposition: form-data; name="layoutVersionId"\r\n\r\n${layoutVersionId}\r\n` +
  `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: application/octet-stream\r\n\r\n`;
const formTail = `\r\n--${BOUNDARY}--\r\n`;

type Answer = { status: number; body: { error?: string }; text: string };
/**
 * Sends the headers and the first part of a body, and waits for the answer without finishing the
 * body: an answer that arrives proves the route decided on the headers alone.
 */
function unfinishedUpload(
  url: string,
  cookie: string,
  headers: Record<string, string>,
  first: Buffer,
  end = false,
): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request(
      new URL(url, APP_URL),
      {
        method: "POST",
        headers: {
          Cookie: cookie,
          Origin: ORIGIN,
          "Content-Type": `multipart/form-data; boundary=${BOUNDARY}`,
          ...headers,
        },
      },
      (res) => {
        let text = "";
        res.setEncoding("utf8");
        res.on("data", (c: string) => (text += c));
        res.on("end", () => {
          clearTimeout(timer);
          req.destroy();
          let body: { error?: string } = {};
          try {
            body = JSON.parse(text);
          } catch {
            // Node's own HTTP parser answers a malformed request with a bare 400 before the app sees it.
          }
          resolve({ status: res.statusCode ?? 0, body, text });
        });
      },
    );
    req.on("error", () => {});
    const timer = setTimeout(() => {
      req.destroy();
      reject(
        new Error(`${url}: no answer within 15 s while the body was unfinished, so the server was waiting to read it`),
      );
    }, 15_000);
    req.flushHeaders();
    if (end) req.end(first);
    else req.write(first);
  });
}

describe("upload routes refuse by the headers, before reading the body", () => {
  it("found every upload route", () => {
    expect(ROUTES).toEqual([
      "/api/floor-plans/[id]/background",
      "/api/floor-plans/[id]/rack-runs/[runId]/bins",
      "/api/imports/[kind]",
      "/api/imports/[kind]/preview",
    ]);
    for (const r of ROUTES) expect(API_ACCESS[r]?.POST, r).toBeDefined();
  });

  it.each(ROUTES)(
    "%s: no Content-Length (a chunked body) is refused with 411 while the body is still coming",
    async (pattern) => {
      const before = await databaseSnapshot();
      const a = await unfinishedUpload(
        concreteUpload(pattern),
        cookieFor(pattern),
        {},
        Buffer.from(formHead("sheet.csv")),
      );
      expect(a.status).toBe(411);
      expect(a.body.error).toMatch(/did not say how large/);
      expect(await databaseSnapshot()).toEqual(before);
    },
  );

  it.each(ROUTES)("%s: a declared 100 MiB is refused with 413 after a few bytes of it", async (pattern) => {
    const before = await databaseSnapshot();
    const a = await unfinishedUpload(
      concreteUpload(pattern),
      cookieFor(pattern),
      { "Content-Length": String(100 * 1024 * 1024) },
      Buffer.from(formHead("big.csv") + "x".repeat(4096)),
    );
    expect(a.status).toBe(413);
    expect(a.body.error).toMatch(/larger than \d+ MiB/);
    expect(await databaseSnapshot()).toEqual(before);
  });

  it.each(ROUTES)(
    "%s: a Content-Length that cuts the file short gets a broken form, refused with 400 and nothing stored",
    async (pattern) => {
      const before = await databaseSnapshot();
      const body = Buffer.concat([
        Buffer.from(formHead("sheet.csv")),
        Buffer.from("SKU,Description\n" + "A,b\n".repeat(5000)),
        Buffer.from(formTail),
      ]);
      // The header is all the server has to go on: 400 bytes in, the file part never ends.
      const a = await unfinishedUpload(
        concreteUpload(pattern),
        cookieFor(pattern),
        { "Content-Length": "400", Connection: "close" },
        body.subarray(0, 400),
        true,
      );
      expect(a.status).toBe(400);
      expect(a.body.error).toMatch(/could not be read/);
      expect(await databaseSnapshot()).toEqual(before);
    },
  );

  it.each(ROUTES)("%s: a Content-Length that is not a number is refused before the app (400)", async (pattern) => {
    const before = await databaseSnapshot();
    const a = await unfinishedUpload(
      concreteUpload(pattern),
      cookieFor(pattern),
      { "Content-Length": "12abc" },
      Buffer.from(formHead("sheet.csv")),
    );
    expect(a.status).toBe(400);
    expect(await databaseSnapshot()).toEqual(before);
  });
});

describe("a deflate bomb through the import preview", () => {
  it("is refused as too large to unpack (413), however small the upload", async () => {
    const bomb = zipBytes([
      { name: "xl/worksheets/sheet1.xml", data: new Uint8Array(60 * 1024 * 1024).fill(0x20), claim: { unpacked: 0 } },
    ]);
    expect(bomb.length).toBeLessThan(200 * 1024);
    const res = await api()
      .post("/api/imports/items/preview")
      .set("Cookie", cookies.planner!)
      .set("Origin", ORIGIN)
      .field("layoutVersionId", String(layoutVersionId))
      .attach("file", Buffer.from(bomb), "bomb.xlsx");
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/unpacks to more than/);
  });
});
