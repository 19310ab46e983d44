import { describe, expect, it } from "vitest";
import { originAllowed, parsePublicOrigins } from "@/lib/http/origin";
import { safeNextPath } from "@/lib/http/next-path";

const h = (o: Record<string, string>) => new Headers(o);

describe("originAllowed", () => {
  const site = ["http://a:3000"];
  it("lets reads through without an Origin", () =>
    expect(originAllowed("GET", h({ host: "a:3000" }), site)).toBe(true));
  it("refuses a POST without Origin", () => expect(originAllowed("POST", h({ host: "a:3000" }), site)).toBe(false));
  it("refuses a foreign Origin", () =>
    expect(originAllowed("DELETE", h({ host: "a:3000", origin: "http://b:3000" }), site)).toBe(false));
  it("refuses another port on the same host", () =>
    expect(originAllowed("PATCH", h({ host: "a:3000", origin: "http://a:3001" }), site)).toBe(false));
  it("accepts our own Origin", () =>
    expect(originAllowed("POST", h({ host: "a:3000", origin: "http://a:3000" }), site)).toBe(true));
  // The Host header is the client's to choose: a foreign page's request that names its own host
  // there must not pass.
  it("refuses a foreign Origin even when the Host header names the same foreign host", () =>
    expect(originAllowed("POST", h({ host: "evil.example", origin: "http://evil.example" }), site)).toBe(false));
  it("accepts our Origin whatever the Host header says (a proxy may rewrite it)", () =>
    expect(originAllowed("POST", h({ host: "10.0.0.5:3000", origin: "http://a:3000" }), site)).toBe(true));
  it("refuses https on a plain-HTTP site", () =>
    expect(originAllowed("POST", h({ host: "a:3000", origin: "https://a:3000" }), site)).toBe(false));
  it("refuses http on an HTTPS site", () =>
    expect(originAllowed("POST", h({ host: "a.example", origin: "http://a.example" }), ["https://a.example"])).toBe(
      false,
    ));
  it("accepts any origin of the configured list", () =>
    expect(
      originAllowed("POST", h({ origin: "http://handheld.lan:3000" }), ["http://a:3000", "http://handheld.lan:3000"]),
    ).toBe(true));
  // Browsers send an origin serialised: scheme, lower-case host, port, nothing else.
  it.each([
    "null",
    "http://a:3000.evil.example",
    "http://a:3000/",
    "http://a:3000/x",
    "not a url",
    "http://user@a:3000",
  ])("refuses the Origin %j", (origin) => expect(originAllowed("POST", h({ origin }), site)).toBe(false));
  it("matches host names without regard to letter case, as browsers send them", () =>
    expect(originAllowed("POST", h({ origin: "http://a:3000" }), parsePublicOrigins("http://A:3000"))).toBe(true));
});

describe("parsePublicOrigins (APP_ORIGIN)", () => {
  it("takes one origin, or a comma-separated list, the first being where mail links point", () => {
    expect(parsePublicOrigins("http://127.0.0.1:3000")).toEqual(["http://127.0.0.1:3000"]);
    expect(parsePublicOrigins(" http://127.0.0.1:3000/ , http://handheld.lan:3000 ")).toEqual([
      "http://127.0.0.1:3000",
      "http://handheld.lan:3000",
    ]);
    expect(parsePublicOrigins("https://trailbin.example:443")).toEqual(["https://trailbin.example"]);
  });
  it.each([
    ["", /APP_ORIGIN is not set/],
    [" , ", /APP_ORIGIN is not set/],
    ["127.0.0.1:3000", /http:\/\/ or https:\/\//],
    ["ftp://a.example", /http:\/\/ or https:\/\//],
    ["http://a.example/trailbin", /no path/],
    ["http://a.example?x=1", /no path/],
    ["http://a.example,https://b.example", /one scheme/],
  ])("refuses %j with words that say what to set", (value, message) =>
    expect(() => parsePublicOrigins(value)).toThrow(message),
  );
});

describe("safeNextPath", () => {
  it.each(["//evil.example", "https://evil.example", "/\\evil.example", "/api/users", "/sign-in?next=/x", ""])(
    "drops %s",
    (p) => expect(safeNextPath(p)).toBeNull(),
  );
  it("keeps a local path", () => expect(safeNextPath("/admin/users?x=1")).toBe("/admin/users?x=1"));
});
