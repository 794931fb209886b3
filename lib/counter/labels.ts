/**
 * Printable tags as PDF: a Code 128 barcode of the tag code (drawn as vector bars from bwip-js's bar
 * widths, so it prints sharp at any printer resolution), the code in large type, and who and what it is for.
 *
 * Layouts: one 4 × 2 in label, one label on a 62 mm roll (100 × 62 mm), or a 10-up sheet on US Letter
 * or A4 with a starting position so a half-used sheet can be finished. PDF user space: 72 pt = 1 in.
 * No framework or database here: the route handler gathers the data.
 */
import bwipjs from "bwip-js/node";
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { formatTagCode, normalizeTagCode } from "../trade/tag-code";

export const PT_PER_IN = 72;
export const mm = (v: number) => (v / 25.4) * PT_PER_IN;
const inch = (v: number) => v * PT_PER_IN;

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface Layout {
  id: LayoutId;
  name: string;
  page: { w: number; h: number };
  /** Label positions on one page, top-left first, row by row. */
  cells: Box[];
}

export const LAYOUT_IDS = ["label-4x2", "roll-62", "sheet-letter", "sheet-a4"] as const;
export type LayoutId = (typeof LAYOUT_IDS)[number];

/** A grid of equal labels, numbered left to right, top to bottom (PDF y grows upwards). */
function grid(page: { w: number; h: number }, cols: number, rows: number, label: { w: number; h: number }, left: number, top: number, gapX: number, gapY: number): Box[] {
  const cells: Box[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      cells.push({ x: left + c * (label.w + gapX), y: page.h - top - (r + 1) * label.h - r * gapY, w: label.w, h: label.h });
    }
  }
  return cells;
}

const LETTER = { w: inch(8.5), h: inch(11) }; // US Letter 8.5 × 11 in (ANSI/ASME Y14.1 size A)
const A4 = { w: mm(210), h: mm(297) }; // A4 210 × 297 mm (ISO 216)

export const LAYOUTS: Record<LayoutId, Layout> = {
  "label-4x2": { id: "label-4x2", name: "2 × 4 in label", page: { w: inch(4), h: inch(2) }, cells: [{ x: 0, y: 0, w: inch(4), h: inch(2) }] },
  "roll-62": { id: "roll-62", name: "62 mm roll (100 mm long)", page: { w: mm(100), h: mm(62) }, cells: [{ x: 0, y: 0, w: mm(100), h: mm(62) }] },
  // 10 labels of 4 × 2 in: 0.5 in top and bottom, 5/32 in sides, 3/16 in between the columns.
  "sheet-letter": { id: "sheet-letter", name: "Letter sheet, 10 labels", page: LETTER, cells: grid(LETTER, 2, 5, { w: inch(4), h: inch(2) }, inch(5 / 32), inch(0.5), inch(3 / 16), 0) },
  // 10 labels of 99.1 × 57 mm: 6 mm top and bottom, 4.65 mm sides, 2.5 mm between the columns.
  "sheet-a4": { id: "sheet-a4", name: "A4 sheet, 10 labels", page: A4, cells: grid(A4, 2, 5, { w: mm(99.1), h: mm(57) }, mm(4.65), mm(6), mm(2.5), 0) },
};

export interface TagLabel {
  /** The tag code (any case, dash optional). */
  code: string;
  kind: "ticket" | "sticker";
  /** Top line, left: "#1004" for a ticket, "MACHINE" for a sticker. */
  heading: string;
  /** Top line, right: the date taken in, or the shop's name. */
  corner: string;
  /** Bold first part of the bottom line: the customer's surname (ticket) or the machine (sticker). */
  who: string;
  /** Rest of the bottom line: the machine (ticket) or its serial (sticker). */
  what: string;
}

/** Code 128 bar and space widths in modules, starting with a bar (ISO/IEC 15417, via bwip-js). */
export function code128Modules(text: string): number[] {
  const raw = bwipjs.raw("code128", text, {}) as Array<{ sbs?: number[] }>;
  const sbs = raw[0]?.sbs;
  if (!sbs?.length) throw new Error("bwip-js returned no Code 128 bars");
  return sbs;
}

/** ISO/IEC 15417 asks for a quiet zone of at least 10 modules each side. */
export const QUIET_MODULES = 10;

/** Letters that do not decompose into a base letter plus accent. */
const PLAIN: Record<string, string> = { Ł: "L", ł: "l", Đ: "D", đ: "d", ı: "i", Ħ: "H", ħ: "h", Ŧ: "T", ŧ: "t" };

/** Replaces characters the standard PDF fonts (WinAnsi) cannot draw: accents are dropped, others become "?". */
export function drawable(font: PDFFont, text: string): string {
  let out = "";
  for (const raw of text) {
    const ch = PLAIN[raw] ?? raw;
    try {
      font.encodeText(ch);
      out += ch;
    } catch {
      const base = ch.normalize("NFD").replace(/[\u0300-\u036f]/g, "");
      try {
        if (base && base !== ch) {
          font.encodeText(base);
          out += base;
          continue;
        }
      } catch {
        /* fall through */
      }
      out += "?";
    }
  }
  return out;
}

