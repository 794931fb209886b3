/**
 * Draws Benchwright's app icons into public/ (run: npm run icons; the PNG files are committed).
 *
 * The mark is our own: a bold white "B" standing on a bench top, on the app's accent violet (#4b3a9c from
 * app/globals.css). Shapes are drawn in a 100 × 100 design space and sampled 4 × 4 per pixel for smooth edges.
 */
import fs from "node:fs";
import path from "node:path";
import { PNG } from "pngjs";

const ACCENT = [0x4b, 0x3a, 0x9c] as const;
const WHITE = [0xff, 0xff, 0xff] as const;
const OUT = path.join(process.cwd(), "public");

type Shape = (x: number, y: number) => boolean;

const rect =
  (x0: number, x1: number, y0: number, y1: number): Shape =>
  (x, y) =>
    x >= x0 && x <= x1 && y >= y0 && y <= y1;
/** The right half of a disc (a bowl of the letter). */
const rightHalfDisc =
  (cx: number, cy: number, r: number): Shape =>
  (x, y) =>
    x >= cx && (x - cx) ** 2 + (y - cy) ** 2 <= r * r;
const union =
  (...shapes: Shape[]): Shape =>
  (x, y) =>
    shapes.some((s) => s(x, y));
const minus =
  (a: Shape, b: Shape): Shape =>
  (x, y) =>
    a(x, y) && !b(x, y);

// The "B": a 12-unit stem, two bowls with 11-unit strokes, the lower bowl a little wider.
const upperBowl = minus(
  union(rect(30, 52, 20, 54), rightHalfDisc(52, 37, 17)),
  union(rect(42, 52, 31, 43), rightHalfDisc(52, 37, 6)),
);
const lowerBowl = minus(
  union(rect(30, 55, 43, 76), rightHalfDisc(55, 59.5, 16.5)),
  union(rect(42, 55, 54, 65), rightHalfDisc(55, 59.5, 5.5)),
);
// The bench top it stands on, with two short legs.
const bench = union(rect(22, 78, 79, 84), rect(26, 31, 84, 90), rect(69, 74, 84, 90));
const drawn = union(upperBowl, lowerBowl, bench);
/** The mark spans y 20–90: moved up 5 units so it sits in the middle. */
const glyph: Shape = (x, y) => drawn(x, y + 5);

/** Inside a rounded square covering the whole canvas (corner radius in design units). */
const roundedSquare =
  (radius: number): Shape =>
  (x, y) => {
    const cx = Math.min(Math.max(x, radius), 100 - radius);
    const cy = Math.min(Math.max(y, radius), 100 - radius);
    return (x - cx) ** 2 + (y - cy) ** 2 <= radius * radius;
  };

interface IconSpec {
  file: string;
  size: number;
  /** Scale of the glyph around the centre: maskable icons keep it inside the central 80 % safe circle. */
  glyphScale: number;
  /** Rounded corners with transparency ("any" icons); full-bleed squares for maskable and Apple icons. */
  cornerRadius?: number;
}

export const ICONS: IconSpec[] = [
  { file: "icons/icon-192.png", size: 192, glyphScale: 1, cornerRadius: 22 },
  { file: "icons/icon-512.png", size: 512, glyphScale: 1, cornerRadius: 22 },
  { file: "icons/maskable-192.png", size: 192, glyphScale: 0.72 },
  { file: "icons/maskable-512.png", size: 512, glyphScale: 0.72 },
  { file: "icons/apple-touch-icon.png", size: 180, glyphScale: 0.85 },
  { file: "icons/favicon-32.png", size: 32, glyphScale: 1.08, cornerRadius: 18 },
  { file: "icons/favicon-16.png", size: 16, glyphScale: 1.12, cornerRadius: 16 },
];

export function drawIcon({ size, glyphScale, cornerRadius }: IconSpec): PNG {
  const png = new PNG({ width: size, height: size });
  const background: Shape = cornerRadius ? roundedSquare(cornerRadius) : () => true;
  const S = 4;
  for (let py = 0; py < size; py++) {
    for (let px = 0; px < size; px++) {
      let bg = 0;
      let fg = 0;
      for (let sy = 0; sy < S; sy++) {
        for (let sx = 0; sx < S; sx++) {
          const x = ((px + (sx + 0.5) / S) / size) * 100;
          const y = ((py + (sy + 0.5) / S) / size) * 100;
          if (!background(x, y)) continue;
          bg++;
          if (glyph(50 + (x - 50) / glyphScale, 50 + (y - 50) / glyphScale)) fg++;
        }
      }
      const i = (py * size + px) * 4;
      const t = bg ? fg / bg : 0;
      for (let c = 0; c < 3; c++) png.data[i + c] = Math.round(ACCENT[c]! * (1 - t) + WHITE[c]! * t);
      png.data[i + 3] = Math.round((bg / (S * S)) * 255);
    }
  }
  return png;
}

/** A .ico that holds PNG images (read by every current browser). */
export function icoFrom(pngs: { size: number; data: Buffer }[]): Buffer {
  const header = Buffer.alloc(6 + 16 * pngs.length);
  header.writeUInt16LE(0, 0);
  header.writeUInt16LE(1, 2); // 1 = icon
  header.writeUInt16LE(pngs.length, 4);
  let offset = header.length;
  pngs.forEach((p, n) => {
    const e = 6 + 16 * n;
    header.writeUInt8(p.size >= 256 ? 0 : p.size, e);
    header.writeUInt8(p.size >= 256 ? 0 : p.size, e + 1);
    header.writeUInt8(0, e + 2); // no palette
    header.writeUInt8(0, e + 3);
    header.writeUInt16LE(1, e + 4); // colour planes
    header.writeUInt16LE(32, e + 6); // bits per pixel
    header.writeUInt32LE(p.data.length, e + 8);
    header.writeUInt32LE(offset, e + 12);
    offset += p.data.length;
  });
  return Buffer.concat([header, ...pngs.map((p) => p.data)]);
}

function main() {
  const written: Record<string, Buffer> = {};
  for (const spec of ICONS) {
    const data = PNG.sync.write(drawIcon(spec), { colorType: 6 });
    const file = path.join(OUT, spec.file);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, data);
    written[spec.file] = data;
    console.log(`wrote public/${spec.file} (${spec.size}×${spec.size}, ${data.length} bytes)`);
  }
  const ico = icoFrom([
    { size: 16, data: written["icons/favicon-16.png"]! },
    { size: 32, data: written["icons/favicon-32.png"]! },
  ]);
  fs.writeFileSync(path.join(OUT, "favicon.ico"), ico);
  console.log(`wrote public/favicon.ico (${ico.length} bytes)`);
}

if (import.meta.url === `file://${process.argv[1]}` || process.argv[1]?.endsWith("make-icons.ts")) main();
