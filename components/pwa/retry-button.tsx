"use client";

import { RefreshCw } from "lucide-react";
import { Button } from "@/components/ui/button";

/** Loads the page the tech asked for again (the offline page answers in its place while there is no network). */
export function RetryButton() {
  return (
    <Button variant="secondary" size="bench" onClick={() => window.location.reload()}>
      <RefreshCw size={22} aria-hidden /> Try again
    </Button>
  );
}
