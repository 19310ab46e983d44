import { BlockList, isIP } from "node:net";
import { peerAddress } from "./peer-address";

/**
 * The client's address, for the throttles and the audit log: the socket's, unless the socket is a
 * proxy named in TRUSTED_PROXIES, in which case X-Forwarded-For is read from the right, over trusted
 * proxies, to the first address that is not one. Anything a client wrote further left is ignored.
 */
export function clientIp(headers: Headers, trusted = trustedProxies()): string {
  const peer = peerAddress(headers);
  return peer ? clientAddress(peer, headers.get("x-forwarded-for"), trusted) : "unknown";
}

const plain = (address: string) => {
  const a = address.trim();
  return /^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(a) ? a.slice(7) : a;
};
const family = (address: string) => (isIP(address) === 6 ? "ipv6" : "ipv4");

export function clientAddress(peer: string, forwardedFor: string | null, trusted: BlockList): string {
  let hop = plain(peer);
  const chain = (forwardedFor ?? "").split(",").map(plain).filter(Boolean);
  while (trusted.check(hop, family(hop))) {
    const previous = chain.pop();
    // A proxy appends what it saw, so only a client can have written a non-address: stop at the proxy.
    if (!previous || !isIP(previous)) return hop;
    hop = previous;
  }
  return hop;
}

/** TRUSTED_PROXIES: addresses and CIDR ranges, comma or space separated; a wrong entry is refused by name. */
export function parseTrustedProxies(setting: string): BlockList {
  const list = new BlockList();
  for (const entry of setting.split(/[\s,]+/).filter(Boolean)) {
    const [address, bits, extra] = entry.split("/");
    const kind = isIP(address ?? "");
    const prefix = bits === undefined ? null : Number(bits);
    const maxBits = kind === 6 ? 128 : 32;
    const validPrefix = prefix === null || (/^\d+$/.test(bits ?? "") && prefix <= maxBits);
    if (!kind || !validPrefix || extra !== undefined) {
      throw new Error(
        `TRUSTED_PROXIES: "${entry}" is not an IP address or a CIDR range (like 10.0.0.0/8); fix or remove it.`,
      );
    }
    const type = kind === 6 ? "ipv6" : "ipv4";
    if (prefix === null) list.addAddress(address!, type);
    else list.addSubnet(address!, prefix, type);
  }
  return list;
}

let parsed: { setting: string; list: BlockList } | null = null;
/** The setting of this process, parsed once. */
export function trustedProxies(): BlockList {
  const setting = process.env.TRUSTED_PROXIES ?? "";
  if (parsed?.setting !== setting) parsed = { setting, list: parseTrustedProxies(setting) };
  return parsed.list;
}
