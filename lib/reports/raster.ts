/**
 * A small pure-JS RGBA raster for the report charts: no native canvas, no Node built-ins, so
 * the same drawing runs in a worker, a route handler or a unit test. Pixels are row-major
 * RGBA bytes, (0, 0) top-left. Drawing is aliased (whole pixels): the charts are read at
 * print resolution where a 2-pixel pen is crisp enough.
 */

/** An sRGB colour, each channel 0–255. */
export interface Rgb { r: number; g: number; b: number }

export interface Raster {
  width: number;
  height: number;
  /** width·height·4 bytes, RGBA, row-major from the top-left pixel. */
  data: Uint8Array;
}

/** "#rrggbb" → Rgb. */
export function hexColour(hex: string): Rgb {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new TypeError(`colour must be #rrggbb (got ${hex})`);
  return { r: parseInt(m[1], 16), g: parseInt(m[2], 16), b: parseInt(m[3], 16) };
}

/**
 * A raster filled with one opaque colour.
 * @throws RangeError unless width and height are integers in [1, 8192].
 */
export function createRaster(width: number, height: number, background: Rgb = { r: 255, g: 255, b: 255 }): Raster {
  for (const [name, v] of [["width", width], ["height", height]] as const) {
    if (!Number.isInteger(v) || v < 1 || v > 8192) throw new RangeError(`${name} must be an integer in [1, 8192] (got ${v})`);
  }
  const data = new Uint8Array(width * height * 4);
  for (let i = 0; i < data.length; i += 4) {
    data[i] = background.r; data[i + 1] = background.g; data[i + 2] = background.b; data[i + 3] = 255;
  }
  return { width, height, data };
}

/** Paint one pixel (ignored outside the raster). */
export function setPixel(img: Raster, x: number, y: number, c: Rgb): void {
  const xi = Math.round(x);
  const yi = Math.round(y);
  if (xi < 0 || yi < 0 || xi >= img.width || yi >= img.height) return;
  const i = (yi * img.width + xi) * 4;
  img.data[i] = c.r; img.data[i + 1] = c.g; img.data[i + 2] = c.b; img.data[i + 3] = 255;
}

/** The colour of one pixel (for tests and checks). */
export function getPixel(img: Raster, x: number, y: number): Rgb {
  const i = (y * img.width + x) * 4;
  return { r: img.data[i], g: img.data[i + 1], b: img.data[i + 2] };
}

/** Fill the rectangle [x, x + w) × [y, y + h) (clipped). */
export function fillRect(img: Raster, x: number, y: number, w: number, h: number, c: Rgb): void {
  const x0 = Math.max(0, Math.round(x));
  const y0 = Math.max(0, Math.round(y));
  const x1 = Math.min(img.width, Math.round(x + w));
  const y1 = Math.min(img.height, Math.round(y + h));
  for (let yy = y0; yy < y1; yy++) for (let xx = x0; xx < x1; xx++) setPixel(img, xx, yy, c);
}

/**
 * A straight line by Bresenham's algorithm, drawn with a square pen `width` pixels wide
 * (centred on the ideal line). Endpoints may lie outside the raster; pixels outside are dropped.
 */
export function drawLine(img: Raster, x0: number, y0: number, x1: number, y1: number, c: Rgb, width = 1): void {
  if (![x0, y0, x1, y1].every(Number.isFinite)) return;
  let x = Math.round(x0);
  let y = Math.round(y0);
  const xe = Math.round(x1);
  const ye = Math.round(y1);
  const dx = Math.abs(xe - x);
  const dy = -Math.abs(ye - y);
  const sx = x < xe ? 1 : -1;
  const sy = y < ye ? 1 : -1;
  const lo = -Math.floor((width - 1) / 2);
  const hi = Math.ceil((width - 1) / 2);
  let err = dx + dy;
  // Bound the walk so a wild coordinate cannot spin for long: the raster diagonal is enough.
  for (let steps = 0; steps <= dx - dy + 1; steps++) {
    for (let oy = lo; oy <= hi; oy++) for (let ox = lo; ox <= hi; ox++) setPixel(img, x + ox, y + oy, c);
    if (x === xe && y === ye) break;
    const e2 = 2 * err;
    if (e2 >= dy) { err += dy; x += sx; }
    if (e2 <= dx) { err += dx; y += sy; }
  }
}

/** A dashed horizontal line from x0 to x1 at y (dash and gap in pixels). */
export function drawDashedHLine(img: Raster, x0: number, x1: number, y: number, c: Rgb, dash = 6, gap = 4, width = 1): void {
  for (let x = Math.min(x0, x1); x < Math.max(x0, x1); x += dash + gap) drawLine(img, x, y, Math.min(x + dash - 1, Math.max(x0, x1)), y, c, width);
}

/** A filled disc of radius r (pixels) centred on (cx, cy). */
export function fillDisc(img: Raster, cx: number, cy: number, r: number, c: Rgb): void {
  const r2 = r * r;
  for (let dy = -Math.ceil(r); dy <= Math.ceil(r); dy++) {
    for (let dx = -Math.ceil(r); dx <= Math.ceil(r); dx++) if (dx * dx + dy * dy <= r2) setPixel(img, cx + dx, cy + dy, c);
  }
}
