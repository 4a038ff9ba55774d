/**
 * A 5×7 pixel font for the tick labels of the report charts: digits and the few signs a
 * tick label needs (". - + : % /" and space). Glyphs drawn by us for this product; each row
 * is five pixels, '#' lit. Other characters draw as a blank cell.
 */
import { setPixel, type Raster, type Rgb } from "./raster";

const GLYPHS: Record<string, readonly string[]> = {
  "0": [" ### ", "#   #", "#  ##", "# # #", "##  #", "#   #", " ### "],
  "1": ["  #  ", " ##  ", "  #  ", "  #  ", "  #  ", "  #  ", " ### "],
  "2": [" ### ", "#   #", "    #", "   # ", "  #  ", " #   ", "#####"],
  "3": ["#####", "   # ", "  #  ", "   # ", "    #", "#   #", " ### "],
  "4": ["   # ", "  ## ", " # # ", "#  # ", "#####", "   # ", "   # "],
  "5": ["#####", "#    ", "#### ", "    #", "    #", "#   #", " ### "],
  "6": ["  ## ", " #   ", "#    ", "#### ", "#   #", "#   #", " ### "],
  "7": ["#####", "    #", "   # ", "  #  ", " #   ", " #   ", " #   "],
  "8": [" ### ", "#   #", "#   #", " ### ", "#   #", "#   #", " ### "],
  "9": [" ### ", "#   #", "#   #", " ####", "    #", "   # ", " ##  "],
  ".": ["     ", "     ", "     ", "     ", "     ", " ##  ", " ##  "],
  "-": ["     ", "     ", "     ", "#####", "     ", "     ", "     "],
  "+": ["     ", "  #  ", "  #  ", "#####", "  #  ", "  #  ", "     "],
  ":": ["     ", " ##  ", " ##  ", "     ", " ##  ", " ##  ", "     "],
  "%": ["##   ", "##  #", "   # ", "  #  ", " #   ", "#  ##", "   ##"],
  "/": ["     ", "    #", "   # ", "  #  ", " #   ", "#    ", "     "],
  " ": ["     ", "     ", "     ", "     ", "     ", "     ", "     "],
};

export const GLYPH_W = 5;
export const GLYPH_H = 7;

/** Width in pixels of `text` at `scale` (one blank column between glyphs). */
export function textWidth(text: string, scale = 1): number {
  return text.length === 0 ? 0 : (text.length * (GLYPH_W + 1) - 1) * scale;
}

/** Draw `text` with its top-left corner at (x, y); each font pixel is a scale×scale block. */
export function drawText(img: Raster, text: string, x: number, y: number, c: Rgb, scale = 1): void {
  let cx = Math.round(x);
  const top = Math.round(y);
  for (const ch of text) {
    const g = GLYPHS[ch];
    if (g) {
      for (let row = 0; row < GLYPH_H; row++) {
        for (let col = 0; col < GLYPH_W; col++) {
          if (g[row][col] !== "#") continue;
          for (let sy = 0; sy < scale; sy++) for (let sx = 0; sx < scale; sx++) setPixel(img, cx + col * scale + sx, top + row * scale + sy, c);
        }
      }
    }
    cx += (GLYPH_W + 1) * scale;
  }
}
