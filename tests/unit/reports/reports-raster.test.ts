/**
 * The report rasteriser: raster size, Bresenham lines on known pixels, the PNG container
 * (read back with pngjs's decoder, PNG spec: IHDR width/height, 8-bit RGBA) and tick rules.
 */
import { PNG } from "pngjs";
import { describe, expect, it } from "vitest";
import { niceTicks, renderLineChart, timeTicks } from "@/lib/reports/line-chart";
import { encodePng } from "@/lib/reports/png";
import { createRaster, drawLine, getPixel, hexColour } from "@/lib/reports/raster";

const RED = hexColour("#ff0000");
const WHITE = { r: 255, g: 255, b: 255 };

describe("drawLine", () => {
  it("lights every pixel of a horizontal and of a 45° line and nothing beside them (Bresenham 1965)", () => {
    const img = createRaster(20, 20);
    drawLine(img, 2, 5, 12, 5, RED);
    drawLine(img, 0, 10, 9, 19, RED);
    for (let x = 2; x <= 12; x++) expect(getPixel(img, x, 5)).toEqual(RED);
    expect(getPixel(img, 1, 5)).toEqual(WHITE);
    expect(getPixel(img, 13, 5)).toEqual(WHITE);
    expect(getPixel(img, 7, 4)).toEqual(WHITE);
    for (let i = 0; i <= 9; i++) expect(getPixel(img, i, 10 + i)).toEqual(RED);
    expect(getPixel(img, 5, 14)).toEqual(WHITE);
  });

  it("draws a shallow line with exactly one pixel per column (slope < 1)", () => {
    const img = createRaster(30, 10);
    drawLine(img, 0, 0, 29, 7, RED);
    for (let x = 0; x < 30; x++) {
      let lit = 0;
      for (let y = 0; y < 10; y++) if (getPixel(img, x, y).g === 0) lit++;
      expect(lit).toBe(1);
      // The lit pixel is the rounded ideal line y = 7x/29 (Bresenham's error bound ≤ ½ pixel).
      expect(getPixel(img, x, Math.round((7 * x) / 29))).toEqual(RED);
    }
  });
});

describe("encodePng", () => {
  it("writes a PNG whose header gives the raster's width and height and whose pixels read back", () => {
    const img = createRaster(37, 23);
    drawLine(img, 0, 11, 36, 11, RED);
    const bytes = encodePng(img);
    // PNG signature (PNG spec §5.2) then IHDR: width and height as big-endian uint32 at 16 and 20.
    expect([...bytes.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    expect(bytes.readUInt32BE(16)).toBe(37);
    expect(bytes.readUInt32BE(20)).toBe(23);
    const back = PNG.sync.read(bytes);
    expect([back.width, back.height]).toEqual([37, 23]);
    const at = (x: number, y: number) => [...back.data.subarray((y * 37 + x) * 4, (y * 37 + x) * 4 + 4)];
    expect(at(18, 11)).toEqual([255, 0, 0, 255]); // pngjs decodes RGB to RGBA, alpha 255
    expect(at(18, 12)).toEqual([255, 255, 255, 255]);
  });
});

describe("renderLineChart", () => {
  it("puts a constant series on the pixel row of its value", () => {
    const x = [Date.UTC(2026, 0, 1), Date.UTC(2026, 0, 31)];
    const chart = renderLineChart({
      width: 400, height: 200, yRange: [0, 10],
      series: [{ kind: "line", x, y: [5, 5], colour: "#0000ff", size: 1 }],
    });
    const row = Math.round(chart.yToPx(5));
    // Half way up the plot area: linear axis mapping.
    expect(row).toBe(Math.round((chart.plot.top + chart.plot.bottom) / 2));
    const mid = Math.round((chart.plot.left + chart.plot.right) / 2);
    expect(getPixel(chart.raster, mid, row)).toEqual({ r: 0, g: 0, b: 255 });
    expect(chart.raster.width).toBe(400);
    expect(chart.raster.height).toBe(200);
  });
});

describe("tick rules", () => {
  it("chooses 1–2–5 steps (Heckbert, Graphics Gems I, 'nice numbers for graph labels')", () => {
    expect(niceTicks(0, 10, 5)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(niceTicks(2.31, 2.38, 5).map((v) => Number(v.toFixed(6)))).toEqual([2.32, 2.34, 2.36, 2.38]);
  });

  it("labels month starts over a long span and day starts over a short one (UTC)", () => {
    const m = timeTicks(Date.UTC(2026, 0, 15), Date.UTC(2026, 5, 15));
    expect(m.map((t) => t.label)).toEqual(["2026-02", "2026-03", "2026-04", "2026-05", "2026-06"]);
    const d = timeTicks(Date.UTC(2026, 2, 1, 12), Date.UTC(2026, 2, 4, 12));
    expect(d.map((t) => t.label)).toEqual(["03-02", "03-03", "03-04"]);
  });
});
