/**
 * The app's side of the service worker (browser only): registration, the waiting update and when it may take
 * over (lib/pwa/update-policy.ts decides), the install prompt, and edit holds. Read it with `usePwa()`.
 */
import { useSyncExternalStore } from "react";
import { decideUpdate, holdsOn, type UpdateHold } from "@/lib/pwa/update-policy";

/** Chromium's install prompt event (not in TypeScript's DOM types). */
export interface BeforeInstallPromptEvent extends Event {
  prompt(): Promise<void>;
  readonly userChoice: Promise<{ outcome: "accepted" | "dismissed"; platform: string }>;
}

export interface PwaState {
  /** "unsupported": no service workers here (or not a secure context). */
  worker: "unsupported" | "starting" | "ready" | "failed";
  /** A service worker controls this page (so it reloads with no network). */
  controlled: boolean;
  /** The worker is installed and active (a page that loaded during the install is controlled from its next load). */
  installedWorker: boolean;
  /** This page's build (from the bundle). */
  appVersion: string;
  /** The version of the controlling and the waiting worker, as they answer GET_VERSION. */
  activeVersion: string | null;
  waitingVersion: string | null;
  update: "none" | "ready" | "applying";
  /** Why a ready update is waiting (empty when it may apply). */
  holds: UpdateHold[];
  pendingChanges: number | null;
  /** The worker changed under this page (another window applied an update): reload when the work is saved. */
  replacedElsewhere: boolean;
  canInstall: boolean;
  installed: boolean;
  /** Set when the tech asked to update while something holds it: the app shows this warning first. */
  warning: { holds: UpdateHold[]; pendingChanges: number | null } | null;
}

const APP_VERSION = `${process.env.NEXT_PUBLIC_APP_VERSION ?? "0"}+${process.env.NEXT_PUBLIC_APP_REVISION ?? "dev"}`;

let state: PwaState = {
  worker: "starting",
  controlled: false,
  installedWorker: false,
  appVersion: APP_VERSION,
  activeVersion: null,
  waitingVersion: null,
  update: "none",
  holds: [],
  pendingChanges: null,
  replacedElsewhere: false,
  canInstall: false,
  installed: false,
  warning: null,
};
const listeners = new Set<() => void>();

function set(patch: Partial<PwaState>) {
  state = { ...state, ...patch };
  for (const l of listeners) l();
}

export function getPwaState(): PwaState {
  return state;
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const serverState = state;
export function usePwa(): PwaState {
  return useSyncExternalStore(subscribe, getPwaState, () => serverState);
}

// ---- edit holds: a half-filled sheet or form keeps an update from restarting the page ------------------------

const holds = new Set<symbol>();
let typedOnThisScreen = false;

/** Call while something on screen is being edited and not saved; call the returned function when saved. */
export function holdUpdates(): () => void {
  const token = Symbol("edit hold");
  holds.add(token);
  void refreshHolds();
  return () => {
    holds.delete(token);
    void refreshHolds();
  };
}

/** Any typing on a screen counts as unsaved until the tech moves to another screen or submits the form. */
function onInput(event: Event) {
  const target = event.target as HTMLElement | null;
  if (!target || !("value" in target)) return;
  if (!typedOnThisScreen) {
    typedOnThisScreen = true;
    void refreshHolds();
  }
}

/** A new screen (or a submitted form): earlier typing is either saved or gone. */
export function screenChanged() {
  if (!typedOnThisScreen) return;
  typedOnThisScreen = false;
  void refreshHolds();
}

const isEditing = () => holds.size > 0 || typedOnThisScreen;

// ---- the service worker ---------------------------------------------------------------------------------------

let registration: ServiceWorkerRegistration | null = null;
let applyingHere = false;
let pollTimer: ReturnType<typeof setInterval> | undefined;
/** How often a waiting update re-checks the outbox (the sync engine empties it in the background). */
const OUTBOX_POLL_MS = 3000;

async function countPending(): Promise<number | null> {
  try {
    const { pendingChangeCount } = await import("@/lib/sync/device-db");
    return await pendingChangeCount();
  } catch {
    return null;
  }
}

function askVersion(worker: ServiceWorker | null | undefined): Promise<string | null> {
  if (!worker) return Promise.resolve(null);
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    channel.port1.onmessage = (e) => resolve((e.data as { version?: string })?.version ?? null);
    worker.postMessage({ type: "GET_VERSION" }, [channel.port2]);
  });
}

