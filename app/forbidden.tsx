import Link from "next/link";
import { ShieldX } from "lucide-react";
import { buttonClass } from "@/components/ui/button";

export default function NotAllowed() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center gap-5 px-5">
      <ShieldX size={48} aria-hidden className="text-bad" />
      <h1 className="text-3xl font-bold">Not allowed for your role</h1>
      <p className="text-lg text-ink-2">
        This page belongs to another part of the shop. If you need it, ask the shop owner to change your role.
      </p>
      <Link href="/" className={buttonClass("primary", "bench")}>
        Go to my home page
      </Link>
    </main>
  );
}
