"use client";

import Link from "next/link";
import { useCallback, useEffect, useState, type ReactNode } from "react";
import { CloudOff, Download, HardDrive, RefreshCw, Smartphone, Upload } from "lucide-react";
import { BenchShell } from "@/components/bench/bench-shell";
import { Button, buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { formatBytes } from "@/lib/pwa/bytes";
import { promptInstall, requestUpdate, usePwa } from "./pwa-store";
import { askPersistentStorage, storageStatus, type StorageStatus } from "./storage";

function Section({ id, icon, title, children }: { id: string; icon: ReactNode; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 rounded-2xl border border-line bg-surface p-4">
      <h2 id={id} className="flex items-center gap-2 text-xl font-bold">
        <span aria-hidden className="text-accent">
          {icon}
        </span>
        {title}
      </h2>
      {children}
    </section>
  );
}

function Row({ label, children, testId }: { label: string; children: ReactNode; testId?: string }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
      <dt className="text-ink-2">{label}</dt>
      <dd className="font-bold" data-testid={testId}>
        {children}
      </dd>
    </div>
  );
}

/** Browsers that install only from their own menu. */
const MENU_STEPS = [
  { browser: "Chrome or Edge on Android", steps: "open the browser menu (⋮) and choose “Install app” or “Add to Home screen”." },
  { browser: "Samsung Internet", steps: "open the menu (☰), choose “Add page to”, then “Home screen”." },
  { browser: "Firefox on Android", steps: "open the menu (⋮) and choose “Install” or “Add to Home screen”." },
  { browser: "Safari on iPhone or iPad", steps: "tap Share (the square with an arrow), then “Add to Home Screen”." },
];

/** /bench/device: whether the bench works offline here, install, storage, version and update state. */
export function DevicePanel() {
  const pwa = usePwa();
  const [storage, setStorage] = useState<StorageStatus | null>(null);
  const [pending, setPending] = useState<number | null>(null);
  const [installNote, setInstallNote] = useState<string | null>(null);

  const refresh = useCallback(async () => {
    setStorage(await storageStatus().catch(() => null));
    try {
      const { pendingChangeCount } = await import("@/lib/sync/device-db");
      setPending(await pendingChangeCount());
    } catch {
      setPending(null);
    }
  }, []);

  useEffect(() => {
    void refresh();
    const onVisible = () => document.visibilityState === "visible" && void refresh();
    document.addEventListener("visibilitychange", onVisible);
    return () => document.removeEventListener("visibilitychange", onVisible);
  }, [refresh]);

  async function keepData() {
    await askPersistentStorage();
    await refresh();
  }

  async function install() {
    const outcome = await promptInstall();
    setInstallNote(outcome === "accepted" ? "Installed. Open Benchwright from the home screen." : outcome === "dismissed" ? "Not installed. You can install later from here." : null);
  }

  const offline =
    pwa.worker === "unsupported"
      ? { text: "Not in this browser", detail: "This browser cannot keep the bench for use with no network. Use Chrome, Edge, Firefox, Samsung Internet or Safari." }
      : pwa.worker === "failed"
        ? { text: "Not ready", detail: "The offline copy could not be set up. Reload this screen with a network." }
        : pwa.controlled
          ? { text: "Ready", detail: "The bench, scanning and the shop tools open here with no network." }
          : pwa.installedWorker
            ? { text: "Ready next time", detail: "The offline copy is on this phone; it takes over the next time Benchwright opens." }
            : { text: "Getting ready…", detail: "Keep this screen open with a network for a moment." };

  return (
    <BenchShell title="This phone">
      <div className="flex flex-col gap-4">
        <Section id="offline" icon={<CloudOff size={24} />} title="Works with no network">
          <dl className="flex flex-col gap-2">
            <Row label="Offline copy" testId="offline-state">
              {offline.text}
            </Row>
          </dl>
          <p className="text-ink-2">{offline.detail}</p>
        </Section>

        <Section id="install" icon={<Smartphone size={24} />} title="Install on this phone">
          {pwa.installed ? (
            <p data-testid="install-state">Installed: Benchwright opens from the home screen like an app.</p>
          ) : pwa.canInstall ? (
            <>
              <p>Put Benchwright on the home screen: it opens full screen, straight to the bench.</p>
              <Button size="bench" onClick={() => void install()}>
                <Download size={22} aria-hidden /> Install on this phone
              </Button>
            </>
          ) : (
            <>
              <p>This browser installs from its own menu:</p>
              <ul className="flex list-disc flex-col gap-2 pl-5">
                {MENU_STEPS.map((m) => (
                  <li key={m.browser}>
                    <span className="font-bold">{m.browser}:</span> {m.steps}
                  </li>
                ))}
              </ul>
            </>
          )}
          {installNote ? <p role="status">{installNote}</p> : null}
        </Section>

        <Section id="storage" icon={<HardDrive size={24} />} title="Storage">
          {storage && storage.supported ? (
            <>
              <dl className="flex flex-col gap-2">
                <Row label="Kept when the phone is low on space" testId="storage-persisted">
                  {storage.persisted === null ? "Unknown" : storage.persisted ? "Yes" : "No"}
                </Row>
                <Row label="Used by Benchwright" testId="storage-usage">
                  {storage.usageBytes === null ? "Unknown" : formatBytes(storage.usageBytes)}
                  {storage.quotaBytes ? <span className="font-normal text-ink-2"> of {formatBytes(storage.quotaBytes)} allowed</span> : null}
                </Row>
              </dl>
              {storage.persisted === false ? (
                <>
                  <Notice tone="bad" title="The browser may clear this phone's copy">
                    When the phone runs low on space, the browser may delete Benchwright&apos;s data, including
                    work not yet synced. Sync often, or ask the browser to keep it.
                  </Notice>
                  <Button variant="secondary" size="bench" onClick={() => void keepData()}>
                    Ask to keep Benchwright&apos;s data
                  </Button>
                  <p className="text-sm text-ink-2">
                    Browsers decide for themselves; installing the app to the home screen usually helps.
                  </p>
                </>
              ) : null}
            </>
          ) : storage ? (
            <p>This browser does not report its storage.</p>
          ) : (
            <p>Checking…</p>
          )}
        </Section>

        <Section id="sync" icon={<Upload size={24} />} title="Waiting to sync">
          <dl className="flex flex-col gap-2">
            <Row label="Changes not yet at the shop" testId="pending-changes">
              {pending === null ? "Unknown" : pending}
            </Row>
          </dl>
          <Link href="/bench/sync" prefetch={false} className={buttonClass("secondary", "bench")}>
            Open sync
          </Link>
        </Section>

        <Section id="version" icon={<RefreshCw size={24} />} title="Version">
          <dl className="flex flex-col gap-2">
            <Row label="This screen" testId="app-version">
              {pwa.appVersion}
            </Row>
            <Row label="Offline copy" testId="worker-version">
              {pwa.activeVersion ?? "—"}
            </Row>
            <Row label="Updates" testId="update-state">
              {pwa.update === "ready" ? "Update ready" : pwa.update === "applying" ? "Updating…" : "Up to date"}
            </Row>
          </dl>
          {pwa.update === "ready" ? (
            <>
              {pwa.waitingVersion ? <p className="text-ink-2">New version {pwa.waitingVersion} is waiting.</p> : null}
              <Button size="bench" onClick={() => void requestUpdate()}>
                Update now
              </Button>
            </>
          ) : null}
        </Section>
      </div>
    </BenchShell>
  );
}
