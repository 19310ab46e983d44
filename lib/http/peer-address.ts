import { randomBytes } from "node:crypto";
import diagnostics from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import type { Socket } from "node:net";

// Next's route handlers and pages see only headers, and `next start` keeps whatever X-Forwarded-For
// the client sent (it adds the socket's address only when there is none). Node announces every
// request on this channel, with its socket, before any 'request' listener (so before Next) runs: the
// stamp goes on there. The value carries a secret of this process, so a client that sends the header
// itself, or a request that arrived before the subscription, is not believed.
export const PEER_HEADER = "x-trailbin-peer";
const REQUEST_START = "http.server.request.start";

type Stamp = { secret: string };
const global = globalThis as unknown as { trailbinPeerStamp?: Stamp };

/** Once per server process (instrumentation.ts): from then on every request carries its socket's address. */
export function stampPeerAddresses(): void {
  if (global.trailbinPeerStamp) return;
  const stamp: Stamp = { secret: randomBytes(18).toString("base64url") };
  diagnostics.subscribe(REQUEST_START, (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    request.headers[PEER_HEADER] = `${stamp.secret} ${socket.remoteAddress ?? ""}`;
  });
  global.trailbinPeerStamp = stamp;
}

/** The socket's address stamped on this request, or null when it carries no stamp of ours. */
export function peerAddress(headers: Headers): string | null {
  const stamp = global.trailbinPeerStamp;
  const value = headers.get(PEER_HEADER);
  if (!stamp || !value) return null;
  const [secret, address] = value.split(" ");
  return secret === stamp.secret && address ? address : null;
}
