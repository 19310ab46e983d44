/*
 * Cut-off times as a planner types them: ISO 8601 with an offset or "Z" (an exact instant), or
 * "YYYY-MM-DD HH:MM" (also with "T" and seconds) in the site's own time zone. Stored as UTC.
 * The zone arithmetic uses Intl's tz database, so summer time follows the site's rules.
 */

import { zoneOffsetMs } from "@/lib/format/zone";

type Parsed = { ok: true; utc: Date } | { ok: false; message: string };

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})[ T](\d{1,2}):(\d{2})(?::(\d{2}))?$/;
const WITH_OFFSET = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(?::\d{2}(?:\.\d{1,3})?)?(?:Z|[+-]\d{2}:?\d{2})$/i;

/** Minutes the zone is ahead of UTC at that instant. */
function offsetMinutes(instant: number, timeZone: string): number {
  return Math.round(zoneOffsetMs(instant, timeZone) / 60_000);
}

/**
 * A wall-clock time at the site → the UTC instant. A time the clocks skip (spring forward) does not
 * exist and is refused; a time that happens twice (autumn) is taken as its first occurrence.
 */
export function siteLocalToUtc(
  y: number,
  mo: number,
  d: number,
  h: number,
  mi: number,
  s: number,
  timeZone: string,
): Date | null {
  const wall = Date.UTC(y, mo - 1, d, h, mi, s);
  const candidates = new Set<number>();
  // The offset before and after any change near this time: try both, keep those that read back right.
  for (const probe of [wall - 86_400_000, wall, wall + 86_400_000])
    candidates.add(wall - offsetMinutes(probe, timeZone) * 60_000);
  const good = [...candidates].filter((t) => t + offsetMinutes(t, timeZone) * 60_000 === wall).sort((a, b) => a - b);
  return good.length ? new Date(good[0]!) : null;
}

export function parseCutoff(text: string, timeZone: string): Parsed {
  const t = text.trim();
  const local = LOCAL.exec(t);
  if (local) {
    const [y, mo, d, h, mi, s] = local.slice(1).map((v) => Number(v ?? 0)) as [
      number,
      number,
      number,
      number,
      number,
      number,
    ];
    const check = new Date(Date.UTC(y, mo - 1, d, h, mi, s));
    if (h > 23 || mi > 59 || s > 59 || check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== d) {
      return { ok: false, message: `Cut-off “${t}” is not a real date and time.` };
    }
    const utc = siteLocalToUtc(y, mo, d, h, mi, s, timeZone);
    if (!utc)
      return {
        ok: false,
        message: `Cut-off “${t}” does not exist in ${timeZone} (the clocks skip that hour). Use a time outside the change.`,
      };
    return { ok: true, utc };
  }
  if (WITH_OFFSET.test(t)) {
    const ms = Date.parse(t);
    if (!Number.isNaN(ms)) return { ok: true, utc: new Date(ms) };
  }
  return {
    ok: false,
    message: `Cut-off “${t}” is not a date and time Trailbin reads. Write it as YYYY-MM-DD HH:MM in site time (${timeZone}), e.g. 2026-12-03 16:30, in a column formatted as text.`,
  };
}
