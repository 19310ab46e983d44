import type { ShortPickDTO } from "@/lib/contracts/waves";
import { headerText } from "./headers";
import { metres, savingsPct } from "@/lib/format/units";

// The words of the planner's two wave mails. Pure: the caller finds the planner and the link.

export function waveReleasedMail(p: {
  to: string;
  name: string;
  waveName: string;
  batches: { number: number; lineCount: number; distanceMm: number }[];
  distanceMm: number;
  baselineMm: number;
  link: string;
}) {
  const name = headerText(p.name, 120);
  const wave = headerText(p.waveName, 120);
  return {
    to: p.to,
    toName: name,
    subject: headerText(`Wave released: ${wave} (${p.batches.length} batches)`),
    text: [
      `Hello ${name},`,
      "",
      `${wave} is released to the pickers: ${p.batches.length} batches, ${metres(p.distanceMm)} of walking in all, ${savingsPct(p.distanceMm, p.baselineMm)} less than the usual order.`,
      "",
      ...p.batches.map((b) => `  Batch ${b.number}: ${b.lineCount} lines, ${metres(b.distanceMm)}`),
      "",
      `Follow the picking here: ${p.link}`,
    ].join("\n"),
  };
}

export function shortPickSummaryMail(p: {
  to: string;
  name: string;
  waveName: string;
  shorts: Omit<ShortPickDTO, "at">[];
  link: string;
}) {
  const name = headerText(p.name, 120);
  const wave = headerText(p.waveName, 120);
  return {
    to: p.to,
    toName: name,
    subject: headerText(`Wave picked: ${wave}, ${p.shorts.length} short pick${p.shorts.length === 1 ? "" : "s"}`),
    text: [
      `Hello ${name},`,
      "",
      p.shorts.length === 0
        ? `Every batch of ${wave} is picked, with no short picks.`
        : `Every batch of ${wave} is picked. These lines were short and need following up:`,
      "",
      ...p.shorts.map(
        (s) =>
          `  Batch ${s.batchNumber}, order ${s.orderNumber}: ${s.sku} at ${s.binCode}, ${s.picked} of ${s.ordered} (${s.reason ?? "no reason given"})`,
      ),
      "",
      `The wave: ${p.link}`,
    ].join("\n"),
  };
}
