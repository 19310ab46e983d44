import { describe, expect, it } from "vitest";
import { isOverdue, pickState } from "@/lib/orders/pick-state";
import { dayOf, dayRange, isDay } from "@/lib/format/day-range";

const none = { open: 0, picked: 0, shortOpen: 0, shortRepick: 0, shortCancel: 0 };

describe("an order's picking state follows its lines", () => {
  it("is nothing until the order is released", () => {
    expect(pickState("open", { ...none, open: 2 })).toBeNull();
    expect(pickState("planned", { ...none, open: 2 })).toBeNull();
  });
  it("goes from not started to being picked to picked", () => {
    expect(pickState("released", { ...none, open: 2 })).toBe("to-pick");
    expect(pickState("released", { ...none, open: 1, picked: 1 })).toBe("picking");
    expect(pickState("released", { ...none, picked: 2 })).toBe("picked");
  });
  it("a short line with no follow-up makes it picked short", () => {
    expect(pickState("released", { ...none, picked: 1, shortOpen: 1 })).toBe("short");
    // Still being picked comes first: the short is seen once the batch is done with the order.
    expect(pickState("released", { ...none, open: 1, shortOpen: 1 })).toBe("picking");
  });
  it("waits for its re-pick orders, then is picked, or completed short if any of them was cancelled", () => {
    const own = { ...none, picked: 1, shortRepick: 1 };
    expect(pickState("released", own, { unsettled: 1, cancelled: 0 })).toBe("awaiting-repick");
    expect(pickState("released", own, { unsettled: 0, cancelled: 0 })).toBe("picked");
    expect(pickState("released", own, { unsettled: 0, cancelled: 1 })).toBe("completed-short");
  });
  it("a cancelled line completes it short", () => {
    expect(pickState("released", { ...none, picked: 1, shortCancel: 1 })).toBe("completed-short");
  });
  it("is overdue once its cut-off passed until it is settled", () => {
    const now = new Date("2026-12-03T10:00:00Z");
    expect(isOverdue("2026-12-03T09:00:00Z", "picking", now)).toBe(true);
    expect(isOverdue("2026-12-03T09:00:00Z", null, now)).toBe(true);
    expect(isOverdue("2026-12-03T09:00:00Z", "awaiting-repick", now)).toBe(true);
    expect(isOverdue("2026-12-03T09:00:00Z", "picked", now)).toBe(false);
    expect(isOverdue("2026-12-03T09:00:00Z", "completed-short", now)).toBe(false);
    expect(isOverdue("2026-12-03T11:00:00Z", "to-pick", now)).toBe(false);
    expect(isOverdue(null, "to-pick", now)).toBe(false);
  });
});

describe("a shift's day in the site's time zone", () => {
  it("is midnight to midnight local time, across a change of clocks", () => {
    expect(dayRange("2026-12-03", "UTC")).toEqual({
      start: new Date("2026-12-03T00:00:00Z"),
      end: new Date("2026-12-04T00:00:00Z"),
    });
    expect(dayRange("2026-12-03", "Europe/London").start).toEqual(new Date("2026-12-03T00:00:00Z"));
    // New York is five hours behind UTC in winter.
    expect(dayRange("2026-12-03", "America/New_York").start).toEqual(new Date("2026-12-03T05:00:00Z"));
    // The day the clocks go back in Europe (25 October 2026) has 25 hours.
    const { start, end } = dayRange("2026-10-25", "Europe/Berlin");
    expect(start).toEqual(new Date("2026-10-24T22:00:00Z"));
    expect(end).toEqual(new Date("2026-10-25T23:00:00Z"));
  });
  it("names the local date of an instant and refuses dates that do not exist", () => {
    expect(dayOf(new Date("2026-12-03T23:30:00Z"), "Europe/Berlin")).toBe("2026-12-04");
    expect(dayOf(new Date("2026-12-03T03:30:00Z"), "America/New_York")).toBe("2026-12-02");
    expect(isDay("2026-02-30")).toBe(false);
    expect(isDay("2026-13-01")).toBe(false);
    expect(isDay("yesterday")).toBe(false);
    expect(isDay("2028-02-29")).toBe(true);
  });
});
