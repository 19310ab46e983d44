import { describe, expect, it } from "vitest";
import { z } from "zod";
import { idParam, parseId, textParam } from "@/lib/http/params";
import { wentThrough } from "@/lib/http/repeat";

describe("the one id rule for URLs", () => {
  it("takes one to nine digits naming a positive number", () => {
    expect(parseId("1")).toBe(1);
    expect(parseId("007")).toBe(7);
    expect(parseId("999999999")).toBe(999_999_999);
  });

  it.each(["", "0", "000", "-1", "1.5", "1e3", " 1", "1 ", "0x10", "1234567890", "١٢"])("refuses %j", (raw) => {
    expect(parseId(raw)).toBeNull();
  });

  it("refuses what is not a single string", () => {
    expect(parseId(undefined)).toBeNull();
    expect(parseId(["1"])).toBeNull();
    expect(parseId(1)).toBeNull();
  });

  it("as a route param schema: the number, or the 404 message that names the record", () => {
    const params = z.object({ id: idParam("wave"), number: idParam("batch") });
    expect(params.parse({ id: "12", number: "3" })).toEqual({ id: 12, number: 3 });
    const bad = params.safeParse({ id: "12", number: "x" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toBe("No such batch. Check the link or go back to the list.");
  });

  it("text params are the string, or empty", () => {
    const params = z.object({ runId: textParam() });
    expect(params.parse({ runId: "r1" })).toEqual({ runId: "r1" });
    expect(params.parse({})).toEqual({ runId: "" });
  });
});

describe("a repeat of a write that went through", () => {
  const stored = { version: 4, holder: "ann" };

  it("is one when the stored record is what the write leaves, one version on", () => {
    expect(wentThrough(stored, (s) => s.holder === "ann", 3)).toBe(true);
  });

  it("is not one when the version moved by more, or the record differs", () => {
    expect(wentThrough(stored, (s) => s.holder === "ann", 2)).toBe(false);
    expect(wentThrough(stored, (s) => s.holder === "bob", 3)).toBe(false);
    expect(wentThrough(null, () => true, 3)).toBe(false);
  });

  it("without a sent version only the stored record decides", () => {
    expect(wentThrough(stored, (s) => s.holder === "ann")).toBe(true);
  });
});

describe("a missing id param", () => {
  it("is the same 404 message as a mangled one", () => {
    const bad = z.object({ id: idParam("wave") }).safeParse({});
    expect(bad.error?.issues[0]?.message).toBe("No such wave. Check the link or go back to the list.");
  });
});
