// The import-boundary checker behind tests/unit/import-boundaries.test.ts. It reads imports with
// TypeScript's own parser (TypeScript 7 offers it through the tsgo API only), from an in-memory copy
// of the files, so the self-check of the rules runs the same code on made-up files as on the repository.
import fs from "node:fs";
import path from "node:path";
import { API } from "typescript/unstable/sync";
import { createVirtualFileSystem } from "typescript/unstable/fs";
import { SyntaxKind, type Node } from "typescript/unstable/ast";

/** Repository-relative paths with forward slashes, and the text of each file. */
export type SourceFiles = Record<string, string>;

/**
 * Patterns name what a file imports: a repository path ("db/**" a folder, "lib/picking/view.ts" a
 * file) or a package specifier ("next*" anything starting with next, "node:worker_threads" exactly).
 * SERVER_ONLY stands for the `server-only` package and every repository file that imports it,
 * directly or through other files: such a module cannot load in a browser or a worker.
 */
export const SERVER_ONLY = "<server-only module>";

export type BoundaryRule = {
  /** Shown with each violation: what the rule protects. */
  rule: string;
  /** The files the rule holds to, as repository path patterns. */
  files: string[];
  /** Files inside `files` that the rule leaves alone, each with the reason. */
  except?: { file: string; why: string }[];
  mayNotImport: string[];
  /** Imports matching `mayNotImport` that are fine after all (e.g. db/ importing db/). */
  unless?: string[];
};

export type Violation = { file: string; specifier: string; target: string; rule: string };

/** One import of a file; a type-only one is erased when the file is compiled. */
export type ImportRef = { specifier: string; typeOnly: boolean };

const SOURCE_EXTENSIONS = [".ts", ".tsx", ".mts", ".mjs", ".js", ".cjs"];
const SKIPPED_FOLDERS = new Set(["node_modules", ".git", ".data", "coverage", "public"]);

/** Every source file under root, outside build output, data and installed packages. */
export function readSourceFiles(root: string): SourceFiles {
  const files: SourceFiles = {};
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
      const rel = dir ? `${dir}/${entry.name}` : entry.name;
      if (entry.isDirectory()) {
        if (!SKIPPED_FOLDERS.has(entry.name) && !entry.name.startsWith(".next") && rel !== "tests/artifacts") walk(rel);
      } else if (SOURCE_EXTENSIONS.includes(path.extname(entry.name)) && !entry.name.endsWith(".d.ts")) {
        files[rel] = fs.readFileSync(path.join(root, rel), "utf8");
      }
    }
  };
  walk("");
  return files;
}

/** Each file's imports: import, export … from, import x = require, import(), require(), import("…") types. */
export function readImports(files: SourceFiles): Map<string, ImportRef[]> {
  const names = Object.keys(files);
  const root = "/repo";
  const virtual: Record<string, string> = {};
  for (const name of names) virtual[`${root}/${name}`] = files[name]!;
  // Parsing only: no libraries, no module resolution (this checker resolves), JavaScript files included.
  virtual[`${root}/tsconfig.json`] = JSON.stringify({
    compilerOptions: { allowJs: true, noLib: true, noResolve: true, types: [], jsx: "preserve" },
    files: names.map((name) => `./${name}`),
  });
  const api = new API({ cwd: root, fs: createVirtualFileSystem(virtual) });
  try {
    const program = api.updateSnapshot({ openProjects: [`${root}/tsconfig.json`] }).getProjects()[0]!.program;
    const result = new Map<string, ImportRef[]>();
    for (const name of names) {
      const sourceFile = program.getSourceFile(`${root}/${name}`);
      if (!sourceFile) throw new Error(`TypeScript did not parse ${name}`);
      const refs: ImportRef[] = [];
      const visit = (node: Node): undefined => {
        const specifier = moduleSpecifierOf(node);
        if (specifier !== undefined) refs.push({ specifier, typeOnly: isTypeOnly(node) });
        node.forEachChild(visit);
        return undefined;
      };
      sourceFile.forEachChild(visit);
      result.set(name, refs);
    }
    return result;
  } finally {
    api.close();
  }
}

function stringLiteral(node: Node | undefined): string | undefined {
  if (!node) return undefined;
  if (node.kind === SyntaxKind.StringLiteral || node.kind === SyntaxKind.NoSubstitutionTemplateLiteral) {
    return (node as unknown as { text: string }).text;
  }
  return undefined;
}

