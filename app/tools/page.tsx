import type { Metadata } from "next";
import { BenchShell } from "@/components/bench/bench-shell";
import { ShopTools } from "@/components/tools/shop-tools";

export const metadata: Metadata = { title: "Shop tools" };
export const dynamic = "force-static";

export default function ToolsPage() {
  return (
    <BenchShell title="Shop tools">
      <ShopTools />
    </BenchShell>
  );
}
