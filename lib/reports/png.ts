/**
 * PNG encoding of a {@link Raster} (pngjs, pure JS: no native canvas), and data URLs for the
 * print page. Server-side only (pngjs uses Node's zlib).
 */
import { PNG } from "pngjs";
import type { Raster } from "./raster";

/** The raster as PNG bytes (8-bit RGB: the charts are opaque, so no alpha channel and no PDF soft mask). */
export function encodePng(img: Raster): Buffer {
  const png = new PNG({ width: img.width, height: img.height });
  png.data = Buffer.from(img.data.buffer, img.data.byteOffset, img.data.byteLength);
  return PNG.sync.write(png, { colorType: 2, inputHasAlpha: true });
}

/** `data:image/png;base64,…` for an <img> on the print page. */
export function pngDataUrl(png: Buffer): string {
  return `data:image/png;base64,${png.toString("base64")}`;
}
