/**
 * Small layout helpers over pdfkit for the report: WinAnsi-safe text (the 14 standard PDF
 * fonts pdfkit bundles as AFM files cover only Windows-1252), headings, paragraphs, a
 * wrapping table that breaks across pages, a coloured note box. Server-side only.
 */
import PDFDocument from "pdfkit";

export type Pdf = PDFKit.PDFDocument;

export const INK = "#1f2933";
export const MUTED = "#52606d";

// Windows-1252 characters above 0x7F that exist in the standard fonts' encoding.
const CP1252_EXTRA = new Set("€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ");
const REPLACE: Record<string, string> = { "−": "-", "σ": "sigma", "λ": "lambda", "ζ": "zeta", "≥": ">=", "≤": "<=", "×": "x", "→": "->", "≈": "~" };

/** Text the standard fonts can show: known signs spelled out, anything else as "?". */
export function winAnsi(s: string): string {
  let out = "";
  for (const ch of s) {
    const code = ch.codePointAt(0) ?? 63;
    if (code < 0x80 || (code >= 0xa0 && code <= 0xff) || CP1252_EXTRA.has(ch)) out += ch;
    else out += REPLACE[ch] ?? "?";
  }
  return out;
}

/** A new A4 document with buffered pages (for the page footer). */
export function newPdf(title: string, author: string): Pdf {
  return new PDFDocument({
    size: "A4", margins: { top: 56, bottom: 56, left: 56, right: 56 }, bufferPages: true,
    info: { Title: winAnsi(title), Author: winAnsi(author), Creator: "Modewarden" },
  });
}

/** The document's bytes once it is ended. */
export function pdfBytes(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    doc.end();
  });
}

export const contentWidth = (doc: Pdf) => doc.page.width - doc.page.margins.left - doc.page.margins.right;
const bottomOf = (doc: Pdf) => doc.page.height - doc.page.margins.bottom;

/** Start a new page unless `height` points fit below the cursor. */
export function ensureSpace(doc: Pdf, height: number): void {
  if (doc.y + height > bottomOf(doc)) doc.addPage();
}

export function heading(doc: Pdf, text: string, size = 14): void {
  ensureSpace(doc, size * 3);
  doc.moveDown(0.6).font("Helvetica-Bold").fontSize(size).fillColor(INK).text(winAnsi(text), doc.page.margins.left, doc.y, { width: contentWidth(doc) });
  doc.moveDown(0.3);
}

export function paragraph(doc: Pdf, text: string, opts: { size?: number; colour?: string; bold?: boolean } = {}): void {
  doc.font(opts.bold ? "Helvetica-Bold" : "Helvetica").fontSize(opts.size ?? 10).fillColor(opts.colour ?? INK)
    .text(winAnsi(text), doc.page.margins.left, doc.y, { width: contentWidth(doc), lineGap: 2 });
  doc.moveDown(0.4);
}

export function bullets(doc: Pdf, items: string[]): void {
  for (const item of items) {
    ensureSpace(doc, 24);
    const x = doc.page.margins.left;
    const y = doc.y;
    doc.font("Helvetica").fontSize(10).fillColor(INK).text("•", x + 4, y);
    doc.text(winAnsi(item), x + 16, y, { width: contentWidth(doc) - 16, lineGap: 2 });
    doc.moveDown(0.3);
  }
}

/** A box with a coloured left rule around a paragraph (the caution). */
export function noteBox(doc: Pdf, title: string, text: string, colour = "#b45309"): void {
  const w = contentWidth(doc);
  const x = doc.page.margins.left;
  const body = `${winAnsi(title)} ${winAnsi(text)}`;
  doc.font("Helvetica").fontSize(9);
  const h = doc.heightOfString(body, { width: w - 24, lineGap: 2 }) + 16;
  ensureSpace(doc, h + 8);
  const y = doc.y;
  doc.save().rect(x, y, w, h).fill("#fffbeb").rect(x, y, 4, h).fill(colour).restore();
  doc.font("Helvetica-Bold").fontSize(9).fillColor(INK).text(winAnsi(title), x + 14, y + 8, { width: w - 24, continued: true, lineGap: 2 })
    .font("Helvetica").text(` ${winAnsi(text)}`, { lineGap: 2 });
  doc.y = y + h + 8;
}

export interface Column { title: string; width: number; align?: "left" | "right" }

/** A table with a bold header row; rows wrap inside their cells and break across pages (header repeated). */
export function table(doc: Pdf, columns: Column[], rows: string[][]): void {
  const x0 = doc.page.margins.left;
  const totalW = columns.reduce((a, c) => a + c.width, 0);
  const drawRow = (cells: string[], bold: boolean) => {
    doc.font(bold ? "Helvetica-Bold" : "Helvetica").fontSize(8.5);
    const h = Math.max(...cells.map((c, i) => doc.heightOfString(winAnsi(c), { width: columns[i].width - 6 }))) + 6;
    const y = doc.y;
    let x = x0;
    cells.forEach((c, i) => {
      doc.fillColor(bold ? INK : "#323f4b").text(winAnsi(c), x + 3, y + 3, { width: columns[i].width - 6, align: columns[i].align ?? "left" });
      x += columns[i].width;
    });
    doc.moveTo(x0, y + h).lineTo(x0 + totalW, y + h).lineWidth(bold ? 0.8 : 0.3).strokeColor(bold ? MUTED : "#cbd2d9").stroke();
    doc.y = y + h;
    return h;
  };
  ensureSpace(doc, 40);
  drawRow(columns.map((c) => c.title), true);
  for (const r of rows) {
    doc.font("Helvetica").fontSize(8.5);
    const h = Math.max(...r.map((c, i) => doc.heightOfString(winAnsi(c), { width: columns[i].width - 6 }))) + 6;
    if (doc.y + h > bottomOf(doc)) {
      doc.addPage();
      drawRow(columns.map((c) => c.title), true);
    }
    drawRow(r, false);
  }
  doc.x = x0;
  doc.moveDown(0.6);
}
