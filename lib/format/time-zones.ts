/** The IANA time zones this runtime knows, for the settings form's list (UTC first: Intl leaves it out). */
export function timeZoneNames(): string[] {
  const listed = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return ["UTC", ...listed.filter((z) => z !== "UTC")];
}

/**
 * A real IANA zone ("Europe/London", "UTC"): one the runtime lists, or an older alias it still accepts
 * ("Europe/Kiev"). Offsets ("+01:00") and abbreviations ("CET") are refused: they ignore summer time.
 */
export function isTimeZone(name: string): boolean {
  if (name === "UTC") return true;
  if (!/^[A-Za-z]+(?:\/[A-Za-z0-9_+-]+)+$/.test(name)) return false;
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}
