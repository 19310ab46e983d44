import { describe, expect, it } from "vitest";
import { newNonce, pageCsp } from "@/lib/security/csp";
import { cspDirectives, scriptNonce } from "../support/csp";

describe("the page policy", () => {
  it("names the nonce in script-src and style-src, and nothing unsafe in production", () => {
    const policy = pageCsp("abc123==");
    expect(scriptNonce(policy)).toBe("abc123==");
    expect(cspDirectives(policy).get("style-src")).toContain("'nonce-abc123=='");
    expect(policy).not.toMatch(/unsafe/);
  });

  it("relaxes only what next dev needs, only in dev", () => {
    const d = cspDirectives(pageCsp("abc123==", true));
    expect(d.get("script-src")).toContain("'unsafe-eval'");
    expect(d.get("script-src")).not.toContain("'unsafe-inline'");
    expect(d.get("object-src")).toEqual(["'none'"]);
  });

  it("makes a different 128-bit nonce every time", () => {
    const nonces = Array.from({ length: 50 }, newNonce);
    expect(new Set(nonces).size).toBe(50);
    for (const n of nonces) expect(Buffer.from(n, "base64")).toHaveLength(16);
  });
});
