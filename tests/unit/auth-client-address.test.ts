import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clientAddress, clientIp, parseTrustedProxies } from "@/lib/http/client-ip";
import { stampPeerAddresses } from "@/lib/http/peer-address";

describe("the client's address from the socket", () => {
  // A plain Node server stands in for next start: the stamp is made where Node parses the request,
  // before any handler sees it.
  let server: http.Server;
  let url = "";
  let seen: Headers[] = [];
  beforeAll(async () => {
    stampPeerAddresses();
    server = http.createServer((req, res) => {
      seen.push(
        new Headers(
          Object.entries(req.headers).flatMap(([k, v]) => (typeof v === "string" ? [[k, v] as [string, string]] : [])),
        ),
      );
      res.end("ok");
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  });
  afterAll(() => new Promise<void>((r) => server.close(() => r())));

  const fetchSeen = async (headers: Record<string, string>) => {
    seen = [];
    await fetch(url, { headers });
    return seen[0]!;
  };

  it("is the socket's, whatever X-Forwarded-For and X-Real-IP claim", async () => {
    const h = await fetchSeen({ "x-forwarded-for": "6.6.6.6", "x-real-ip": "7.7.7.7" });
    expect(clientIp(h, parseTrustedProxies(""))).toBe("127.0.0.1");
  });

  it("cannot be forged by sending the stamp header itself", async () => {
    const h = await fetchSeen({ "x-trailbin-peer": "6.6.6.6" });
    expect(clientIp(h, parseTrustedProxies(""))).toBe("127.0.0.1");
  });

  it("behind a trusted proxy is the last address the proxy appended", async () => {
    const h = await fetchSeen({ "x-forwarded-for": "6.6.6.6, 198.51.100.4" });
    expect(clientIp(h, parseTrustedProxies("127.0.0.1"))).toBe("198.51.100.4");
  });

  it("without the stamp (a request nobody stamped) is unknown, never a header's word", () => {
    expect(
      clientIp(
        new Headers({ "x-forwarded-for": "6.6.6.6", "x-trailbin-peer": "6.6.6.6" }),
        parseTrustedProxies("6.6.6.6"),
      ),
    ).toBe("unknown");
  });
});

describe("clientAddress", () => {
  const none = parseTrustedProxies("");
  const proxies = parseTrustedProxies("10.0.0.0/8, 192.0.2.1, ::1");

  it("ignores X-Forwarded-For when the peer is no trusted proxy", () => {
    expect(clientAddress("198.51.100.9", "6.6.6.6", none)).toBe("198.51.100.9");
    expect(clientAddress("198.51.100.9", "6.6.6.6", proxies)).toBe("198.51.100.9");
  });

  it("walks back over trusted proxies to the first address that is not one", () => {
    expect(clientAddress("10.1.2.3", "6.6.6.6, 198.51.100.9, 192.0.2.1", proxies)).toBe("198.51.100.9");
  });

  it("takes a trusted peer with nothing forwarded as the client", () => {
    expect(clientAddress("10.1.2.3", null, proxies)).toBe("10.1.2.3");
  });

  it("stops at the last trusted hop when what came before it is not an address", () => {
    expect(clientAddress("10.1.2.3", "evil, 10.4.4.4", proxies)).toBe("10.4.4.4");
    expect(clientAddress("10.1.2.3", "<script>", proxies)).toBe("10.1.2.3");
  });

  it("writes IPv4 addresses mapped into IPv6 as plain IPv4", () => {
    expect(clientAddress("::ffff:127.0.0.1", null, none)).toBe("127.0.0.1");
    expect(clientAddress("::1", "::ffff:198.51.100.9", proxies)).toBe("198.51.100.9");
  });
});

describe("TRUSTED_PROXIES", () => {
  it("takes addresses and ranges, IPv4 and IPv6, comma or space separated", () => {
    const list = parseTrustedProxies("127.0.0.1 10.0.0.0/8,fd00::/8");
    expect(clientAddress("10.200.0.1", "198.51.100.1", list)).toBe("198.51.100.1");
    expect(clientAddress("fd12::1", "198.51.100.2", list)).toBe("198.51.100.2");
    expect(clientAddress("11.0.0.1", "198.51.100.3", list)).toBe("11.0.0.1");
  });

  it("refuses an entry that is not an address or range, naming it", () => {
    expect(() => parseTrustedProxies("127.0.0.1, proxy.local")).toThrow(/proxy\.local/);
    expect(() => parseTrustedProxies("10.0.0.0/99")).toThrow(/10\.0\.0\.0\/99/);
  });
});
