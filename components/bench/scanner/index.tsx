"use client";

/**
 * The scanner, loaded only when it is shown: @zxing/browser lives in its own chunk, outside the bench's first load.
 */
import dynamic from "next/dynamic";
import type { TagScannerProps } from "./tag-scanner";

export type { TagScannerProps };
export { ManualTagEntry } from "./manual-tag-entry";

export const LazyTagScanner = dynamic<TagScannerProps>(() => import("./tag-scanner"), {
  ssr: false,
  loading: () => (
    <div className="flex aspect-[4/3] w-full items-center justify-center rounded-2xl bg-black text-lg font-semibold text-white">
      Loading the scanner…
    </div>
  ),
});
