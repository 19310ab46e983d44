import { describe, expect, it } from "vitest";
import { PERMISSIONS, ROLES, roleMay, ROLE_HOME } from "@/lib/auth/permissions";
import { PAGE_ACCESS } from "@/lib/auth/access-table";
import { formatClock } from "@/lib/auth/throttle";

describe("permission table", () => {
  it("admin may do everything", () => {
    for (const p of Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]) expect(roleMay("admin", p)).toBe(true);
  });
  it("a picker may only work picks", () => {
    const allowed = (Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]).filter((p) => roleMay("picker", p));
    expect(allowed).toEqual(["picks.work"]);
  });
  it("a planner reads floor plans but does not edit them or manage users", () => {
    expect(roleMay("planner", "floorplans.read")).toBe(true);
    expect(roleMay("planner", "floorplans.edit")).toBe(false);
    expect(roleMay("planner", "users.manage")).toBe(false);
  });
  it("each role's start page is a page that role may open", () => {
    for (const r of ROLES) expect(roleMay(r, PAGE_ACCESS[ROLE_HOME[r]]!)).toBe(true);
  });
});

describe("formatClock", () => {
  it("shows the site's local time", () => {
    expect(formatClock(new Date("2026-07-01T08:05:00Z"), "Europe/London")).toBe("09:05");
    expect(formatClock(new Date("2026-12-01T08:05:00Z"), "Europe/London")).toBe("08:05");
  });
});
