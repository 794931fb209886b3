import type { Metadata } from "next";
import { BenchHome } from "@/components/bench/bench-home";

export const metadata: Metadata = { title: "Bench" };

/** Static shell: prerendered, precached, rendered from the device store. */
export const dynamic = "force-static";

export default function BenchPage() {
  return <BenchHome />;
}
