// What a time zone's clock reads at an instant, and how far it is ahead of UTC: the one place
// Trailbin asks Intl's tz database, so summer time follows each site's own rules. Pure.

/** The wall clock in a zone, as Intl writes it: two digits (four for the year), 24-hour, English weekday. */
export type ZoneParts = {
  year: string;
  month: string;
  day: string;
  hour: string;
  minute: string;
  second: string;
  weekday: string;
};

const formats = new Map<string, Intl.DateTimeFormat>();

export function zoneParts(at: Date, timeZone: string): ZoneParts {
  let f = formats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-GB", {
      timeZone,
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
      weekday: "short",
      hourCycle: "h23",
    });
    formats.set(timeZone, f);
  }
  const out: Record<string, string> = {};
  for (const p of f.formatToParts(at)) out[p.type] = p.value;
  return out as ZoneParts;
}

/** Milliseconds the zone's clock is ahead of UTC at that instant (whole seconds: Intl shows no less). */
export function zoneOffsetMs(at: Date | number, timeZone: string): number {
  const t = at instanceof Date ? at.getTime() : at;
  const p = zoneParts(new Date(t), timeZone);
  const asUtc = Date.UTC(+p.year, +p.month - 1, +p.day, +p.hour, +p.minute, +p.second);
  return asUtc - Math.floor(t / 1000) * 1000;
}