async function refreshHolds(): Promise<void> {
  if (state.update !== "ready") return;
  const pendingChanges = await countPending();
  const decision = decideUpdate({
    waiting: Boolean(registration?.waiting),
    pendingChanges,
    editing: isEditing(),
    requested: false,
    confirmed: false,
  });
  set({ pendingChanges, holds: holdsOn({ pendingChanges, editing: isEditing() }) });
  if (decision.action === "apply") activateWaiting();
}

function watchWaiting(reg: ServiceWorkerRegistration) {
  const waiting = reg.waiting;
  // The first install has nothing to replace; only a worker waiting behind an active one is an update.
  if (!waiting || !reg.active) return;
  set({ update: "ready" });
  void askVersion(waiting).then((waitingVersion) => set({ waitingVersion }));
  clearInterval(pollTimer);
  pollTimer = setInterval(() => void refreshHolds(), OUTBOX_POLL_MS);
  void refreshHolds();
}

/** The waiting worker last told to take over. */
let skipSentTo: ServiceWorker | null = null;
let nudgeTimer: ReturnType<typeof setInterval> | undefined;
let nudgeFrame: HTMLIFrameElement | null = null;
/** How often an applying update asks the browser again to swap the new worker in, until it has. */
const ACTIVATION_NUDGE_MS = 1000;
/** A small file in every version's precache (public/), loaded by nudgeActivation. */
const NUDGE_URL = "/icons/favicon-16.png";

function activateWaiting() {
  const waiting = registration?.waiting;
  if (!waiting || applyingHere) return;
  applyingHere = true;
  clearInterval(pollTimer);
  set({ update: "applying" });
  skipSentTo = waiting;
  waiting.postMessage({ type: "SKIP_WAITING" });
  nudgeTimer = setInterval(nudgeActivation, ACTIVATION_NUDGE_MS);
}

/**
 * SKIP_WAITING alone can leave the update waiting. Chromium swaps the new worker in once the old one has stopped,
 * and asks the old one to stop as soon as it is idle; but a request that reaches the old worker in the few
 * milliseconds it takes to stop (the browser re-reading the manifest and icon after a screen change, its
 * speculative warm-up for links coming into view) starts it again, and that copy is no longer asked to stop: it
 * runs until it has been idle for 30 s (5 minutes while DevTools is attached). Posting SKIP_WAITING again changes
 * nothing (only a worker's first call counts); loading a page in the worker's scope makes Chromium ask the old
 * worker to stop again. So until the new worker takes over (the page then reloads), a hidden frame loads a
 * precached icon: answered by the worker from the phone, with nothing else to load after it. (A page that the
 * worker leaves to the network would not do: Chromium starts the worker for it.) A newer worker that replaced the
 * waiting one is told to take over too.
 */
function nudgeActivation() {
  const waiting = registration?.waiting;
  if (!waiting) return;
  if (waiting !== skipSentTo) {
    skipSentTo = waiting;
    waiting.postMessage({ type: "SKIP_WAITING" });
  }
  if (!nudgeFrame) {
    nudgeFrame = document.createElement("iframe");
    nudgeFrame.hidden = true;
    nudgeFrame.tabIndex = -1;
    nudgeFrame.title = "Update check";
    document.body.append(nudgeFrame);
  }
  nudgeFrame.src = NUDGE_URL;
}

/**
 * The tech tapped "Update now". Applies at once when nothing holds it; otherwise sets `warning`, and applies
 * only when called again with `confirmed` (the "Update anyway" button).
 */