/** Cuts text to fit a width, ending with "…". */
function fit(font: PDFFont, text: string, size: number, width: number): string {
  if (font.widthOfTextAtSize(text, size) <= width) return text;
  let t = text;
  while (t.length > 1 && font.widthOfTextAtSize(`${t}…`, size) > width) t = t.slice(0, -1);
  return `${t.trimEnd()}…`;
}

function drawLabel(page: PDFPage, box: Box, label: TagLabel, fonts: { bold: PDFFont; regular: PDFFont }): void {
  const black = rgb(0, 0, 0);
  const pad = Math.min(box.w, box.h) * 0.08;
  const innerW = box.w - 2 * pad;
  const left = box.x + pad;
  let top = box.y + box.h - pad;

  // Top line.
  const small = box.h * 0.1;
  const heading = drawable(fonts.bold, label.heading);
  const corner = fit(fonts.regular, drawable(fonts.regular, label.corner), small * 0.85, innerW - fonts.bold.widthOfTextAtSize(heading, small) - pad);
  page.drawText(heading, { x: left, y: top - small * 0.8, size: small, font: fonts.bold, color: black });
  page.drawText(corner, { x: box.x + box.w - pad - fonts.regular.widthOfTextAtSize(corner, small * 0.85), y: top - small * 0.8, size: small * 0.85, font: fonts.regular, color: black });
  top -= small + box.h * 0.035;

  // The code, as large as fits.
  const printed = formatTagCode(label.code);
  let codeSize = box.h * 0.22;
  while (fonts.bold.widthOfTextAtSize(printed, codeSize) > innerW) codeSize *= 0.95;
  page.drawText(printed, { x: box.x + (box.w - fonts.bold.widthOfTextAtSize(printed, codeSize)) / 2, y: top - codeSize * 0.75, size: codeSize, font: fonts.bold, color: black });
  top -= codeSize * 0.8 + box.h * 0.05;

  // The barcode, centred, with its quiet zones inside the label.
  const bars = code128Modules(normalizeTagCode(label.code));
  const modules = bars.reduce((a, b) => a + b, 0) + 2 * QUIET_MODULES;
  const x1 = Math.min(1.6, innerW / modules); // module width in points (1.6 pt ≈ 0.56 mm)
  const barH = box.h * 0.34;
  let x = box.x + (box.w - modules * x1) / 2 + QUIET_MODULES * x1;
  bars.forEach((w, i) => {
    if (i % 2 === 0) page.drawRectangle({ x, y: top - barH, width: w * x1, height: barH, color: black });
    x += w * x1;
  });
  top -= barH + box.h * 0.045;

  // Bottom line: who (bold) and what, shrunk a little before anything is cut.
  let foot = box.h * 0.095;
  const who = drawable(fonts.bold, label.who);
  const whatFull = drawable(fonts.regular, label.what);
  const lineW = (size: number) => fonts.bold.widthOfTextAtSize(who, size) + (whatFull ? size * 0.5 + fonts.regular.widthOfTextAtSize(whatFull, size) : 0);
  while (lineW(foot) > innerW && foot > box.h * 0.07) foot *= 0.95;
  const whoText = fit(fonts.bold, who, foot, innerW);
  const whoW = fonts.bold.widthOfTextAtSize(whoText, foot);
  const what = whatFull ? fit(fonts.regular, whatFull, foot, Math.max(0, innerW - whoW - foot * 0.5)) : "";
  const footW = whoW + (what ? foot * 0.5 + fonts.regular.widthOfTextAtSize(what, foot) : 0);
  const footX = box.x + (box.w - Math.min(footW, innerW)) / 2;
  page.drawText(whoText, { x: footX, y: top - foot * 0.8, size: foot, font: fonts.bold, color: black });
  if (what) page.drawText(what, { x: footX + whoW + foot * 0.5, y: top - foot * 0.8, size: foot, font: fonts.regular, color: black });
}

/**
 * One PDF with the labels in order. Single-label layouts get one page per label; sheets fill cells from
 * `start` (1-based) and carry on to further pages.
 */
export async function labelsPdf(labels: TagLabel[], layoutId: LayoutId, opts: { start?: number; title?: string } = {}): Promise<Uint8Array> {
  if (labels.length === 0) throw new RangeError("no labels to print");
  const layout = LAYOUTS[layoutId];
  const doc = await PDFDocument.create();
  doc.setTitle(opts.title ?? `Tags ${labels.map((l) => formatTagCode(l.code)).join(", ")}`);
  doc.setCreator("Benchwright");
  doc.setProducer("Benchwright (pdf-lib)");
  const fonts = { bold: await doc.embedFont(StandardFonts.HelveticaBold), regular: await doc.embedFont(StandardFonts.Helvetica) };
  const perPage = layout.cells.length;
  let slot = Math.min(Math.max(1, opts.start ?? 1), perPage) - 1;
  let page: PDFPage | null = null;
  for (const label of labels) {
    if (!page || slot >= perPage) {
      page = doc.addPage([layout.page.w, layout.page.h]);
      if (slot >= perPage) slot = 0;
    }
    drawLabel(page, layout.cells[slot]!, label, fonts);
    slot++;
  }
  return doc.save();
}
