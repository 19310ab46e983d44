import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signInAs } from "../support/app";
import { discoverRoutes } from "../support/app-routes";
import {
  badArbitrary,
  badValues,
  constructorKeyed,
  protoKeyed,
  toJsonText,
  withField,
  type FieldKind,
} from "../support/fuzz-values";
import { API_ACCESS } from "@/lib/auth/access-table";
import { ROLES, roleMay, type Access, type Role } from "@/lib/auth/permissions";
import { SHORT_REASONS } from "@/lib/picking/rules";
import { FOLLOW_UP_ACTIONS } from "@/lib/contracts/short-picks";
import { closeDb } from "@/db/knex";
import { databaseSnapshot } from "@/db/snapshot";

afterAll(closeDb);

// Every route handler and method under app/api gets hostile input from a role allowed to use it and
// must answer 4xx with a JSON error a person can read, never 500, and write nothing (a snapshot of
// every table but the ones db/snapshot.ts excludes, compared before and after each route).
const SEED = 20261207;
/** fast-check cases per route with a JSON body, on top of the fixed list of bad values per field. */
const RANDOM_RUNS = 25;

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
type Fixtures = {
  cookies: Record<Role, string>;
  pickerBatch: { id: number; version: number };
  draft: { version: number; document: Record<string, unknown>; runId: string };
  layoutVersionId: number;
  depotId: string;
  dropoffId: string;
  wave: { id: number; version: number };
  target: { id: string; email: string; version: number };
};
type BodySpec = {
  example: (f: Fixtures) => Record<string, unknown>;
  fields: Record<string, FieldKind>;
  /** The example sent where it cannot write, to show it passes the schema: the handler's own answer, not a 400 with field issues. */
  probe: { params?: Record<string, string>; body?: (f: Fixtures) => Record<string, unknown>; status: number };
};
type Spec = {
  /** Real values for the URL's dynamic segments. */
  params?: (f: Fixtures) => Record<string, string>;
  body?: BodySpec;
  /** A query the route accepts, sent with the bad path parameters so that they are what is refused. */
  validQuery?: string;
  /** Query parameters the route reads, with values it must refuse (4xx). */
  query?: Record<string, string[]>;
  /** A multipart upload route: a JSON body is refused, and the upload test covers the rest. */
  upload?: true;
  /** Whoever may use it and there is nothing to send: signing out, for one. */
  signsOut?: true;
};

const MAX_ID = 2_147_483_647;
const id: FieldKind = { kind: "int", min: 1, max: MAX_ID };
const SHORT_ID = /^[A-Za-z0-9_-]{1,24}$/;
const PLAN_VARIANT = { method: "first-come", totesPerCart: 4, maxLines: 20, maxWeightG: 60_000 };

