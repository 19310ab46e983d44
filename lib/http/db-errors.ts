import { jsonError } from "./errors";

// mysql2 (and the sockets under it) name a lost or unreachable server with these codes; knex passes
// them through on the error it rejects with. A request that failed this way wrote nothing that
// stays: its transaction ends with the connection.
const CONNECTION_LOST = new Set([
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "ER_CONNECTION_KILLED",
  "ER_SERVER_SHUTDOWN",
  "ER_QUERY_INTERRUPTED",
  "ECONNRESET",
  "EPIPE",
]);
const UNREACHABLE = new Set([
  "ECONNREFUSED",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
  "ER_CON_COUNT_ERROR",
]);

export type DatabaseOutage = "connection-lost" | "unreachable";

/** Seconds a client should wait before trying again: about what a MariaDB restart takes. */
export const DB_RETRY_AFTER_S = 5;

function codeOf(e: unknown): string | undefined {
  const c = (e as { code?: unknown } | null)?.code;
  return typeof c === "string" ? c : undefined;
}

/** Whether `e` (or what it wraps) says the database went away, rather than that a query was wrong. */
export function databaseOutage(e: unknown): DatabaseOutage | null {
  for (let cur = e, depth = 0; cur && depth < 5; cur = (cur as { cause?: unknown }).cause, depth++) {
    const code = codeOf(cur);
    if (code && UNREACHABLE.has(code)) return "unreachable";
    if (code && CONNECTION_LOST.has(code)) return "connection-lost";
    // mysql2's own wording when a command is queued on a connection that already died.
    if (cur instanceof Error && /connection is in closed state|Connection lost/i.test(cur.message))
      return "connection-lost";
    // knex, when no connection could be had in time (the server hangs instead of refusing).
    if (cur instanceof Error && cur.name === "KnexTimeoutError") return "unreachable";
  }
  return null;
}

const MESSAGES: Record<DatabaseOutage, string> = {
  "connection-lost":
    "The database connection dropped, so nothing was saved. Try again in a moment; if it keeps happening, tell your admin.",
  unreachable:
    "Trailbin cannot reach its database right now, so nothing was saved. Try again in a minute; if it keeps happening, tell your admin.",
};

/** The 503 a person sees when the database is gone: plain words and when to try again. */
export function databaseOutageResponse(kind: DatabaseOutage): Response {
  const res = jsonError(503, MESSAGES[kind]);
  res.headers.set("Retry-After", String(DB_RETRY_AFTER_S));
  return res;
}
