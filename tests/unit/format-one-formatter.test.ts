// Every date and time a person reads goes through lib/format/dates.ts (the site's zone, date order
// and clock). This walks the source and fails on a date written any other way, so it stays fixed.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "../..");
const FOLDERS = ["app", "components", "lib", "db"];

// Allowed, each with its reason. None now: a zone's offset for a typed cut-off comes from lib/format/zone.ts.
const ALLOWED: { file: string; why: string }[] = [];

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) {
      if (rel === path.join("lib", "format") || e.name === "node_modules") continue;
      out.push(...sourceFiles(rel));
    } else if (/\.(ts|tsx|mts)$/.test(e.name) && !e.name.endsWith(".d.ts")) out.push(rel);
  }
  return out;
}

const DATE_OPTION = /\b(dateStyle|timeStyle|timeZone|year|month|day|weekday|hour|minute|second|hour12|hourCycle)\b/;
const DATE_NAME = /^(d|date\w*|when|at|now|time\w*|\w*At|\w*Date)$/i;

/** Comments out, so a comment naming toLocaleString is no call. */
const code = (text: string) =>
  text.replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, " ")).replace(/(^|[^:"'`])\/\/.*$/gm, "$1");

/** From the index of an opening or closing bracket, the index of its partner. */
function partner(text: string, at: number): number {
  const open = text[at] === "(" ? "(" : ")";
  const close = open === "(" ? ")" : "(";
  const step = open === "(" ? 1 : -1;
  let depth = 0;
  for (let i = at; i >= 0 && i < text.length; i += step) {
    if (text[i] === open) depth++;
    else if (text[i] === close && --depth === 0) return i;
  }
  return -1;
}

/** Each toLocale…String call that writes a date, judged by its receiver and its options. */
export function dateCalls(text: string): string[] {
  const src = code(text);
  const hits: string[] = [];
  for (const m of src.matchAll(/\.\s*(toLocale(?:Date|Time)?String)\s*\(/g)) {
    const method = m[1]!;
    const dot = m.index!;
    const argsOpen = dot + m[0].length - 1;
    const args = src.slice(argsOpen, Math.max(argsOpen, partner(src, argsOpen)) + 1);
    let date = method !== "toLocaleString" || DATE_OPTION.test(args);
    if (!date) {
      let i = dot - 1;
      while (i >= 0 && /\s/.test(src[i]!)) i--;
      let receiver: string;
      if (src[i] === ")") {
        const o = partner(src, i);
        const before = src.slice(0, Math.max(0, o)).match(/(new\s+)?([A-Za-z_$][\w$.]*)\s*$/);
        receiver = `${before?.[0] ?? ""}${src.slice(o, i + 1)}`;
        date = /new\s+Date\s*\(/.test(receiver) || (!!before?.[2] && DATE_NAME.test(before[2].split(".").pop()!));
      } else {
        receiver = src.slice(0, i + 1).match(/[A-Za-z_$][\w$]*[?!]?$/)?.[0] ?? "";
        date = DATE_NAME.test(receiver.replace(/[?!]$/, ""));
      }
    }
    if (date) hits.push(`${src.slice(0, dot).split("\n").length} ${method}`);
  }
  for (const m of src.matchAll(/\bDateTimeFormat\b/g))
    hits.push(`${src.slice(0, m.index).split("\n").length} Intl.DateTimeFormat`);
  return hits;
}

export function dateFormattingOutsideLibFormat(): string[] {
  return FOLDERS.flatMap(sourceFiles).flatMap((rel) =>
    dateCalls(fs.readFileSync(path.join(ROOT, rel), "utf8")).map((h) => `${rel}:${h}`),
  );
}

describe("one date formatter everywhere", () => {
  it("no screen, mail, print or message writes a date except through lib/format/dates", () => {
    const allowed = new Set(ALLOWED.map((a) => path.normalize(a.file)));
    const offending = dateFormattingOutsideLibFormat().filter((f) => !allowed.has(f.split(":")[0]!));
    expect(offending).toEqual([]);
  });

  it("would notice one (the check itself can fail)", () => {
    const probe = (text: string) => dateCalls(text).map((h) => h.split(" ")[1]);
    expect(probe(`new Date(x).toLocaleString("en-GB")`)).toEqual(["toLocaleString"]);
    expect(probe(`d.toLocaleString(undefined, { dateStyle: "medium" })`)).toEqual(["toLocaleString"]);
    expect(probe(`row.cutoffAt.toLocaleString()`)).toEqual(["toLocaleString"]);
    expect(probe(`x.toLocaleDateString()`)).toEqual(["toLocaleDateString"]);
    // Numbers may keep their own thousands separators.
    expect(probe(`orders.length.toLocaleString("en-GB")`)).toEqual([]);
    expect(probe(`(mm / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })`)).toEqual([]);
    expect(probe(`// new Date(x).toLocaleString()`)).toEqual([]);
    expect(probe(`new Intl.DateTimeFormat("en-GB", { hour: "2-digit" }).format(at)`)).toEqual(["Intl.DateTimeFormat"]);
  });

  it("allows only files that still need it", () => {
    const hits = new Set(dateFormattingOutsideLibFormat().map((f) => f.split(":")[0]));
    for (const a of ALLOWED.filter((x) => !x.why.startsWith("pending")))
      expect(hits.has(path.normalize(a.file))).toBe(true);
  });
});
