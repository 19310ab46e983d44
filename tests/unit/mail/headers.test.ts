import { describe, expect, it } from "vitest";
import { hasControlCharacters, headerText, isValidAddress } from "@/lib/mail/headers";
import { afterFailure, MAX_ATTEMPTS, MAX_RETRY_MS, retryDelayMs } from "@/lib/mail/backoff";
import { linkParts } from "@/lib/mail/link-text";
import { invitationMail, setPasswordLink } from "@/lib/mail/messages";
import { looksLikeToken, newLinkToken, tokenSha256 } from "@/lib/mail/token";

describe("header text", () => {
  it.each(["a\r\nBcc: x@y", "a\nBcc: x@y", "a\rBcc: x@y", "a\u2028Bcc: x@y", "a\u0000\u0085Bcc: x@y"])(
    "strips the line break in %j",
    (s) => {
      expect(headerText(s)).toBe("a Bcc: x@y");
      expect(hasControlCharacters(s)).toBe(true);
    },
  );
  it("keeps ordinary names, accents included", () => {
    expect(headerText("  Zoë   O'Hara-Nkemelu ")).toBe("Zoë O'Hara-Nkemelu");
    expect(hasControlCharacters("Zoë O'Hara")).toBe(false);
  });
  it("caps the length", () => expect(headerText("x".repeat(500), 120)).toHaveLength(120));
});

describe("addresses", () => {
  it.each(["picker@bramblegate.example", "a.b+tag@sub.example.co.uk", "t1-2@tests.example"])("accepts %s", (a) =>
    expect(isValidAddress(a)).toBe(true),
  );
  it.each([
    "victim@x.example\r\nBcc: y@z.example",
    "a@b.example, c@d.example",
    "Name <a@b.example>",
    '"quoted"@b.example',
    "a@b",
    "a..b@c.example",
    "a@-b.example",
    "",
    "a b@c.example",
  ])("refuses %j", (a) => expect(isValidAddress(a)).toBe(false));
});

describe("retry backoff", () => {
  it("doubles from 10 s and stops at 5 minutes", () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([10_000, 20_000, 40_000, 80_000]);
    expect(retryDelayMs(30)).toBe(MAX_RETRY_MS);
  });
  it(`gives up after ${MAX_ATTEMPTS} attempts`, () => {
    const now = new Date("2026-12-02T10:00:00Z");
    expect(afterFailure(1, now)).toEqual({ status: "pending", nextAttemptAt: new Date(now.getTime() + 10_000) });
    expect(afterFailure(MAX_ATTEMPTS, now)).toEqual({ status: "failed" });
  });
});

describe("links in mail text", () => {
  it("finds http(s) links and leaves the rest as text, trailing full stop outside", () => {
    const parts = linkParts("Open http://127.0.0.1:3000/set-password?token=abc_-1. Then sign in.");
    expect(parts).toEqual([
      { kind: "text", text: "Open " },
      { kind: "link", href: "http://127.0.0.1:3000/set-password?token=abc_-1" },
      { kind: "text", text: ". Then sign in." },
    ]);
  });
  it("makes no link of javascript: or other schemes", () => {
    expect(linkParts("javascript:alert(1) mailto:x@y").every((p) => p.kind === "text")).toBe(true);
  });
});

describe("invitation mail", () => {
  it("carries the link and a name without line breaks", () => {
    const link = setPasswordLink("http://127.0.0.1:3001", "tok");
    expect(link).toBe("http://127.0.0.1:3001/set-password?token=tok");
    const m = invitationMail({
      to: "a@b.example",
      name: "a\r\nBcc: x@y",
      siteName: "Bramblegate",
      invitedBy: "Ada",
      link,
    });
    expect(m.toName).toBe("a Bcc: x@y");
    expect(m.text).toContain(link);
    expect(m.subject).not.toMatch(/[\r\n]/);
  });
});

describe("link tokens", () => {
  it("are 32 random bytes in base64url, stored as a SHA-256 hex digest", () => {
    const t = newLinkToken();
    expect(looksLikeToken(t)).toBe(true);
    expect(Buffer.from(t, "base64url")).toHaveLength(32);
    expect(tokenSha256(t)).toMatch(/^[0-9a-f]{64}$/);
    expect(newLinkToken()).not.toBe(t);
  });
});
