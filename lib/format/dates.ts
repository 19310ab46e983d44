/**
 * The one way Trailbin writes a date or a time, on every screen, mail and print: in the site's time zone,
 * in the site's date order and clock. Assembled from parts (not a locale's own pattern) so a site reads
 * the same text whatever language the browser or the server runs in.
 */
import { zoneParts } from "./zone";

export const DATE_ORDERS = ["dmy", "mdy", "ymd"] as const;
export type DateOrder = (typeof DATE_ORDERS)[number];
export const CLOCKS = ["24h", "12h"] as const;
export type Clock = (typeof CLOCKS)[number];

export type DateStyle = { timeZone: string; dateOrder: DateOrder; clock: Clock };

/** Until a site sets its own: day first and a 24-hour clock, in UTC. */
export const DEFAULT_DATE_STYLE: DateStyle = { timeZone: "UTC", dateOrder: "dmy", clock: "24h" };

const toDate = (at: Date | string | number) => (at instanceof Date ? at : new Date(at));

export function formatDate(at: Date | string | number, style: DateStyle = DEFAULT_DATE_STYLE): string {
  const p = zoneParts(toDate(at), style.timeZone);
  if (style.dateOrder === "ymd") return `${p.year}-${p.month}-${p.day}`;
  return style.dateOrder === "mdy" ? `${p.month}/${p.day}/${p.year}` : `${p.day}/${p.month}/${p.year}`;
}

export function formatTime(at: Date | string | number, style: DateStyle = DEFAULT_DATE_STYLE): string {
  const p = zoneParts(toDate(at), style.timeZone);
  if (style.clock === "24h") return `${p.hour}:${p.minute}`;
  const h = Number(p.hour);
  return `${h % 12 === 0 ? 12 : h % 12}:${p.minute} ${h < 12 ? "AM" : "PM"}`;
}

/** "02/12/2026 09:46": a cut-off, a print time, when a batch was taken. */
export function formatDateTime(at: Date | string | number, style: DateStyle = DEFAULT_DATE_STYLE): string {
  return `${formatDate(at, style)} ${formatTime(at, style)}`;
}

/** Today's times as the clock alone, other days with their date: the floor view's "taken 09:46". */
export function formatWhen(
  at: Date | string | number,
  style: DateStyle = DEFAULT_DATE_STYLE,
  now: Date = new Date(),
): string {
  return formatDate(at, style) === formatDate(now, style) ? formatTime(at, style) : formatDateTime(at, style);
}

/** A missing time in a table cell. */
export const formatMaybe = (at: Date | string | null | undefined, style?: DateStyle, empty = "—") =>
  at === null || at === undefined ? empty : formatDateTime(at, style);

/** The clock with seconds, "09:46:07" or "9:46:07 AM": a live screen's "updated" line. */
export function formatTimeWithSeconds(at: Date | string | number, style: DateStyle = DEFAULT_DATE_STYLE): string {
  const d = toDate(at);
  // Every zone in use today is offset from UTC by whole minutes, so the seconds are UTC's.
  const seconds = String(d.getUTCSeconds()).padStart(2, "0");
  const hm = formatTime(d, style);
  return style.clock === "24h" ? `${hm}:${seconds}` : hm.replace(/ (AM|PM)$/, `:${seconds} $1`);
}
