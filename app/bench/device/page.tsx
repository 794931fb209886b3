import type { Metadata } from "next";
import { DevicePanel } from "@/components/pwa/device-panel";

export const metadata: Metadata = { title: "This phone" };

/** Static and precached: works with no network. */
export const dynamic = "force-static";

export default function BenchDevicePage() {
  return <DevicePanel />;
}
