"use client";

import { useEffect, useRef } from "react";
import { usePathname } from "next/navigation";
import { RefreshCw, TriangleAlert } from "lucide-react";
import { Button } from "@/components/ui/button";
import { updateWarning } from "@/lib/pwa/update-policy";
import { dismissUpdateWarning, requestUpdate, screenChanged, startPwa, usePwa } from "./pwa-store";

/**
 * Mounted once in the root layout: registers the service worker, and shows "update ready" (and the warning
 * before an update that would not wait for the outbox).
 */
export function PwaRuntime() {
  const pathname = usePathname() ?? "";
  const pwa = usePwa();
  const dialog = useRef<HTMLDialogElement>(null);
  const warning = pwa.warning;

  useEffect(() => startPwa(), []);
  useEffect(() => screenChanged(), [pathname]);

  useEffect(() => {
    if (warning) dialog.current?.showModal();
    else dialog.current?.close();
  }, [warning]);

  const showReady = pwa.update !== "none";
  const pending = pwa.pendingChanges ?? 0;

  return (
    <>
      {showReady || pwa.replacedElsewhere ? (
        // In the page's flow, above everything, so it never covers a control or a field.
        <div className="px-3 pt-3">
          <div
            role="status"
            aria-live="polite"
            data-testid="update-banner"
            className="mx-auto flex max-w-2xl flex-wrap items-center gap-3 rounded-2xl border-2 border-accent bg-surface px-4 py-3"
          >
            <RefreshCw size={24} aria-hidden className="shrink-0 text-accent" />
            <div className="min-w-0 flex-1">
              {pwa.update === "applying" ? (
                <p className="font-bold">Updating Benchwright…</p>
              ) : pwa.replacedElsewhere && !showReady ? (
                <>
                  <p className="font-bold">Benchwright was updated in another window</p>
                  <p className="text-sm text-ink-2">Reload this screen once what you typed here is saved.</p>
                </>
              ) : (
                <>
                  <p className="font-bold">Update ready</p>
                  <p className="text-sm text-ink-2">
                    {pwa.holds.includes("unsynced-changes")
                      ? `It installs by itself once ${pending === 1 ? "the 1 change" : `the ${pending} changes`} on this phone ${pending === 1 ? "has" : "have"} reached the shop.`
                      : pwa.holds.includes("editing")
                        ? "It installs when you leave this screen."
                        : pwa.holds.includes("store-unreadable")
                          ? "Waiting until this phone's saved work can be checked."
                          : "Installing now."}
                  </p>
                </>
              )}
            </div>
            {pwa.update === "ready" ? (
              <Button variant="primary" onClick={() => void requestUpdate()}>
                Update now
              </Button>
            ) : pwa.replacedElsewhere && !showReady ? (
              <Button variant="secondary" onClick={() => window.location.reload()}>
                Reload
              </Button>
            ) : null}
          </div>
        </div>
      ) : null}

      <dialog
        ref={dialog}
        aria-labelledby="update-warning-title"
        onClose={dismissUpdateWarning}
        className="m-auto w-[min(32rem,calc(100%-2rem))] rounded-2xl border-2 border-bad bg-surface p-0 text-ink backdrop:bg-black/60"
      >
        <div className="flex flex-col gap-4 p-5">
          <h2 id="update-warning-title" className="flex items-center gap-2 text-xl font-bold">
            <TriangleAlert size={26} aria-hidden className="shrink-0 text-bad" />
            Update before syncing?
          </h2>
          {warning
            ? updateWarning(warning.holds, warning.pendingChanges).map((line) => (
                <p key={line} className="text-lg">
                  {line}
                </p>
              ))
            : null}
          <div className="flex flex-col gap-3 sm:flex-row-reverse">
            <Button variant="primary" size="bench" onClick={dismissUpdateWarning} autoFocus>
              Not now
            </Button>
            <Button variant="danger" size="bench" onClick={() => void requestUpdate(true)}>
              Update anyway
            </Button>
          </div>
        </div>
      </dialog>
    </>
  );
}