const SPECS: Record<string, Partial<Record<Method, Spec>>> = {
  "/api/health": { GET: {} },
  "/api/session": {
    GET: {},
    DELETE: { signsOut: true },
    POST: {
      body: {
        example: () => ({ email: "nobody-fuzz@tests.example", password: "not the password", next: "/waves" }),
        fields: {
          email: { kind: "email" },
          password: { kind: "string", min: 1, max: 1024 },
          next: { kind: "string", max: 512 },
        },
        probe: { status: 401 },
      },
    },
  },
  "/api/users": {
    GET: {},
    POST: {
      body: {
        example: () => ({
          email: "fuzz-new@tests.example",
          displayName: "Fuzz Person",
          role: "picker",
          password: "correct horse battery",
        }),
        fields: {
          email: { kind: "email" },
          displayName: { kind: "string", min: 1, max: 120, trimmed: true },
          role: { kind: "enum", values: ROLES },
          password: { kind: "string", min: 12, max: 1024 },
        },
        probe: {
          body: (f) => ({
            email: f.target.email,
            displayName: "Fuzz Person",
            role: "picker",
            password: "correct horse battery",
          }),
          status: 409,
        },
      },
    },
  },
  "/api/users/[id]": {
    PATCH: {
      params: (f) => ({ id: f.target.id }),
      body: {
        example: (f) => ({ version: f.target.version, role: "planner", disabled: false, displayName: "Fuzz Renamed" }),
        fields: {
          version: id,
          role: { kind: "enum", values: ROLES },
          disabled: { kind: "bool" },
          displayName: { kind: "string", min: 1, max: 120, trimmed: true },
        },
        probe: { params: { id: "no-such-user" }, status: 404 },
      },
    },
  },
  "/api/mail": { GET: {} },
  "/api/site": {
    GET: {},
    PATCH: {
      body: {
        // A version no site has: whatever slips past the schema is refused as stale, never saved.
        example: () => ({
          version: MAX_ID,
          name: "Fuzz site",
          timezone: "Europe/London",
          walkingSpeedMPerS: 1,
          secondsPerLine: 15,
          setupSecondsPerBatch: 120,
          maxOpenBatchesPerPicker: 3,
          dateOrder: "dmy",
          clock: "24h",
          units: "metric",
        }),
        fields: {
          version: id,
          name: { kind: "string", min: 1, max: 120, trimmed: true },
          timezone: { kind: "string", min: 1, max: 64, pattern: /^[A-Za-z]+\/[A-Za-z_]+$/ },
          walkingSpeedMPerS: { kind: "number", min: 0.3, max: 2.5 },
          secondsPerLine: { kind: "int", min: 1, max: 600 },
          setupSecondsPerBatch: { kind: "int", min: 0, max: 3600 },
          maxOpenBatchesPerPicker: { kind: "int", min: 1, max: 10 },
          dateOrder: { kind: "enum", values: ["dmy", "mdy", "ymd"] },
          clock: { kind: "enum", values: ["24h", "12h"] },
          units: { kind: "enum", values: ["metric", "imperial"] },
        },
        probe: { status: 409 },
      },
    },
  },
  "/api/password/reset-request": {
    POST: {
      body: {
        example: () => ({ email: "nobody-fuzz-reset@tests.example" }),
        fields: { email: { kind: "email" } },
        probe: { status: 200 },
      },
    },
  },
  "/api/password/set": {
    POST: {
      body: {
        example: () => ({ token: "no-such-token", password: "correct horse battery" }),
        fields: { token: { kind: "string", max: 200 }, password: { kind: "string", min: 12, max: 1024 } },
        probe: { status: 400 },
      },
    },
  },
  "/api/floor-plans": {
    GET: {},
    POST: {
      body: {
        example: () => ({ name: "Fuzz floor", widthM: 40.5, heightM: 30, cellMm: 1000 }),
        fields: {
          name: { kind: "string", min: 1, max: 120, trimmed: true },
          widthM: { kind: "number", min: 0, max: 2000, above: true },
          heightM: { kind: "number", min: 0, max: 2000, above: true },
          cellMm: { kind: "int", min: 250, max: 5000 },
        },
        // Too small a floor for the editor: the handler's own refusal, after the schema let it through.
        probe: { body: () => ({ name: "Fuzz floor", widthM: 1, heightM: 1, cellMm: 1000 }), status: 400 },
      },
    },
  },
  "/api/floor-plans/[id]/draft": {
    GET: { params: () => ({ id: "1" }) },
    PUT: {
      params: () => ({ id: "1" }),
      body: {
        example: (f) => ({ version: f.draft.version, document: f.draft.document }),
        fields: {
          version: id,
          "document.format": { kind: "enum", values: [1] },
          "document.width": { kind: "int", min: 4, max: 400 },
          "document.height": { kind: "int", min: 4, max: 400 },
          "document.cellMm": { kind: "int", min: 250, max: 5000 },
          "document.ground": { kind: "string", max: 160_000, pattern: /^[.fx]*$/ },
          "document.oneWay": { kind: "array", max: 160_000, element: { cell: 0, dir: "N" } },
          "document.rackRuns": { kind: "array", max: 2000, element: null },
          "document.rackRuns.0.id": { kind: "string", min: 1, max: 24, pattern: SHORT_ID },
          "document.rackRuns.0.levels": { kind: "int", min: 1, max: 12 },
          "document.rackRuns.0.aisle": { kind: "int", min: 1, max: 999 },
          "document.rackRuns.0.pattern": { kind: "string", min: 3, max: 40 },
          "document.rackRuns.0.orientation": { kind: "enum", values: ["h", "v"] },
          "document.depots": { kind: "array", max: 20, element: { id: "D", x: 0, y: 0, name: "Depot" } },
          "document.depots.0.name": { kind: "string", min: 1, max: 60, trimmed: true },
          "document.depots.0.x": { kind: "int", min: 0, max: 399 },
        },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/floor-plans/[id]/publish": {
    POST: {
      params: () => ({ id: "1" }),
      body: {
        example: (f) => ({ version: f.draft.version }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/floor-plans/[id]/versions": { GET: { params: () => ({ id: "1" }) } },
  "/api/floor-plans/[id]/versions/[number]": { GET: { params: () => ({ id: "1", number: "1" }) } },
  "/api/floor-plans/[id]/background": { POST: { params: () => ({ id: "1" }), upload: true } },
  "/api/floor-plans/[id]/background/[fileId]": {
    GET: { params: () => ({ id: "1", fileId: "0123456789abcdef0123456789abcdef" }) },
  },
  "/api/floor-plans/[id]/rack-runs/[runId]/bins": {
    GET: { params: (f) => ({ id: "1", runId: f.draft.runId }) },
    POST: { params: (f) => ({ id: "1", runId: f.draft.runId }), upload: true },
  },
  "/api/layout-versions/[id]/distance": {
    GET: {
      params: (f) => ({ id: String(f.layoutVersionId) }),
      validQuery: "?from=D1&to=D2",
      query: { from: ["", "NO-SUCH-BIN", "x".repeat(5000)], to: ["", "NO-SUCH-BIN"] },
    },
  },
  "/api/jobs/[id]": {
    GET: { params: () => ({ id: "no-such-job" }) },
    DELETE: { params: () => ({ id: "no-such-job" }) },
  },
  "/api/items": { GET: {} },
  "/api/items/export": { GET: {} },
  "/api/orders": { GET: { query: { status: ["zzz", "", "OPEN ", "__proto__", "x".repeat(5000)] } } },
  "/api/orders/[id]": { GET: { params: () => ({ id: "1" }) } },
  "/api/short-picks": {
    GET: {
      query: {
        date: ["yesterday", "2026-13-40", "2026-02-30", "x".repeat(5000)],
        waveId: ["abc", "0", "-1", "9".repeat(30)],
      },
    },
  },
  "/api/short-picks/[lineId]/follow-up": {
    POST: {
      params: () => ({ lineId: "999998" }),
      body: {
        example: () => ({ action: "cancel", version: 1 }),
        fields: { action: { kind: "enum", values: FOLLOW_UP_ACTIONS }, version: id },
        probe: { params: { lineId: "999999" }, status: 404 },
      },
    },
  },
  "/api/replenishments/[id]/clear": {
    POST: {
      params: () => ({ id: "999998" }),
      body: {
        example: () => ({ version: 1 }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/imports/[kind]": { POST: { params: () => ({ kind: "orders" }), upload: true } },
  "/api/imports/[kind]/preview": { POST: { params: () => ({ kind: "items" }), upload: true } },
  "/api/imports/[kind]/template": { GET: { params: () => ({ kind: "orders" }) } },
  "/api/my-batches": { GET: {} },
  "/api/batches/[batchId]/take": {
    POST: {
      params: (f) => ({ batchId: String(f.pickerBatch.id) }),
      body: {
        example: (f) => ({ version: f.pickerBatch.version }),
        fields: { version: id },
        probe: { params: { batchId: "999999" }, status: 404 },
      },
    },
  },
  "/api/batches/[batchId]/give-back": {
    POST: {
      params: (f) => ({ batchId: String(f.pickerBatch.id) }),
      body: {
        example: (f) => ({ version: f.pickerBatch.version }),
        fields: { version: id },
        probe: { params: { batchId: "999999" }, status: 404 },
      },
    },
  },
  "/api/floor": { GET: {} },
  "/api/floor/batches/[batchId]/assign": {
    POST: {
      params: (f) => ({ batchId: String(f.pickerBatch.id) }),
      body: {
        example: (f) => ({ pickerId: f.target.id, version: f.pickerBatch.version }),
        fields: { pickerId: { kind: "string", min: 1, max: 32, trimmed: true, nullable: true }, version: id },
        probe: { params: { batchId: "999999" }, status: 404 },
      },
    },
  },
  "/api/batches/[batchId]/pick": { GET: { params: (f) => ({ batchId: String(f.pickerBatch.id) }) } },
  "/api/batches/[batchId]/confirm": {
    POST: {
      params: (f) => ({ batchId: String(f.pickerBatch.id) }),
      body: {
        example: () => ({
          idempotencyKey: "fuzz-key-000001",
          orderLineId: 1,
          scan: "A-01-1",
          quantity: 2,
          short: { reason: SHORT_REASONS[0] },
          binCode: "A-01-1",
          batchVersion: 1,
        }),
        fields: {
          idempotencyKey: { kind: "string", min: 8, max: 64, trimmed: true },
          orderLineId: id,
          scan: { kind: "string", max: 100 },
          quantity: { kind: "int", min: 0, max: 1_000_000 },
          short: { kind: "enum", values: [] },
          "short.reason": { kind: "enum", values: SHORT_REASONS },
          binCode: { kind: "string", min: 1, max: 100, trimmed: true },
          batchVersion: id,
        },
        probe: { params: { batchId: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves": {
    GET: {},
    POST: {
      body: {
        example: (f) => ({
          name: "Fuzz wave",
          layoutVersionId: f.layoutVersionId,
          settings: {
            totesPerCart: 6,
            maxLines: 40,
            maxWeightG: 100_000,
            depotId: f.depotId,
            dropoffId: f.dropoffId,
            method: "first-come",
          },
          cutoffBefore: "2026-12-01T10:00:00Z",
          priorities: [1, 2],
        }),
        fields: {
          name: { kind: "string", min: 1, max: 120, trimmed: true },
          layoutVersionId: id,
          settings: { kind: "enum", values: [] },
          "settings.totesPerCart": { kind: "int", min: 1, max: 40 },
          "settings.maxLines": { kind: "int", min: 1, max: 500 },
          "settings.maxWeightG": { kind: "int", min: 1000, max: 1_000_000 },
          "settings.depotId": { kind: "string", min: 1, max: 24, pattern: SHORT_ID },
          "settings.dropoffId": { kind: "string", min: 1, max: 24, pattern: SHORT_ID },
          "settings.method": { kind: "enum", values: ["first-come", "savings"] },
          cutoffBefore: { kind: "datetime" },
          priorities: { kind: "array", max: 3, element: 1 },
          "priorities.0": { kind: "int", min: 1, max: 3 },
          includeNoCutoff: { kind: "bool" },
        },
        probe: {
          body: (f) => ({ ...SPECS["/api/waves"]!.POST!.body!.example(f), layoutVersionId: 999999 }),
          status: 404,
        },
      },
    },
  },
  "/api/waves/preview": {
    GET: {
      query: {
        layoutVersionId: ["", "0", "abc", "1.5", "9".repeat(30)],
        cutoffBefore: ["yesterday", "2026-13-40T99:00:00Z"],
        priorities: ["4", "a", "1,,2", "0"],
        includeNoCutoff: ["yes", "2", "true"],
      },
    },
  },
  "/api/waves/[id]": {
    GET: { params: (f) => ({ id: String(f.wave.id) }) },
    PATCH: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({ version: f.wave.version, name: "Fuzzed name", settings: { totesPerCart: 3 } }),
        fields: {
          version: id,
          name: { kind: "string", min: 1, max: 120, trimmed: true },
          "settings.totesPerCart": { kind: "int", min: 1, max: 40 },
          "settings.maxLines": { kind: "int", min: 1, max: 500 },
          "settings.maxWeightG": { kind: "int", min: 1000, max: 1_000_000 },
          "settings.depotId": { kind: "string", min: 1, max: 24, pattern: SHORT_ID },
          "settings.method": { kind: "enum", values: ["first-come", "savings"] },
        },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/orders": {
    GET: { params: (f) => ({ id: String(f.wave.id) }) },
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({
          version: f.wave.version,
          add: [1],
          remove: [2],
          addMatching: { cutoffBefore: "2019-01-01T00:00:00Z" },
          removeMatching: { priorities: [1] },
        }),
        fields: {
          version: id,
          add: { kind: "array", max: 5000, element: 1 },
          "add.0": id,
          "remove.0": id,
          "addMatching.cutoffBefore": { kind: "datetime" },
          "removeMatching.priorities.0": { kind: "int", min: 1, max: 3 },
        },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/batches/[number]/recall": {
    POST: {
      params: (f) => ({ id: String(f.wave.id), number: "1" }),
      body: {
        example: () => ({ version: 1 }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/plan": {
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({ version: f.wave.version }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/release": {
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({ version: f.wave.version }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/discard": {
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({ version: f.wave.version }),
        fields: { version: id },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/plans": {
    GET: { params: (f) => ({ id: String(f.wave.id) }) },
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: (f) => ({ version: f.wave.version, variants: [PLAN_VARIANT, { ...PLAN_VARIANT, method: "savings" }] }),
        fields: {
          version: id,
          variants: { kind: "array", min: 2, max: 4, element: PLAN_VARIANT },
          "variants.0": { kind: "enum", values: [] },
          "variants.0.method": { kind: "enum", values: ["first-come", "savings"] },
          "variants.0.totesPerCart": { kind: "int", min: 1, max: 40 },
          "variants.0.maxLines": { kind: "int", min: 1, max: 500 },
          "variants.0.maxWeightG": { kind: "int", min: 1000, max: 1_000_000 },
        },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/plans/[planId]/keep": {
    POST: {
      // No plan of the fixture wave is made here: a plan id that names none still lets each segment be refused in turn.
      params: (f) => ({ id: String(f.wave.id), planId: "999999" }),
      body: {
        example: (f) => ({ version: f.wave.version }),
        fields: { version: id },
        probe: { params: { planId: "999998" }, status: 404 },
      },
    },
  },
  "/api/waves/[id]/printed": {
    POST: {
      params: (f) => ({ id: String(f.wave.id) }),
      body: {
        example: () => ({ numbers: [1, 2] }),
        fields: {
          numbers: { kind: "array", min: 1, max: 2000, element: 1 },
          "numbers.0": { kind: "int", min: 1, max: 10_000 },
        },
        probe: { params: { id: "999999" }, status: 404 },
      },
    },
  },
};

const BAD_PARAMS = ["abc", "-1", "0", "1.5", "1e999", "1e3", "0x10", " 1", "9".repeat(30), "x".repeat(10 * 1024)];
const BAD_QUERIES = [
  "?__proto__[polluted]=1&constructor[prototype][polluted]=1",
  "?a=1&a=2&a=3",
  `?q=${"x".repeat(10 * 1024)}`,
  "?%E2%82=1",
  "?=&&=",
];
const INVALID_JSON = [
  "{",
  '{"version": }',
  "{'version': 1}",
  '{"version": 1,}',
  "NaN",
  "undefined",
  '{"version": NaN}',
  "\u0000",
  "[1, 2",
];
const NOT_OBJECTS = ["null", "[]", '"text"', "42", "true", "{}"];
const CONTENT_TYPES: [string, string][] = [
  ["text/plain", "version=1"],
  ["application/x-www-form-urlencoded", "version=1&document=x"],
  ["multipart/form-data; boundary=x", '--x\r\nContent-Disposition: form-data; name="version"\r\n\r\n1\r\n--x--\r\n'],
  ["application/xml", "<version>1</version>"],
];

const fill = (pattern: string, params: Record<string, string>) =>
  pattern.replace(/\[([^\]]+)\]/g, (_, name: string) => encodeURIComponent(params[name] ?? "no-such-id"));
const firstRoleFor = (access: Access): Role | null =>
  access === "public" ? null : (ROLES.find((r) => roleMay(r, access)) ?? null);

type Answer = { status: number; body: Record<string, unknown>; type: string };
async function send(
  method: Method,
  url: string,
  cookie: string | null,
  payload?: { text: string; type?: string },
): Promise<Answer> {
  let req = api()[method.toLowerCase() as "get"](url).set("Origin", ORIGIN);
  if (cookie) req = req.set("Cookie", cookie);
  if (payload) req = req.set("Content-Type", payload.type ?? "application/json").send(payload.text);
  const res = await req;
  return {
    status: res.status,
    body: (res.body ?? {}) as Record<string, unknown>,
    type: String(res.headers["content-type"] ?? ""),
  };
}

/** A refusal a person can act on: 4xx, JSON, an error sentence, nothing of the server's insides. */
function expectReadableRefusal(a: Answer, what: string) {
  expect.soft(a.status, what).toBeGreaterThanOrEqual(400);
  expect.soft(a.status, what).toBeLessThan(500);
  expect.soft(a.type, what).toMatch(/application\/json/);
  const error = a.body.error;
  expect.soft(typeof error, what).toBe("string");
  expect.soft((error as string).length, what).toBeGreaterThan(10);
  expect
    .soft(error as string, what)
    .not.toMatch(/\bat .*\(.*:\d+:\d+\)|ER_[A-Z_]+|SQL|undefined|\[object Object\]|TypeError|Cannot read/);
  for (const i of (a.body.issues as { path: string; message: string }[] | undefined) ?? []) {
    expect.soft(typeof i.message, what).toBe("string");
    expect
      .soft(i.message, what)
      .not.toMatch(/\[object Object\]|undefined|^Invalid input|^Too (big|small):|must match pattern/);
  }
}
const isFieldRefusal = (a: Answer) =>
  (a.status === 400 && Array.isArray(a.body.issues) && (a.body.issues as unknown[]).length > 0) || a.status === 413;

const { handlers } = discoverRoutes();
const cases = handlers.flatMap((h) =>
  h.methods.map((m) => ({ url: h.url, method: m as Method, access: API_ACCESS[h.url]?.[m as Method] as Access })),
);
const tried: Record<string, number> = {};
let fixtures: Fixtures;

beforeAll(async () => {
  const cookies = Object.fromEntries(
    await Promise.all(ROLES.map(async (r) => [r, await signInAs(r)] as const)),
  ) as Record<Role, string>;
  const draft = await api().get("/api/floor-plans/1/draft").set("Cookie", cookies.admin);
  const version = await api().get("/api/floor-plans/1/versions/1").set("Cookie", cookies.admin);
  const mine = await api().get("/api/my-batches").set("Cookie", cookies.picker);
  const waves = await api().get("/api/waves").set("Cookie", cookies.planner);
  const target = await makeUser("picker");
  const doc = version.body.version.document ?? draft.body.draft.document;
  const wave = (waves.body.waves as { id: number; version: number; status: string }[]).find(
    (w) => w.status !== "draft",
  )!;
  fixtures = {
    cookies,
    pickerBatch: { id: mine.body.batches[0].id, version: mine.body.batches[0].version },
    draft: {
      version: draft.body.draft.version,
      document: draft.body.draft.document,
      runId: draft.body.draft.document.rackRuns[0].id,
    },
    layoutVersionId: version.body.version.id,
    depotId: doc.depots[0].id,
    dropoffId: (doc.dropoffs[0] ?? doc.depots[0]).id,
    wave: { id: wave.id, version: wave.version },
    target,
  };
});

afterAll(() => {
  const total = Object.values(tried).reduce((a, b) => a + b, 0);
  console.log(`route fuzz: ${total} requests over ${Object.keys(tried).length} handler methods`, tried);
});

describe("every route handler and method has a fuzz spec", () => {
  it("found the handlers", () => expect(cases.length).toBeGreaterThan(30));
  it.each(cases)("$method $url is described here", ({ url, method }) =>
    expect(SPECS[url]?.[method], `add ${method} ${url} to SPECS`).toBeDefined(),
  );
});

describe("hostile input to every route handler: 4xx with a readable error, never 500, nothing written", () => {
  it.each(cases)(
    "$method $url",
    async ({ url, method, access }) => {
      const spec = SPECS[url]![method]!;
      const f = fixtures;
      const role = firstRoleFor(access) ?? (access === "public" ? null : "admin");
      // Signing out ends the session it is sent with, so that route gets one of its own.
      // Sessions are made before the snapshot: signing in writes the user's last sign-in time.
      const spareSessions = spec.signsOut ? await Promise.all(BAD_QUERIES.map(() => signInAs("picker"))) : [];
      const cookie = spec.signsOut ? await signInAs("picker") : role ? f.cookies[role] : null;
      const params = spec.params?.(f) ?? {};
      const at = fill(url, params);
      const before = await databaseSnapshot();
      let n = 0;
      const count = () => (tried[`${method} ${url}`] = ++n);

      // Each dynamic segment in turn gets a value that names nothing; the rest stay real, the body valid.
      for (const name of Object.keys(params)) {
        for (const bad of BAD_PARAMS) {
          const a = await send(
            method,
            fill(url, { ...params, [name]: bad }) + (spec.validQuery ?? ""),
            cookie,
            spec.body ? { text: toJsonText(spec.body.example(f)) } : undefined,
          );
          count();
          expectReadableRefusal(a, `${method} ${url} with ${name}=${bad.slice(0, 40)}`);
          expect.soft(a.status, `${name}=${bad.slice(0, 40)}`).toBe(404);
        }
      }

      if (method === "GET" || spec.signsOut) {
        for (const q of BAD_QUERIES) {
          const a = await send(method, at + q, spec.signsOut ? spareSessions.pop()! : cookie);
          count();
          expect.soft(a.status, `${url}${q.slice(0, 40)}`).toBeLessThan(500);
          if (a.status >= 400) expectReadableRefusal(a, `${url}${q.slice(0, 40)}`);
        }
        for (const [name, values] of Object.entries(spec.query ?? {})) {
          for (const v of values) {
            const others = Object.keys(spec.query ?? {})
              .filter((k) => k !== name)
              .map((k) => `&${k}=A-01-1`)
              .join("");
            const a = await send(method, `${at}?${name}=${encodeURIComponent(v)}${others}`, cookie);
            count();
            expectReadableRefusal(a, `${url}?${name}=${v.slice(0, 40)}`);
          }
        }
      }

      if (spec.upload) {
        // JSON where a form upload belongs, and nothing at all: refused before any of it is read.
        for (const payload of [{ text: toJsonText({ file: "x" }) }, { text: "", type: "text/plain" }]) {
          const a = await send(method, at, cookie, payload);
          count();
          expectReadableRefusal(a, `${url} with ${payload.type ?? "JSON"}`);
        }
      }

      if (spec.body) {
        const b = spec.body;
        const example = b.example(f);
        // The example passes the schema: sent where it cannot write, the handler itself answers.
        const probeAt = fill(url, { ...params, ...b.probe.params });
        const probe = await send(method, probeAt, cookie, { text: toJsonText(b.probe.body?.(f) ?? example) });
        count();
        expect.soft(probe.status, `probe ${JSON.stringify(probe.body).slice(0, 300)}`).toBe(b.probe.status);
        expect.soft(probe.body.issues, "the example body must pass the schema").toBeUndefined();

        const expectFieldRefusal = async (body: unknown, what: string) => {
          const a = await send(method, at, cookie, { text: toJsonText(body) });
          count();
          expectReadableRefusal(a, what);
          expect
            .soft(
              isFieldRefusal(a),
              `${what}: not refused by the schema: ${a.status} ${JSON.stringify(a.body).slice(0, 300)}`,
            )
            .toBe(true);
        };
        for (const [path, kind] of Object.entries(b.fields)) {
          for (const v of badValues(kind))
            await expectFieldRefusal(
              withField(example, path, v),
              `${method} ${url} ${path}=${toJsonText(v)?.slice(0, 60)}`,
            );
        }
        // Huge strings: one past the request cap (413), whatever the field.
        await expectFieldRefusal(
          withField(example, Object.keys(b.fields)[0]!, "x".repeat(300 * 1024)),
          `${url} 300 KiB field`,
        );
        // The whole body moved under __proto__ or constructor.prototype: if either merged, the fields would appear.
        await expectFieldRefusal(protoKeyed(example), `${url} body under __proto__`);
        await expectFieldRefusal(constructorKeyed(example), `${url} body under constructor.prototype`);
        for (const text of NOT_OBJECTS) {
          const a = await send(method, at, cookie, { text });
          count();
          expectReadableRefusal(a, `${url} body ${text}`);
          expect.soft(a.status).toBe(400);
        }
        for (const text of INVALID_JSON) {
          const a = await send(method, at, cookie, { text });
          count();
          expectReadableRefusal(a, `${url} body ${JSON.stringify(text)}`);
          expect.soft(a.status).toBe(400);
        }
        for (const [type, text] of CONTENT_TYPES) {
          const a = await send(method, at, cookie, { text, type });
          count();
          expectReadableRefusal(a, `${url} as ${type}`);
        }
        // Even a body the schema would pass is refused when it does not say it is JSON.
        const asText = await send(method, probeAt, cookie, {
          text: toJsonText(b.probe.body?.(f) ?? example)!,
          type: "text/plain",
        });
        count();
        expectReadableRefusal(asText, `${url} valid body as text/plain`);
        expect.soft(asText.status, `${url} valid body as text/plain`).toBe(415);
        // Random bad values, one field at a time (seeded).
        const fields = Object.entries(b.fields);
        await fc.assert(
          fc.asyncProperty(
            fc
              .integer({ min: 0, max: fields.length - 1 })
              .chain((i) => fc.tuple(fc.constant(fields[i]![0]), badArbitrary(fields[i]![1]))),
            async ([path, v]) =>
              expectFieldRefusal(
                withField(example, path, v),
                `${method} ${url} ${path}=${toJsonText(v)?.slice(0, 60)} (random)`,
              ),
          ),
          { seed: SEED, numRuns: RANDOM_RUNS },
        );
      }

      expect(await databaseSnapshot(), `${method} ${url} wrote to the database`).toEqual(before);
      console.log(`fuzz ${method} ${url}: ${n} requests`);
      if (!spec.signsOut && Object.keys(params).length === 0 && !spec.body && method !== "GET")
        throw new Error(`${method} ${url}: nothing was sent`);
    },
    180_000,
  );
});
