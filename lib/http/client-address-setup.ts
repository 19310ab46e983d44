import { trustedProxies } from "./client-ip";
import { stampPeerAddresses } from "./peer-address";

/**
 * At server start (instrumentation.ts). A TRUSTED_PROXIES the server cannot read stops it: guessing
 * would either believe forged addresses or put everyone behind the proxy on the proxy's one address.
 */
export function startClientAddresses(): void {
  stampPeerAddresses();
  try {
    trustedProxies();
  } catch (e) {
    console.error((e as Error).message);
    process.exit(1);
  }
}
