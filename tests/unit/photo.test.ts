import { createHash, randomBytes } from "node:crypto";
import { describe, expect, it } from "vitest";
import { fitWithin, MAX_PHOTO_EDGE_PX, sha256Hex } from "@/lib/bench/photo";

describe("photo hash (the upload's idempotency key)", () => {
  it('matches the published SHA-256 examples [FIPS 180-2 App. B.1: "abc"; empty message]', async () => {
    const abc = new TextEncoder().encode("abc");
    expect(await sha256Hex(abc)).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(await sha256Hex(new Uint8Array())).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });

  it("agrees with Node's own crypto on random bytes, from a Blob or an ArrayBuffer", async () => {
    for (const size of [1, 63, 64, 65, 100_000]) {
      const bytes = randomBytes(size);
      const expected = createHash("sha256").update(bytes).digest("hex"); // [Node.js crypto, OpenSSL]
      expect(await sha256Hex(new Blob([bytes]))).toBe(expected);
      expect(await sha256Hex(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))).toBe(expected);
    }
  });
});

describe("downscale size", () => {
  it("fits the long edge to 1600 px and keeps the aspect ratio [arithmetic: 4032×3024 is 4:3]", () => {
    expect(MAX_PHOTO_EDGE_PX).toBe(1600);
    expect(fitWithin(4032, 3024)).toEqual({ width: 1600, height: 1200 });
    expect(fitWithin(3024, 4032)).toEqual({ width: 1200, height: 1600 });
    expect(fitWithin(4000, 1800)).toEqual({ width: 1600, height: 720 });
  });
  it("never enlarges a small picture", () => {
    expect(fitWithin(1200, 900)).toEqual({ width: 1200, height: 900 });
    expect(fitWithin(1600, 1600)).toEqual({ width: 1600, height: 1600 });
  });
});
