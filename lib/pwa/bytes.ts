/**
 * Storage sizes for people: decimal SI prefixes (1 kB = 1000 bytes, 1 MB = 10^6 bytes, as IEC 80000-13 defines
 * kilo and mega), which is also how phones show storage.
 */
const UNITS = ["bytes", "kB", "MB", "GB", "TB"] as const;

export function formatBytes(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) return "unknown";
  if (bytes < 1000) return `${Math.round(bytes)} ${bytes === 1 ? "byte" : "bytes"}`;
  let unit = 0;
  let value = bytes;
  while (value >= 1000 && unit < UNITS.length - 1) {
    value /= 1000;
    unit++;
  }
  // Three significant figures at most: 1.23 MB, 12.3 MB, 123 MB (999.6 kB rounds up to 1 MB).
  const round = (v: number) => Number(v.toFixed(v >= 100 ? 0 : v >= 10 ? 1 : 2));
  if (round(value) >= 1000 && unit < UNITS.length - 1) {
    value /= 1000;
    unit++;
  }
  return `${round(value)} ${UNITS[unit]}`;
}
