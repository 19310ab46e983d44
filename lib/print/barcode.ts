import "server-only";
import bwipjs from "bwip-js/node";

/** A Code 128 barcode as SVG markup, with the text under it for eyes. */
export function code128Svg(text: string): string {
  return bwipjs.toSVG({ bcid: "code128", text, scale: 3, height: 12, includetext: true, textxalign: "center" });
}
