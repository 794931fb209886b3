import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { PNG } from "pngjs";
import manifest from "@/app/manifest";
import { drawIcon, ICONS } from "../../scripts/make-icons";

const PUBLIC = path.join(process.cwd(), "public");

/** [PNG spec (W3C / ISO/IEC 15948) §5.2–5.3, read] 8-byte signature, then IHDR: width and height, 4 bytes each, big-endian. */
function pngSize(buf: Buffer): { width: number; height: number } {
  expect(buf.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect(buf.toString("latin1", 12, 16)).toBe("IHDR");
  return { width: buf.readUInt32BE(16), height: buf.readUInt32BE(20) };
}

describe("app icons", () => {
  it("every icon the manifest names is committed, with the size it states", () => {
    const m = manifest();
    const all = [...(m.icons ?? []), ...(m.shortcuts ?? []).flatMap((s) => s.icons ?? [])];
    expect(all.length).toBeGreaterThanOrEqual(4);
    for (const icon of all) {
      const [w, h] = String(icon.sizes).split("x").map(Number);
      const file = fs.readFileSync(path.join(PUBLIC, icon.src));
      expect(pngSize(file)).toEqual({ width: w, height: h });
      // Decoded by pngjs, an independent reader: the pixels really are that size.
      const png = PNG.sync.read(file);
      expect([png.width, png.height]).toEqual([w, h]);
    }
  });

  it("has 192 and 512 px icons for both purposes", () => {
    const icons = manifest().icons ?? [];
    for (const purpose of ["any", "maskable"]) {
      expect(icons.filter((i) => i.purpose === purpose).map((i) => i.sizes).sort()).toEqual(["192x192", "512x512"]);
    }
  });

  it("the committed files are what scripts/make-icons.ts draws", () => {
    for (const spec of ICONS) {
      const committed = PNG.sync.read(fs.readFileSync(path.join(PUBLIC, spec.file)));
      expect(Buffer.compare(committed.data, drawIcon(spec).data), spec.file).toBe(0);
    }
  });

  it("maskable icons keep the mark inside the safe zone and fill every pixel", () => {
    // [W3C Web App Manifest, "icon masks", memory] the safe zone of a maskable icon is the centred circle whose
    // radius is 40 % of the icon's size; platforms may crop anything outside it.
    for (const spec of ICONS.filter((s) => s.file.includes("maskable"))) {
      const png = drawIcon(spec);
      const c = png.width / 2;
      const r = 0.4 * png.width;
      let transparent = 0;
      let markPixels = 0;
      let outside = 0;
      for (let y = 0; y < png.height; y++) {
        for (let x = 0; x < png.width; x++) {
          const i = (y * png.width + x) * 4;
          if (png.data[i + 3] !== 255) transparent++; // opaque everywhere: the mask decides the outline
          const isMark = png.data[i]! > 0x80 && png.data[i + 1]! > 0x80; // white-ish, not the violet ground
          if (!isMark) continue;
          markPixels++;
          if (Math.hypot(x + 0.5 - c, y + 0.5 - c) > r) outside++;
        }
      }
      expect({ file: spec.file, transparent, outside }).toEqual({ file: spec.file, transparent: 0, outside: 0 });
      expect(markPixels).toBeGreaterThan(png.width * png.height * 0.05);
    }
  });

  it("favicon.ico holds the 16 and 32 px PNGs", () => {
    // [Microsoft ICO format, memory] ICONDIR: reserved 0, type 1 (icon), count; 16-byte entries with width,
    // height, …, size (bytes 8–11) and offset (bytes 12–15); PNG-compressed images are allowed.
    const ico = fs.readFileSync(path.join(PUBLIC, "favicon.ico"));
    expect([ico.readUInt16LE(0), ico.readUInt16LE(2), ico.readUInt16LE(4)]).toEqual([0, 1, 2]);
    const sizes = [0, 1].map((n) => {
      const e = 6 + 16 * n;
      const bytes = ico.readUInt32LE(e + 8);
      const offset = ico.readUInt32LE(e + 12);
      const size = pngSize(ico.subarray(offset, offset + bytes));
      expect(size.width).toBe(ico.readUInt8(e));
      return size.width;
    });
    expect(sizes).toEqual([16, 32]);
  });
});
