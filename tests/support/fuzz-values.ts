import fc from "fast-check";

/**
 * What a field of a JSON body may hold, as the test understands the route: the generators below
 * produce only values outside it, so every request they build is really invalid. A value the server
 * accepts anyway means the route's schema is looser than this says.
 */
export type FieldKind =
  | { kind: "int"; min: number; max: number }
  | { kind: "number"; min: number; max: number; above?: boolean }
  | { kind: "string"; min?: number; max: number; trimmed?: boolean; pattern?: RegExp; nullable?: boolean }
  | { kind: "enum"; values: readonly (string | number)[] }
  | { kind: "bool" }
  | { kind: "email" }
  | { kind: "datetime" }
  | { kind: "array"; max: number; min?: number; element: unknown };

/** A number literal JSON.stringify cannot write (1e999 parses as Infinity). */
export class RawJson {
  constructor(readonly text: string) {}
  toJSON() {
    return `@@RAW:${this.text}@@`;
  }
}
export const toJsonText = (v: unknown) => JSON.stringify(v).replace(/"@@RAW:(.*?)@@"/g, "$1");

/** An object whose own key is "__proto__" (JSON.parse makes one; an object literal would set the prototype). */
export const protoKeyed = (inner: unknown) =>
  JSON.parse(`{"__proto__": ${toJsonText(inner)}}`) as Record<string, unknown>;
export const constructorKeyed = (inner: unknown) => ({ constructor: { prototype: inner } });

// Values of the wrong JSON type for every kind; null is wrong everywhere (no field here is nullable).
const NOT_A_NUMBER = [
  "1",
  "NaN",
  "Infinity",
  "-1",
  "",
  true,
  false,
  null,
  [],
  [1],
  {},
  protoKeyed({ polluted: 1 }),
  constructorKeyed({ polluted: 1 }),
];
const NOT_A_STRING = [
  1,
  0,
  -1,
  true,
  null,
  [],
  ["a"],
  {},
  { toString: "x" },
  protoKeyed({ polluted: 1 }),
  constructorKeyed({ polluted: 1 }),
];
const NOT_A_BOOL = ["true", "false", 1, 0, null, [], {}, protoKeyed({ polluted: 1 })];
const NOT_AN_ARRAY = ["1,2", 1, true, null, {}, { 0: 1, length: 1 }, protoKeyed([1])];
const BIG = [new RawJson("1e999"), new RawJson("-1e999"), 1e308, 2 ** 53, 2 ** 53 + 2, 1e20, 2 ** 31];

/** Letters that survive trim() and match no pattern with a length limit below them. */
const word = (n: number) => "x".repeat(n);

export function badValues(k: FieldKind): unknown[] {
  switch (k.kind) {
    case "int":
      return [
        ...NOT_A_NUMBER,
        k.min - 1,
        k.max + 1,
        k.min - 0.5,
        k.min + 0.5,
        k.max - 0.5,
        -1,
        ...(k.min > 0 ? [0] : []),
        -1e20,
        ...BIG.filter((b) => typeof b !== "number" || b > k.max),
      ];
    case "number":
      return [...NOT_A_NUMBER, ...(k.above ? [k.min] : []), k.min - 1, -1e-9 + k.min, k.max * 10, k.max + 1e-6, ...BIG];
    case "string": {
      const min = k.min ?? 0;
      return [
        // A nullable field (a batch assigned to nobody) takes null: every other wrong type still applies.
        ...NOT_A_STRING.filter((v) => !(k.nullable && v === null)),
        ...(min > 0 ? ["", ...(k.trimmed ? [" ".repeat(min + 2), "\t\n"] : [])] : []),
        ...(min > 1 ? [word(min - 1)] : []),
        word(k.max + 1),
        word(5000),
        ...(k.pattern ? ["has space and ü!", "a\u0000b", "../../etc/passwd"].filter((s) => !k.pattern!.test(s)) : []),
      ];
    }
    case "enum":
      return [
        ...NOT_A_STRING.filter((v) => !k.values.includes(v as never)),
        "",
        "not-one-of-them",
        String(k.values[0]).toUpperCase() + "X",
        ` ${String(k.values[0])}`,
      ];
    case "bool":
      return NOT_A_BOOL;
    case "email":
      return [
        ...NOT_A_STRING,
        "",
        "not-an-email",
        "a@",
        "@b.example",
        "a b@c.example",
        `${word(250)}@tests.example`,
        "x@y.example\r\nBcc: z@y.example",
      ];
    case "datetime":
      return [
        ...NOT_A_STRING,
        "",
        "tomorrow",
        "2026-13-45T99:99:99Z",
        "2026-12-01",
        "2026-12-01T10:00:00",
        "0000-00-00T00:00:00Z",
      ];
    case "array":
      return [
        ...NOT_AN_ARRAY,
        ...((k.min ?? 0) > 0 ? [[]] : []),
        Array.from({ length: k.max + 1 }, () => k.element),
        [null],
        [[k.element]],
        [protoKeyed(k.element)],
      ];
  }
}

