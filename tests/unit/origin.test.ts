import { describe, expect, it } from "vitest";
import { originAllowed } from "@/lib/http/origin";
import { safeNextPath } from "@/lib/http/next-path";

const h = (o: Record<string, string>) => new Headers(o);

describe("originAllowed", () => {
  it("lets reads through without an Origin", () => expect(originAllowed("GET", h({ host: "a:3000" }))).toBe(true));
  it("refuses a POST without Origin", () => expect(originAllowed("POST", h({ host: "a:3000" }))).toBe(false));
  it("refuses a foreign Origin", () => expect(originAllowed("DELETE", h({ host: "a:3000", origin: "http://b:3000" }))).toBe(false));
  it("refuses another port on the same host", () => expect(originAllowed("PATCH", h({ host: "a:3000", origin: "http://a:3001" }))).toBe(false));
  it("accepts our own Origin", () => expect(originAllowed("POST", h({ host: "a:3000", origin: "http://a:3000" }))).toBe(true));
});

describe("safeNextPath", () => {
  it.each(["//evil.example", "https://evil.example", "/\\evil.example", "/api/users", "/sign-in?next=/x", ""])("drops %s", (p) =>
    expect(safeNextPath(p)).toBeNull(),
  );
  it("keeps a local path", () => expect(safeNextPath("/admin/users?x=1")).toBe("/admin/users?x=1"));
});
