import { describe, expect, it } from "vitest";
import { readBodyCapped } from "@/lib/http/read-body";
import { HttpError } from "@/lib/http/errors";

/** A body that never ends, counting what the reader pulled and whether it was told to stop. */
function endlessBody() {
  const seen = { pulled: 0, cancelled: false };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      seen.pulled += 16 * 1024;
      controller.enqueue(new Uint8Array(16 * 1024));
    },
    cancel() {
      seen.cancelled = true;
    },
  });
  return {
    seen,
    request: new Request("http://trailbin.test/api/x", { method: "POST", body: stream, duplex: "half" } as RequestInit),
  };
}

describe("reading a request body up to its cap", () => {
  it("stops an endless body just past the cap with 413 and cancels the rest", async () => {
    const { seen, request } = endlessBody();
    const err = await readBodyCapped(request, 256 * 1024, "too large").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(HttpError);
    expect((err as HttpError).status).toBe(413);
    expect(seen.cancelled).toBe(true);
    // What was pulled is the cap and the stream's own read-ahead, not the body.
    expect(seen.pulled).toBeLessThan(512 * 1024);
  });

  it("refuses a declared length over the cap without reading", async () => {
    const { request } = endlessBody();
    const declared = new Request(request, { headers: { "content-length": String(10 * 1024 * 1024) } });
    await expect(readBodyCapped(declared, 256 * 1024, "too large")).rejects.toMatchObject({ status: 413 });
    expect(declared.bodyUsed).toBe(false);
  });

  it("returns a body within the cap whole, byte for byte", async () => {
    const bytes = new TextEncoder().encode(JSON.stringify({ a: "ø".repeat(1000) }));
    const got = await readBodyCapped(
      new Request("http://trailbin.test/api/x", { method: "POST", body: bytes }),
      bytes.length,
      "too large",
    );
    expect(Array.from(got)).toEqual(Array.from(bytes));
  });
});