const jsonJunk = fc.oneof(
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.jsonValue(), { maxLength: 3 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue(), { maxKeys: 3 }),
);
const noSpace = (n: { minLength: number; maxLength: number }) =>
  fc.string({ unit: fc.constantFrom(..."abcXYZ019-_."), ...n });

/** Random values outside the kind, for fast-check. */
export function badArbitrary(k: FieldKind): fc.Arbitrary<unknown> {
  switch (k.kind) {
    case "int":
      return fc.oneof(
        fc.integer({ max: k.min - 1 }),
        // fc.integer stops at 2^31 - 1; past it, count up from the limit.
        fc.maxSafeNat().map((n) => k.max + 1 + n),
        fc.double({ min: k.min, max: k.max, noNaN: true }).filter((x) => !Number.isInteger(x)),
        fc.double({ min: k.max + 1, max: 1e300, noNaN: true }),
        fc.string({ maxLength: 12 }),
        jsonJunk,
      );
    case "number":
      return fc.oneof(
        fc.double({ max: k.min, noNaN: true, maxExcluded: !k.above }),
        fc.double({ min: k.max, noNaN: true, minExcluded: true }),
        fc.string({ maxLength: 12 }),
        jsonJunk,
      );
    case "string":
      return fc.oneof(
        noSpace({ minLength: k.max + 1, maxLength: k.max + 200 }),
        ...(k.min ? [noSpace({ minLength: 0, maxLength: k.min - 1 })] : []),
        ...(k.pattern ? [fc.string({ minLength: 1, maxLength: 30 }).filter((s) => !k.pattern!.test(s))] : []),
        fc.integer(),
        fc.double(),
        k.nullable ? jsonJunk.filter((v) => v !== null) : jsonJunk,
      );
    case "enum":
      return fc.oneof(
        fc.string({ maxLength: 20 }).filter((s) => !k.values.includes(s)),
        fc.integer().filter((n) => !k.values.includes(n)),
        jsonJunk,
      );
    case "bool":
      return fc.oneof(fc.string(), fc.integer(), fc.constant(null), fc.array(fc.boolean()));
    case "email":
      return fc.oneof(
        fc.string({ maxLength: 40 }).filter((s) => !/^[^@\s]+@[^@\s]+\.[a-z]{2,}$/i.test(s.trim())),
        fc.integer(),
        jsonJunk,
      );
    case "datetime":
      return fc.oneof(
        fc.string({ maxLength: 30 }).filter((s) => !/^\d{4}-\d\d-\d\dT\d\d:\d\d/.test(s)),
        fc.integer(),
        jsonJunk,
      );
    case "array":
      return fc.oneof(
        fc.string(),
        fc.integer(),
        fc.constant(null),
        fc.dictionary(fc.string({ maxLength: 4 }), fc.jsonValue(), { maxKeys: 3 }),
        fc.array(jsonJunk, { minLength: 1, maxLength: 3 }),
      );
  }
}

/** A copy of the body with the value at a dotted path ("settings.depotId", "document.rackRuns.0.levels") replaced. */
export function withField(body: unknown, dotted: string, value: unknown): unknown {
  const copy = structuredClone(body) as Record<string, unknown>;
  const keys = dotted.split(".");
  let at: Record<string, unknown> = copy;
  for (const k of keys.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[keys.at(-1)!] = value;
  return copy;
}
