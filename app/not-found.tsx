import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center gap-5 px-5">
      <h1 className="text-3xl font-bold">Nothing here</h1>
      <p className="text-lg text-ink-2">That page does not exist, or it was moved.</p>
      <Link href="/" className={buttonClass("primary", "bench")}>
        Go to my home page
      </Link>
    </main>
  );
}
