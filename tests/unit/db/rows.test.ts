import { describe, expect, it } from "vitest";
import { chunks, CHUNK_ROWS, isDuplicateKey, iso, json } from "@/db/rows";

describe("row helpers", () => {
  it("reads a JSON column whether the driver gave text or a parsed value", () => {
    expect(json<{ a: number }>('{"a":1}')).toEqual({ a: 1 });
    expect(json<{ a: number }>({ a: 1 })).toEqual({ a: 1 });
    expect(json<number[]>("[]")).toEqual([]);
  });

  it("writes instants as ISO text and keeps null", () => {
    const d = new Date("2026-12-02T08:30:00.123Z");
    expect(iso(d)).toBe("2026-12-02T08:30:00.123Z");
    expect(iso("2026-12-02T08:30:00.123Z")).toBe("2026-12-02T08:30:00.123Z");
    expect(iso(null)).toBeNull();
  });

  it("knows MariaDB's duplicate-key refusal by code or by number, and nothing else", () => {
    expect(isDuplicateKey({ code: "ER_DUP_ENTRY" })).toBe(true);
    expect(isDuplicateKey({ errno: 1062 })).toBe(true);
    expect(isDuplicateKey({ code: "ER_LOCK_DEADLOCK", errno: 1213 })).toBe(false);
    expect(isDuplicateKey(new Error("boom"))).toBe(false);
    expect(isDuplicateKey(null)).toBe(false);
    expect(isDuplicateKey(undefined)).toBe(false);
  });

  it("slices lists in order, each slice at most the size, none empty", () => {
    expect(chunks([])).toEqual([]);
    expect(chunks([1, 2, 3, 4, 5], 2)).toEqual([[1, 2], [3, 4], [5]]);
    const many = Array.from({ length: CHUNK_ROWS * 2 + 1 }, (_, i) => i);
    const parts = chunks(many);
    expect(parts.map((p) => p.length)).toEqual([CHUNK_ROWS, CHUNK_ROWS, 1]);
    expect(parts.flat()).toEqual(many);
  });
});
