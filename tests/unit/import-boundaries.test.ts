// Layers point one way (docs/design.md, DEVELOPERS.md "Formatting and import boundaries"): pages and
// handlers -> server modules -> db/ and pure libraries. Like the access matrix holds handlers to the
// access table, this holds every source file's imports to the table below.
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  SERVER_ONLY,
  checkBoundaries,
  describeViolation,
  readSourceFiles,
  type BoundaryRule,
  type SourceFiles,
} from "../support/import-boundaries";

// Code that runs anywhere: in the browser editor, in a worker thread, in a unit test.
const PURE = [
  "lib/routing/**",
  "lib/batching/**",
  "lib/floor-plan/**",
  "lib/sheets/**",
  "lib/contracts/**",
  "lib/format/**",
  "lib/cache/**",
  "lib/picking/queue.ts",
  "lib/picking/rules.ts",
  "lib/picking/key.ts",
];
const WEB_AND_SERVER = [
  "next*",
  "react*",
  "node:worker_threads",
  "worker_threads",
  "db/**",
  "app/**",
  "components/**",
  SERVER_ONLY,
];
const WORKER_THREADS = ["node:worker_threads", "worker_threads"];
// Folders and files that are server side as a whole; elsewhere (lib/imports, lib/print, lib/uploads)
// a server module is one that imports server-only.
const SERVER_MODULES = [
  "app/**",
  "components/**",
  "lib/http/**",
  "lib/auth/**",
  "lib/jobs/**",
  "lib/waves/**",
  "lib/layout-versions/**",
  "lib/workers/**",
  "lib/picking/access.ts",
  "lib/picking/confirm.ts",
  "lib/picking/view.ts",
  SERVER_ONLY,
];
// The sheet reader runs the xlsx parser in a throwaway worker it terminates at a time limit, with
// frozen prototypes (xlsx 0.18.5 has open advisories on crafted files): a sandbox, not a pool task.
const SHEET_READER = [
  { file: "lib/sheets/read.ts", why: "server side of the sheets: starts the sandboxed parse worker" },
  { file: "lib/sheets/parse-worker.mjs", why: "the sandboxed parse worker's entry file" },
];

export const RULES: BoundaryRule[] = [
  {
    rule: "pure code imports no web, database, worker threads or server module",
    files: PURE,
    except: SHEET_READER,
    mayNotImport: WEB_AND_SERVER,
  },
  {
    rule: "a component imports neither db/ nor server-only modules",
    files: ["components/**"],
    mayNotImport: ["db/**", SERVER_ONLY],
  },
  {
    rule: "db/ imports no server module",
    files: ["db/**"],
    // The seeds sit above every layer: knex's command line runs them as a client of the app, like scripts/.
    except: [{ file: "db/seeds/**", why: "the demo set-up, built through the app's own server modules" }],
    mayNotImport: SERVER_MODULES,
    unless: ["db/**", "server-only"],
  },
  {
    rule: "only lib/workers uses worker threads",
    files: ["**"],
    except: [
      { file: "lib/workers/**", why: "the pools and their entries" },
      ...SHEET_READER,
      { file: "tests/**", why: "tests drive the pools and workers directly" },
    ],
    mayNotImport: WORKER_THREADS,
  },
  { rule: "lib/ does not import components/", files: ["lib/**"], mayNotImport: ["components/**"] },
];

describe("import boundaries", () => {
  it("hold for every source file", () => {
    const files = readSourceFiles(path.resolve(import.meta.dirname, "../.."));
    expect(Object.keys(files)).toContain("lib/routing/held-karp.ts");
    expect(checkBoundaries(files, RULES).map(describeViolation)).toEqual([]);
  });
});

