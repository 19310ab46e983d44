import { describe, expect, it } from "vitest";
import { actualTime, floorStatusOf, idleSince } from "@/lib/shift/floor-status";

describe("a batch's place on the floor", () => {
  it("is waiting without a holder, taken before its first line, in progress after it, done at the end", () => {
    expect(floorStatusOf({ status: "released", pickerId: null, doneLines: 0 })).toBe("waiting");
    expect(floorStatusOf({ status: "released", pickerId: "u1", doneLines: 0 })).toBe("taken");
    expect(floorStatusOf({ status: "picking", pickerId: "u1", doneLines: 1 })).toBe("in progress");
    expect(floorStatusOf({ status: "done", pickerId: "u1", doneLines: 4 })).toBe("done");
  });

  it("a half-picked batch nobody holds waits for a picker to continue it", () => {
    expect(floorStatusOf({ status: "picking", pickerId: null, doneLines: 2 })).toBe("waiting");
  });
});

describe("actual time against the estimate", () => {
  const now = new Date("2026-12-03T10:30:00Z");
  it("has none before the first line", () => {
    expect(actualTime({ startedAt: null, finishedAt: null }, 600, now)).toEqual({ actualSeconds: null, late: false });
  });
  it("runs to now while the batch is picked, and is late once past the estimate", () => {
    const running = { startedAt: "2026-12-03T10:20:00Z", finishedAt: null };
    expect(actualTime(running, 600, now)).toEqual({ actualSeconds: 600, late: false });
    expect(actualTime(running, 599, now)).toEqual({ actualSeconds: 600, late: true });
  });
  it("is finished minus started once done, whatever the clock says now", () => {
    const done = { startedAt: "2026-12-03T09:00:00Z", finishedAt: "2026-12-03T09:07:30Z" };
    expect(actualTime(done, 400, now)).toEqual({ actualSeconds: 450, late: true });
    expect(actualTime(done, 450, now)).toEqual({ actualSeconds: 450, late: false });
  });
});

describe("idle since", () => {
  it("is the latest of the last finish, the last batch taken away and signing in; nobody holding work is not idle", () => {
    const p = {
      openBatches: 0,
      lastFinishedAt: "2026-12-03T09:10:00Z",
      lastLostAt: "2026-12-03T09:40:00Z",
      lastSignInAt: "2026-12-03T07:58:00Z",
    };
    expect(idleSince(p)).toBe("2026-12-03T09:40:00Z");
    expect(idleSince({ ...p, lastLostAt: null })).toBe("2026-12-03T09:10:00Z");
    expect(idleSince({ ...p, openBatches: 1 })).toBeNull();
    expect(idleSince({ openBatches: 0, lastFinishedAt: null, lastLostAt: null, lastSignInAt: null })).toBeNull();
  });
});
