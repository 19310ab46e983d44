// Pure rules of the handheld flow, shared by the server (which decides) and the device (which shows).

export const SHORT_REASONS = ["empty bin", "damaged", "wrong item", "other"] as const;
export type ShortReason = (typeof SHORT_REASONS)[number];

/** Bins from this level up are out of reach from the floor (common practice); the handheld and the printed pick list both mark them. */
export const HIGH_LEVEL = 3;
/** A line this heavy (unit weight × quantity) is a two-person or waist-height lift. */
export const HEAVY_LINE_G = 15_000;

const norm = (s: string) => s.trim().toUpperCase();

/** A scan confirms a line when it reads as the line's bin code or its SKU, ignoring case and spaces around. */
export function scanMatches(scan: string, line: { binCode: string; sku: string }): boolean {
  const s = norm(scan);
  return s !== "" && (s === norm(line.binCode) || s === norm(line.sku));
}

/**
 * The open line of a stop that a scan confirms: the one shown first if the scan is its bin or SKU,
 * otherwise any other open line of the stop in the scanned bin (a stop can span bins on both sides
 * of an aisle, or levels of one bay).
 */
export function lineForScan<L extends { binCode: string; sku: string }>(
  scan: string,
  shown: L,
  openLines: readonly L[],
): L | null {
  if (scanMatches(scan, shown)) return shown;
  return openLines.find((l) => scanMatches(scan, l)) ?? null;
}

/**
 * How long the tap button stays disabled once a new line is on screen: a second tap of a quick
 * double tap lands well within it, so it cannot confirm a line the picker has not yet seen. A line in
 * another bin waits longer, since the picker must walk there before a tap can be meant for it.
 */
export const TAP_HOLD_MS = 700;
export const NEW_BIN_TAP_HOLD_MS = 1500;
export const tapHoldMs = (previousBin: string | null, bin: string) =>
  previousBin !== null && norm(previousBin) !== norm(bin) ? NEW_BIN_TAP_HOLD_MS : TAP_HOLD_MS;

export type CheckLine = { binCode: string; sku: string; quantity: number; pickStatus: "open" | "picked" | "short" };
/** What the handheld saw when the picker confirmed: the line's bin and the batch's version (it changes when the batch is taken or given back). */
export type ConfirmRequest = {
  scan?: string;
  quantity: number;
  short?: { reason: string };
  binCode: string;
  batchVersion: number;
};
export type Verdict = {
  status: number;
  error?: string;
  apply?: { status: "picked" | "short"; pickedQty: number; shortReason: string | null };
};

/** What the server answers to one confirmation, given the line as it is now. */
export function judgeConfirmation(
  line: CheckLine | null,
  batch: { status: string; version: number },
  req: ConfirmRequest,
): Verdict {
  if (batch.status === "planned") return { status: 409, error: "This batch is not released yet. Ask your planner." };
  if (batch.version !== req.batchVersion)
    return {
      status: 409,
      error:
        "This batch was given back or taken by someone since your screen loaded it, so nothing was recorded. Go back to My batches.",
    };
  if (!line) return { status: 404, error: "That line is not in this batch. Reload the batch." };
  if (line.pickStatus !== "open") return { status: 409, error: "This line is already confirmed." };
  if (norm(req.binCode) !== norm(line.binCode))
    return {
      status: 409,
      error: `Your screen showed bin ${req.binCode.trim()} for this line, but it is in bin ${line.binCode}. Nothing was recorded: reload the batch.`,
    };
  if (req.scan !== undefined && !scanMatches(req.scan, line)) {
    return {
      status: 422,
      error: `That is ${req.scan.trim() || "an empty scan"}; this stop is bin ${line.binCode} (SKU ${line.sku}). Scan again.`,
    };
  }
  if (req.short) {
    if (req.quantity < 0 || req.quantity > line.quantity - 1)
      return {
        status: 422,
        error: `A short pick finds 0 to ${line.quantity - 1}; ${line.quantity} is the full quantity.`,
      };
    return { status: 200, apply: { status: "short", pickedQty: req.quantity, shortReason: req.short.reason } };
  }
  if (req.quantity !== line.quantity)
    return { status: 422, error: `This line is ${line.quantity}; if you found fewer, report a short pick.` };
  return { status: 200, apply: { status: "picked", pickedQty: line.quantity, shortReason: null } };
}

/** The order stops are walked on the device: the planned order, with skipped stops moved to the end (last skipped last). */
export function walkingOrder(seqs: number[], skipped: number[]): number[] {
  const later = skipped.filter((s) => seqs.includes(s));
  return [...seqs.filter((s) => !later.includes(s)), ...later];
}

export type Caution = "high-level" | "heavy";

export function cautionsOf(
  lines: { binCode: string; unitWeightG: number; quantity: number }[],
  highLevelBins: Set<string>,
): Caution[] {
  const out: Caution[] = [];
  if (lines.some((l) => highLevelBins.has(l.binCode))) out.push("high-level");
  if (lines.some((l) => l.unitWeightG * l.quantity >= HEAVY_LINE_G)) out.push("heavy");
  return out;
}

export const CAUTION_TEXT: Record<Caution, string> = {
  "high-level": "High level: use a step or ladder as your site rules say.",
  heavy: "Heavy: lift at waist height or with two people.",
};