// The check above passes on an empty answer, so prove on made-up files that every rule fires, and
// that what the rules allow stays allowed.
describe("the import-boundary checker", () => {
  const fine: SourceFiles = {
    "lib/routing/graph.ts": `import { sum } from "./sum";\nexport type { Bin } from "@/lib/floor-plan/bins";`,
    "lib/routing/sum.ts": `export const sum = 1;`,
    "lib/floor-plan/bins.ts": `export type Bin = string;`,
    "lib/sheets/read.ts": `import "server-only";\nimport { Worker } from "node:worker_threads";`,
    "lib/workers/pool.ts": `import { Worker } from "node:worker_threads";\nimport "server-only";`,
    "lib/waves/plan.ts": `import "server-only";\nimport { batches } from "@/db/batches";\nimport { pool } from "../workers/pool";`,
    "db/batches.ts": `import "server-only";\nimport { knex } from "./knex";\nimport type { Bin } from "@/lib/floor-plan/bins";`,
    "db/knex.ts": `import "server-only";`,
    "components/Plan.tsx": [
      `"use client";`,
      `import { useState } from "react";`,
      `import type { Bin } from "@/lib/floor-plan/bins";`,
      `import { label } from "@/lib/client/labels";`,
    ].join("\n"),
    // A type-only import of a server module leaves nothing in the compiled file: not server-only.
    "lib/client/labels.ts": `import type { Plan } from "@/lib/waves/plan";\nexport const label = "";`,
    "app/page.tsx": `import { plan } from "@/lib/waves/plan";\nimport { Plan } from "@/components/Plan";`,
  };

  it("passes files that keep to the rules", () => {
    expect(checkBoundaries(fine, RULES)).toEqual([]);
  });

  // [importing file, the import, the file's text, the index in RULES of the rule it breaks]
  const BREACHES: [string, string, string, number][] = [
    ["lib/routing/bad.ts", "next/link", `import Link from "next/link";`, 0],
    ["lib/routing/bad.ts", "react", `import { useMemo } from "react";`, 0],
    ["lib/routing/bad.ts", "node:worker_threads", `import { parentPort } from "node:worker_threads";`, 0],
    ["lib/batching/bad.ts", "@/db/batches", `import type { Batch } from "@/db/batches";`, 0],
    ["lib/floor-plan/bad.ts", "../../components/Plan", `export { Plan } from "../../components/Plan";`, 0],
    ["lib/format/bad.ts", "@/app/page", `const page = await import("@/app/page");`, 0],
    ["lib/picking/queue.ts", "@/lib/waves/plan", `import { plan } from "@/lib/waves/plan";`, 0],
    ["lib/cache/bad.ts", "server-only", `import "server-only";`, 0],
    ["lib/sheets/columns.ts", "./read", `import { readSheet } from "./read";`, 0],
    ["components/Bad.tsx", "@/db/batches", `import type { Batch } from "@/db/batches";`, 1],
    ["components/Bad.tsx", "../db/batches", `type Batch = import("../db/batches").Batch;`, 1],
    ["components/Bad.tsx", "@/lib/waves/plan", `import { plan } from "@/lib/waves/plan";`, 1],
    [
      "components/Bad.tsx",
      "@/lib/workers/pool",
      `import { label } from "@/lib/client/labels";\nimport { pool } from "@/lib/workers/pool";\nexport { label };`,
      1,
    ],
    ["db/bad.ts", "@/lib/http/errors", `import { HttpError } from "@/lib/http/errors";`, 2],
    ["db/bad.ts", "../lib/waves/plan", `const { plan } = require("../lib/waves/plan");`, 2],
    ["db/bad.ts", "@/lib/waves/plan", `import plan = require("@/lib/waves/plan");`, 2],
    ["app/api/bad/route.ts", "worker_threads", `import { Worker } from "worker_threads";`, 3],
    ["lib/print/bad.ts", "@/components/Plan", `import type { PickListProps } from "@/components/Plan";`, 4],
  ];

  it("has a breach for every rule", () => {
    expect(new Set(BREACHES.map(([, , , rule]) => rule)).size).toBe(RULES.length);
  });

  it.each(BREACHES)("flags %s importing %s", (file, specifier, text, rule) => {
    const found = checkBoundaries({ ...fine, [file]: text }, RULES);
    expect(found.map((v) => [v.file, v.specifier])).toContainEqual([file, specifier]);
    expect(found.filter((v) => v.file === file && v.specifier === specifier).map((v) => v.rule)).toContain(
      RULES[rule]!.rule,
    );
  });

  it("says which file, which import and which rule", () => {
    const [violation] = checkBoundaries({ ...fine, "components/Bad.tsx": `import { knex } from "@/db/knex";` }, RULES);
    expect(describeViolation(violation!)).toBe(
      "components/Bad.tsx -> @/db/knex [db/knex.ts] (a component imports neither db/ nor server-only modules)",
    );
  });
});
