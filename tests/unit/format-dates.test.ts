import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, formatTime, formatWhen, formatMaybe } from "@/lib/format/dates";

// 09:46 UTC on 2 December 2026 is 09:46 in London (no summer time) and 04:46 in New York.
const at = "2026-12-02T09:46:30Z";
const london = { timeZone: "Europe/London", dateOrder: "dmy", clock: "24h" } as const;

describe("one date and time formatter", () => {
  it("writes each date order", () => {
    expect(formatDate(at, london)).toBe("02/12/2026");
    expect(formatDate(at, { ...london, dateOrder: "mdy" })).toBe("12/02/2026");
    expect(formatDate(at, { ...london, dateOrder: "ymd" })).toBe("2026-12-02");
  });
  it("writes 24-hour and 12-hour clocks, noon and midnight included", () => {
    expect(formatTime(at, london)).toBe("09:46");
    expect(formatTime(at, { ...london, clock: "12h" })).toBe("9:46 AM");
    expect(formatTime("2026-12-02T12:05:00Z", { ...london, clock: "12h" })).toBe("12:05 PM");
    expect(formatTime("2026-12-02T00:05:00Z", { ...london, clock: "12h" })).toBe("12:05 AM");
    expect(formatTime("2026-12-02T23:59:00Z", london)).toBe("23:59");
  });
  it("shows the site's local time, summer time included", () => {
    expect(formatDateTime(at, { ...london, timeZone: "America/New_York" })).toBe("02/12/2026 04:46");
    expect(formatDateTime("2026-07-01T08:05:00Z", london)).toBe("01/07/2026 09:05");
    // The local date can differ from the UTC date.
    expect(formatDate("2026-12-02T23:30:00Z", { ...london, timeZone: "Asia/Tokyo" })).toBe("03/12/2026");
  });
  it("drops today's date and keeps other days'", () => {
    const now = new Date("2026-12-02T15:00:00Z");
    expect(formatWhen(at, london, now)).toBe("09:46");
    expect(formatWhen("2026-12-01T09:46:00Z", london, now)).toBe("01/12/2026 09:46");
  });
  it("writes a dash for no time at all", () => {
    expect(formatMaybe(null, london)).toBe("—");
    expect(formatMaybe(at, london)).toBe("02/12/2026 09:46");
  });
});
