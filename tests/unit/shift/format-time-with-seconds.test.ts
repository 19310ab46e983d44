import { describe, expect, it } from "vitest";
import { formatTimeWithSeconds } from "@/lib/format/dates";

describe("the floor's updated-at clock", () => {
  const at = "2026-12-03T14:05:07.400Z";
  it("writes seconds in the site's zone and clock", () => {
    expect(formatTimeWithSeconds(at, { timeZone: "Europe/London", dateOrder: "dmy", clock: "24h" })).toBe("14:05:07");
    expect(formatTimeWithSeconds(at, { timeZone: "America/New_York", dateOrder: "mdy", clock: "12h" })).toBe(
      "9:05:07 AM",
    );
    // A zone half an hour off UTC keeps the seconds.
    expect(formatTimeWithSeconds(at, { timeZone: "Asia/Kolkata", dateOrder: "dmy", clock: "24h" })).toBe("19:35:07");
  });
});
