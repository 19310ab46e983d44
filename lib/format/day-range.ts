// A shift's day in the site's time zone as the instants it starts and ends: the short-pick list reads
// one day at a time. Pure, like the rest of lib/format.

import { zoneOffsetMs, zoneParts } from "./zone";

const YMD = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Midnight of that local date, as an instant (a zone's offset can change that day: checked twice). */
function localMidnight(y: number, m: number, d: number, timeZone: string): Date {
  const guess = Date.UTC(y, m - 1, d);
  let at = guess - zoneOffsetMs(guess, timeZone);
  at = guess - zoneOffsetMs(at, timeZone);
  return new Date(at);
}

/** Whether the text is a real calendar date written YYYY-MM-DD. */
export function isDay(text: string): boolean {
  const m = YMD.exec(text);
  if (!m) return false;
  const d = new Date(Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!));
  return d.getUTCFullYear() === +m[1]! && d.getUTCMonth() === +m[2]! - 1 && d.getUTCDate() === +m[3]!;
}

/** [start, end) of the local day `ymd` in `timeZone`. */
export function dayRange(ymd: string, timeZone: string): { start: Date; end: Date } {
  const m = YMD.exec(ymd);
  if (!m || !isDay(ymd)) throw new Error(`not a date: ${ymd}`);
  const [y, mo, d] = [+m[1]!, +m[2]!, +m[3]!];
  const next = new Date(Date.UTC(y, mo - 1, d + 1));
  return {
    start: localMidnight(y, mo, d, timeZone),
    end: localMidnight(next.getUTCFullYear(), next.getUTCMonth() + 1, next.getUTCDate(), timeZone),
  };
}

/** The local date of an instant in `timeZone`, YYYY-MM-DD. */
export function dayOf(at: Date, timeZone: string): string {
  const p = zoneParts(at, timeZone);
  return `${p.year}-${p.month}-${p.day}`;
}
