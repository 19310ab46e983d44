import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import { metres } from "./units";

type Certified = Pick<BatchSummaryDTO, "certificate" | "optimal" | "lowerBoundMm">;

/**
 * The batch page's and pick list's line on the route: the certificate, and the bound itself in metres
 * when it proves something short of shortest. The bound goes down to the 0.1 m shown, never up, so
 * the line never claims more than was proved.
 */
export function routeCertificateLine(b: Certified): string {
  if (b.optimal || !(b.lowerBoundMm > 0)) return b.certificate;
  return `${b.certificate}; no walk through these stops is shorter than ${metres(Math.floor(b.lowerBoundMm / 100) * 100)}`;
}
