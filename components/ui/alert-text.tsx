import type { ReactNode } from "react";

/**
 * A message that something needs attention, announced at once (role="alert"), shown where it happened.
 * Nothing is rendered without a message. `boxed` sets it off with a red bar, for a message under a whole panel.
 */
export function AlertText({ message, boxed = false }: { message: ReactNode; boxed?: boolean }) {
  if (!message) return null;
  return (
    <p role="alert" className={boxed ? "rounded-xl border-l-8 border-bad bg-bad-soft px-3 py-2 font-semibold" : "font-semibold text-bad"}>
      {message}
    </p>
  );
}
