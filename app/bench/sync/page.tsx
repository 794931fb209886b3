import type { Metadata } from "next";
import { SyncPage } from "@/components/sync/sync-page";

export const metadata: Metadata = { title: "Sync" };

/** Static shell: prerendered and precached; renders from the device store, so it opens offline. */
export const dynamic = "force-static";

export default function BenchSyncPage() {
  return <SyncPage />;
}
