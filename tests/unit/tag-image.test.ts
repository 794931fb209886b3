/**
 * The fake-camera kit draws tags that an independent decoder reads back: bwip-js encodes, @zxing/library decodes
 * (RGBLuminanceSource → HybridBinarizer → MultiFormatReader), from the very picture the Y4M clip is made of,
 * and from the clip's own luma plane.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { BarcodeFormat, BinaryBitmap, DecodeHintType, HybridBinarizer, MultiFormatReader, RGBLuminanceSource } from "@zxing/library";
import { centreOnWhite, CLIP_FRAMES, CLIP_HEIGHT, CLIP_WIDTH, drawTag, writeY4m, yuv420Frame } from "@/tests/fixtures/y4m";
import { formatTagCode, generateTagCode, isValidTagCode } from "@/lib/trade/tag-code";

const CODE = generateTagCode(() => 0.42);

function decodeLuma(luma: Uint8ClampedArray, width: number, height: number) {
  const reader = new MultiFormatReader();
  const hints = new Map<DecodeHintType, unknown>([[DecodeHintType.POSSIBLE_FORMATS, [BarcodeFormat.CODE_128, BarcodeFormat.QR_CODE]]]);
  reader.setHints(hints);
  return reader.decode(new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(luma, width, height))));
}

describe("tag pictures for the fake camera", () => {
  it("Code 128 of the printed form decodes back from the clip's luma plane", async () => {
    expect(isValidTagCode(CODE)).toBe(true);
    const picture = centreOnWhite(await drawTag(formatTagCode(CODE), "code128"));
    expect([picture.width, picture.height]).toEqual([CLIP_WIDTH, CLIP_HEIGHT]);
    const frame = yuv420Frame(picture);
    const luma = new Uint8ClampedArray(frame.subarray(0, CLIP_WIDTH * CLIP_HEIGHT));
    const result = decodeLuma(luma, CLIP_WIDTH, CLIP_HEIGHT);
    expect(result.getText()).toBe(formatTagCode(CODE));
    expect(result.getBarcodeFormat()).toBe(BarcodeFormat.CODE_128);
  });

  it("QR decodes back too", async () => {
    const picture = centreOnWhite(await drawTag(CODE, "qr"));
    const luma = new Uint8ClampedArray(yuv420Frame(picture).subarray(0, CLIP_WIDTH * CLIP_HEIGHT));
    const result = decodeLuma(luma, CLIP_WIDTH, CLIP_HEIGHT);
    expect(result.getText()).toBe(CODE);
    expect(result.getBarcodeFormat()).toBe(BarcodeFormat.QR_CODE);
  });

  it("white is Y 255 and neutral chroma 128; black is Y 0 [BT.601]", () => {
    const white = { width: 2, height: 2, data: Buffer.alloc(16, 255) };
    expect([...yuv420Frame(white)]).toEqual([255, 255, 255, 255, 128, 128]);
    const black = { width: 2, height: 2, data: Buffer.from([0, 0, 0, 255, 0, 0, 0, 255, 0, 0, 0, 255, 0, 0, 0, 255]) };
    expect([...yuv420Frame(black)]).toEqual([0, 0, 0, 0, 128, 128]);
  });

  it("the clip has the header and frame layout Chromium reads", () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "y4m-")), "white.y4m");
    writeY4m(file, { width: CLIP_WIDTH, height: CLIP_HEIGHT, data: Buffer.alloc(CLIP_WIDTH * CLIP_HEIGHT * 4, 255) }, 2);
    const bytes = fs.readFileSync(file);
    const header = "YUV4MPEG2 W640 H480 F30:1 Ip A1:1 C420jpeg\n";
    expect(bytes.subarray(0, header.length).toString("ascii")).toBe(header);
    const frameBytes = 6 + CLIP_WIDTH * CLIP_HEIGHT * 1.5;
    expect(bytes.length).toBe(header.length + 2 * frameBytes);
    expect(bytes.subarray(header.length, header.length + 6).toString("ascii")).toBe("FRAME\n");
    expect(CLIP_FRAMES).toBe(30);
    fs.rmSync(path.dirname(file), { recursive: true, force: true });
  });
});
