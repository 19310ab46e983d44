import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/lib/http/next-path";

const ORIGIN = "http://127.0.0.1:3000";
// What the sign-in page gets from ?next=…: URLSearchParams has already decoded %09, %0a and friends.
const fromQuery = (raw: string) => new URLSearchParams(`next=${raw}`).get("next");

describe("where sign-in may send a person next", () => {
  it.each([
    ["a tab after the first slash", "/%09/127.0.0.1:3999/phish"],
    ["a newline after the first slash", "/%0a/127.0.0.1:3999/phish"],
    ["a carriage return after the first slash", "/%0d/evil.example"],
    ["two backslashes", "%5C%5Cevil.example"],
    ["a slash and a backslash", "/%5Cevil.example"],
    ["two slashes", "//evil.example"],
    ["a scheme with no slashes", "https:evil.example"],
    ["a scheme with a tab in it", "ht%09tps://evil.example"],
    ["a leading space", "%20//evil.example"],
    ["a dot segment that leaves two slashes", "/.//evil.example"],
    ["a full address", "https://evil.example/"],
    ["javascript:", "javascript:alert(1)"],
  ])("drops %s (%s)", (_what, raw) => {
    const next = fromQuery(raw);
    expect(safeNextPath(next, ORIGIN)).toBeNull();
  });

  it.each(["/api/users", "/sign-in?next=/x", "/%73ign-in", ""])(
    "drops %s (the sign-in page and the API are no place to land)",
    (p) => expect(safeNextPath(p, ORIGIN)).toBeNull(),
  );

  it("keeps a path of this site, with its query", () =>
    expect(safeNextPath("/admin/users?x=1", ORIGIN)).toBe("/admin/users?x=1"));

  it("keeps a full address of this very site, as its path", () =>
    expect(safeNextPath(`${ORIGIN}/waves/3`, ORIGIN)).toBe("/waves/3"));

  it("what it keeps stays on this site when the browser resolves it again", () => {
    for (const raw of ["/waves/%2e%2e/admin", "/a/../b?c=//d", "/x#//evil.example"]) {
      const kept = safeNextPath(fromQuery(raw), ORIGIN);
      expect(kept).not.toBeNull();
      expect(new URL(kept!, "https://another.example").origin).toBe("https://another.example");
    }
  });
});
