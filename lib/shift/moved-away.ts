import "server-only";
import type { HandoverRow } from "@/db/shift-floor";
import { getSite } from "@/db/sites";
import { formatWhen } from "@/lib/format/dates";

/** What the handheld of the picker who lost a batch says: who did it, to whom, when; nothing picked is lost. */
export async function movedAwayMessage(siteId: number, h: HandoverRow): Promise<string> {
  const style = (await getSite(siteId))?.dateStyle;
  const who = h.byName ?? "Your supervisor";
  const when = formatWhen(h.at, style);
  const what =
    h.kind === "moved" && h.toName
      ? `${who} moved this batch to ${h.toName} at ${when}.`
      : `${who} took this batch back at ${when}.`;
  return `${what} Your confirmed lines are kept.`;
}
