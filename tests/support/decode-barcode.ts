import { PNG } from "pngjs";
import {
  BarcodeFormat,
  BinaryBitmap,
  DecodeHintType,
  HybridBinarizer,
  MultiFormatReader,
  RGBLuminanceSource,
} from "@zxing/library";

/** Reads the barcode in a PNG with ZXing (a reference reader this project did not write). */
export function decodeBarcodePng(png: Buffer): string {
  const img = PNG.sync.read(png);
  const luminance = new Uint8ClampedArray(img.width * img.height);
  for (let i = 0; i < luminance.length; i++) {
    const [r, g, b] = [img.data[i * 4]!, img.data[i * 4 + 1]!, img.data[i * 4 + 2]!];
    luminance[i] = Math.round(0.299 * r + 0.587 * g + 0.114 * b);
  }
  const reader = new MultiFormatReader();
  const hints = new Map<DecodeHintType, unknown>([
    [DecodeHintType.POSSIBLE_FORMATS, [BarcodeFormat.CODE_128]],
    [DecodeHintType.TRY_HARDER, true],
  ]);
  const bitmap = new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(luminance, img.width, img.height)));
  return reader.decode(bitmap, hints).getText();
}
