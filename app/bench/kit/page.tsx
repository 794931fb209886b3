/**
 * DEV-ONLY KIT PAGE — a demo of the bench building blocks for screenshots and the photo e2e test.
 * Not linked from any navigation. Drop it together with components/bench/kit/ and tests/e2e/bench-kit.spec.ts
 * once the real bench sheet uses these components.
 */
import type { Metadata } from "next";
import { KitDemo } from "@/components/bench/kit/kit-demo";

export const metadata: Metadata = { title: "Bench kit (dev only)", robots: { index: false, follow: false } };
export const dynamic = "force-static";

export default function BenchKitPage() {
  return <KitDemo />;
}