export async function requestUpdate(confirmed = false): Promise<boolean> {
  const pendingChanges = await countPending();
  const editing = isEditing();
  const decision = decideUpdate({ waiting: Boolean(registration?.waiting), pendingChanges, editing, requested: true, confirmed });
  const current = holdsOn({ pendingChanges, editing });
  if (decision.action === "apply") {
    set({ pendingChanges, holds: current, warning: null });
    activateWaiting();
    return true;
  }
  set({ pendingChanges, holds: current, warning: decision.action === "confirm" ? { holds: current, pendingChanges } : null });
  return false;
}

export function dismissUpdateWarning(): void {
  set({ warning: null });
}

/** Asks the server for a newer worker (on start, and when the app comes back to the foreground). */
export async function checkForUpdate(): Promise<void> {
  try {
    await registration?.update();
  } catch {
    // Offline or the server is away: the next check will do.
  }
}

async function register() {
  const sw = navigator.serviceWorker;
  try {
    registration = await sw.register("/sw.js", { scope: "/", updateViaCache: "none" });
  } catch {
    set({ worker: "failed" });
    return;
  }
  const reg = registration;
  set({ worker: "ready", controlled: Boolean(sw.controller) });
  void sw.ready.then(() => set({ installedWorker: true }));
  void askVersion(sw.controller).then((activeVersion) => set({ activeVersion }));

  reg.addEventListener("updatefound", () => {
    const installing = reg.installing;
    installing?.addEventListener("statechange", () => {
      if (installing.state === "installed") watchWaiting(reg);
    });
  });
  watchWaiting(reg);

  sw.addEventListener("controllerchange", () => {
    if (applyingHere) {
      clearInterval(nudgeTimer);
      window.location.reload();
      return;
    }
    const first = !state.controlled;
    set({ controlled: true, replacedElsewhere: !first, update: "none", holds: [] });
    void askVersion(sw.controller).then((activeVersion) => set({ activeVersion }));
  });
}

let started = false;

/** Starts everything once per page load (called by <PwaRuntime/> in the root layout). */
export function startPwa(): void {
  if (started || typeof window === "undefined") return;
  started = true;

  const standalone = () =>
    window.matchMedia("(display-mode: standalone)").matches ||
    (navigator as Navigator & { standalone?: boolean }).standalone === true;
  set({ installed: standalone() });
  window.addEventListener("beforeinstallprompt", (event) => {
    event.preventDefault();
    installPrompt = event as BeforeInstallPromptEvent;
    set({ canInstall: true });
  });
  window.addEventListener("appinstalled", () => {
    installPrompt = null;
    set({ canInstall: false, installed: true });
  });

  document.addEventListener("input", onInput, true);
  document.addEventListener("submit", () => screenChanged(), true);
  document.addEventListener("visibilitychange", () => {
    if (document.visibilityState !== "visible") return;
    void checkForUpdate();
    void refreshHolds();
  });

  if (!("serviceWorker" in navigator) || !window.isSecureContext) {
    set({ worker: "unsupported" });
    return;
  }
  // After the page has loaded and the main thread is idle: installing the offline copy fetches the whole app,
  // which must not compete with the first screen.
  const whenIdle = () =>
    "requestIdleCallback" in window ? window.requestIdleCallback(() => void register(), { timeout: 3000 }) : setTimeout(() => void register(), 0);
  if (document.readyState === "complete") whenIdle();
  else window.addEventListener("load", whenIdle, { once: true });
}

// ---- installing to the home screen ----------------------------------------------------------------------------

let installPrompt: BeforeInstallPromptEvent | null = null;

/** Shows the browser's own install dialog (only where it offered one: `canInstall`). */
export async function promptInstall(): Promise<"accepted" | "dismissed" | "unavailable"> {
  const prompt = installPrompt;
  if (!prompt) return "unavailable";
  await prompt.prompt();
  const { outcome } = await prompt.userChoice;
  installPrompt = null;
  set({ canInstall: false, installed: outcome === "accepted" || state.installed });
  return outcome;
}
