/**
 * A handheld on flaky Wi-Fi sends a write again when the answer to the first try was lost. If what is
 * stored now is exactly what that write leaves (`leaves`), and, for a write that carried the version it
 * loaded, one version on from it, the write went through: the repeat is answered as a success, never
 * refused as stale. Someone else's write that happens to look the same must fail `leaves`.
 */
export function wentThrough<T extends { version: number }>(
  stored: T | null | undefined,
  leaves: (stored: T) => boolean,
  sentVersion?: number,
): boolean {
  return !!stored && (sentVersion === undefined || stored.version === sentVersion + 1) && leaves(stored);
}