function moduleSpecifierOf(node: Node): string | undefined {
  const n = node as unknown as Record<string, Node | undefined> & { arguments?: readonly Node[] };
  switch (node.kind) {
    case SyntaxKind.ImportDeclaration:
    case SyntaxKind.ExportDeclaration:
      return stringLiteral(n.moduleSpecifier);
    case SyntaxKind.ExternalModuleReference:
      return stringLiteral(n.expression);
    case SyntaxKind.ImportType:
      return n.argument?.kind === SyntaxKind.LiteralType
        ? stringLiteral((n.argument as unknown as { literal: Node }).literal)
        : undefined;
    case SyntaxKind.CallExpression: {
      const callee = n.expression!;
      const isImport = callee.kind === SyntaxKind.ImportKeyword;
      const isRequire =
        callee.kind === SyntaxKind.Identifier && (callee as unknown as { text: string }).text === "require";
      return isImport || isRequire ? stringLiteral(n.arguments?.[0]) : undefined;
    }
    default:
      return undefined;
  }
}

function isTypeOnly(node: Node): boolean {
  const n = node as unknown as {
    isTypeOnly?: boolean;
    importClause?: {
      isTypeOnly: boolean;
      name?: Node;
      namedBindings?: { elements?: readonly { isTypeOnly: boolean }[] };
    };
  };
  if (node.kind === SyntaxKind.ImportType || n.isTypeOnly) return true;
  const clause = n.importClause;
  if (!clause) return false;
  const elements = clause.namedBindings?.elements;
  // `import { type A, type B }` is erased as a whole, like `import type { A, B }`.
  return (
    clause.isTypeOnly || (!clause.name && !!elements && elements.length > 0 && elements.every((e) => e.isTypeOnly))
  );
}

/**
 * What a specifier names: the repository file it resolves to ("@/" is the root, as in tsconfig),
 * the normalised path when no such file exists, or the package specifier itself.
 */
export function resolveImport(from: string, specifier: string, files: SourceFiles): string {
  let base: string;
  if (specifier.startsWith("@/")) base = specifier.slice(2);
  else if (specifier.startsWith("./") || specifier.startsWith("../"))
    base = path.posix.join(path.posix.dirname(from), specifier);
  else return specifier;
  const candidates = [
    base,
    ...SOURCE_EXTENSIONS.map((ext) => base + ext),
    ...SOURCE_EXTENSIONS.map((ext) => `${base}/index${ext}`),
  ];
  return candidates.find((candidate) => candidate in files) ?? base;
}

/** Glob-like: "**" is everything, "x/**" everything under x/, a trailing "*" any continuation, otherwise exact. */
export function matches(pattern: string, name: string): boolean {
  if (pattern === "**") return true;
  if (pattern.endsWith("/**")) return name.startsWith(pattern.slice(0, -2));
  if (pattern.endsWith("*")) return name.startsWith(pattern.slice(0, -1));
  return name === pattern;
}

/**
 * Repository files that import `server-only`, directly or through other repository files' imports
 * that stay in the compiled code (a type-only import of one does not make a file server-only).
 */
function serverOnlyFiles(imports: Map<string, ImportRef[]>, targets: Map<string, string[]>): Set<string> {
  const serverOnly = new Set<string>();
  for (const [file, refs] of imports) if (refs.some((r) => r.specifier === "server-only")) serverOnly.add(file);
  for (let grew = true; grew;) {
    grew = false;
    for (const [file, fileTargets] of targets) {
      const refs = imports.get(file)!;
      if (!serverOnly.has(file) && fileTargets.some((t, i) => !refs[i]!.typeOnly && serverOnly.has(t))) {
        serverOnly.add(file);
        grew = true;
      }
    }
  }
  return serverOnly;
}

/** Every import that breaks a rule, as "file -> specifier (rule)" material, in a stable order. */
export function checkBoundaries(files: SourceFiles, rules: BoundaryRule[]): Violation[] {
  const imports = readImports(files);
  const targets = new Map<string, string[]>();
  for (const [file, refs] of imports)
    targets.set(
      file,
      refs.map((r) => resolveImport(file, r.specifier, files)),
    );
  const serverOnly = serverOnlyFiles(imports, targets);
  const forbids = (pattern: string, target: string) =>
    pattern === SERVER_ONLY ? target === "server-only" || serverOnly.has(target) : matches(pattern, target);

  const violations: Violation[] = [];
  for (const [file, refs] of imports) {
    for (const rule of rules) {
      if (!rule.files.some((p) => matches(p, file)) || rule.except?.some((e) => matches(e.file, file))) continue;
      refs.forEach(({ specifier }, i) => {
        const target = targets.get(file)![i]!;
        if (rule.unless?.some((p) => matches(p, target))) return;
        if (rule.mayNotImport.some((p) => forbids(p, target)))
          violations.push({ file, specifier, target, rule: rule.rule });
      });
    }
  }
  return violations.sort((a, b) => a.file.localeCompare(b.file) || a.specifier.localeCompare(b.specifier));
}

export function describeViolation(v: Violation): string {
  const shown = v.target === v.specifier ? v.specifier : `${v.specifier} [${v.target}]`;
  return `${v.file} -> ${shown} (${v.rule})`;
}
