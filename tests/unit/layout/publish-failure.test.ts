import { describe, expect, it } from "vitest";
import { publishFailureMessage } from "@/lib/layout-versions/publish-failure";
import { HttpError } from "@/lib/http/errors";

/** What knex hands back when MariaDB refuses a statement: the whole SQL in the message. */
function databaseError(): Error {
  const e = new Error(
    "insert into `layout_bins` (`access_point`, `aisle`, `bay`, `code`) values (0, 1, 1, 'WAREHOUSE-000000001-000000001-000000001') - Data too long for column 'code' at row 1",
  );
  Object.assign(e, {
    code: "ER_DATA_TOO_LONG",
    errno: 1406,
    sqlState: "22001",
    sqlMessage: "Data too long for column 'code' at row 1",
    sql: "insert into `layout_bins` …",
  });
  return e;
}

describe("what a failed publish tells the admin", () => {
  it("never shows SQL or column names from a database error, and says what to do", () => {
    const message = publishFailureMessage(databaseError(), "job42");
    expect(message).not.toMatch(/insert|layout_bins|`|column|ER_/i);
    expect(message).toMatch(/draft is unchanged/i);
    expect(message).toMatch(/try again/i);
    expect(message).toContain("job42");
  });

  it("a lost database connection (a statement over the packet limit) is told in plain words too", () => {
    const e = Object.assign(new Error("Can't add new command when connection is in closed state"), { fatal: true });
    const message = publishFailureMessage(e, "job7");
    expect(message).not.toMatch(/command|connection is in closed state/i);
    expect(message).toMatch(/try again/i);
  });

  it("keeps a message written for a person as it is", () => {
    const message = publishFailureMessage(
      new HttpError(409, "The draft changed while publishing started. Reload it and publish again."),
      "job1",
    );
    expect(message).toBe("Publishing failed: The draft changed while publishing started. Reload it and publish again.");
  });
});
