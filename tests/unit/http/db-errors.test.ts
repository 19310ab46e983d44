import { describe, expect, it } from "vitest";
import { DB_RETRY_AFTER_S, databaseOutage, databaseOutageResponse } from "@/lib/http/db-errors";

// The codes are mysql2's (lib/constants/errors.js and its socket handling) and Node's (os error names).
const withCode = (code: string, message = "boom") => Object.assign(new Error(message), { code });

describe("database outage classification", () => {
  it("a dropped or killed connection is 'connection-lost'", () => {
    for (const code of [
      "PROTOCOL_CONNECTION_LOST",
      "ER_CONNECTION_KILLED",
      "ER_SERVER_SHUTDOWN",
      "ECONNRESET",
      "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR",
    ]) {
      expect(databaseOutage(withCode(code)), code).toBe("connection-lost");
    }
    expect(databaseOutage(new Error("Can't add new command when connection is in closed state"))).toBe(
      "connection-lost",
    );
  });

  it("a server that refuses or does not answer is 'unreachable'", () => {
    for (const code of ["ECONNREFUSED", "ETIMEDOUT", "EHOSTUNREACH", "ER_CON_COUNT_ERROR"])
      expect(databaseOutage(withCode(code)), code).toBe("unreachable");
    const timeout = new Error("Knex: Timeout acquiring a connection. The pool is probably full.");
    timeout.name = "KnexTimeoutError";
    expect(databaseOutage(timeout)).toBe("unreachable");
  });

  it("looks through a wrapping error's cause", () => {
    expect(databaseOutage(new Error("query failed", { cause: withCode("ECONNREFUSED") }))).toBe("unreachable");
  });

  it("leaves real query errors and everything else to the caller", () => {
    for (const e of [
      withCode("ER_DUP_ENTRY"),
      withCode("ER_PARSE_ERROR"),
      withCode("ER_NO_SUCH_TABLE"),
      new Error("plain"),
      null,
      undefined,
      "text",
      { code: 42 },
    ]) {
      expect(databaseOutage(e)).toBeNull();
    }
  });

  it("answers 503 with words and a Retry-After", async () => {
    const res = databaseOutageResponse("connection-lost");
    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toBe(String(DB_RETRY_AFTER_S));
    expect((await res.json()).error).toMatch(/connection dropped, so nothing was saved\. Try again/);
    expect((await databaseOutageResponse("unreachable").json()).error).toMatch(/cannot reach its database/);
  });
});
