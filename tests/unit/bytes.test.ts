import { describe, expect, it } from "vitest";
import prettyBytes from "pretty-bytes";
import { formatBytes } from "@/lib/pwa/bytes";

// [SI / IEC 80000-13, read] kilo = 10^3, mega = 10^6, giga = 10^9 (decimal prefixes; kibi etc. are the binary ones).
describe("formatBytes", () => {
  it("uses decimal prefixes with three significant figures", () => {
    expect(formatBytes(0)).toBe("0 bytes");
    expect(formatBytes(1)).toBe("1 byte");
    expect(formatBytes(999)).toBe("999 bytes");
    expect(formatBytes(1000)).toBe("1 kB");
    expect(formatBytes(1024)).toBe("1.02 kB"); // 1 KiB is 1.024 kB, not 1 kB
    expect(formatBytes(1_500_000)).toBe("1.5 MB");
    expect(formatBytes(12_345_678)).toBe("12.3 MB");
    expect(formatBytes(123_456_789)).toBe("123 MB");
    expect(formatBytes(2_000_000_000)).toBe("2 GB");
  });

  it("rounds 999.6 kB up to the next prefix instead of printing 1000 kB", () => {
    expect(formatBytes(999_600)).toBe("1 MB");
  });

  it("reports nonsense as unknown", () => {
    expect(formatBytes(-1)).toBe("unknown");
    expect(formatBytes(Number.NaN)).toBe("unknown");
  });

  it("agrees with pretty-bytes (a general-purpose formatter using the same SI prefixes)", () => {
    // pretty-bytes' own README example: 1337 → "1.34 kB".
    expect(formatBytes(1337)).toBe(prettyBytes(1337));
    for (const n of [1000, 4321, 98_765, 250_000, 1_048_576, 7_654_321, 45_000_000, 321_000_000, 8_589_934_592]) {
      expect(formatBytes(n)).toBe(prettyBytes(n));
    }
  });
});
