import type { Metadata } from "next";
import { ScanScreen } from "@/components/bench/scan-screen";

export const metadata: Metadata = { title: "Scan tag" };

/** Static like the rest of the bench: prerendered, no server session check, opens offline. */
export const dynamic = "force-static";

export default function ScanPage() {
  return <ScanScreen />;
}
