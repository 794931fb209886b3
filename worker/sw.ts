/// <reference lib="webworker" />
/**
 * Benchwright's service worker (built by @serwist/next into public/sw.js).
 *
 * - Precache (one version, installed all at once): webpack's scripts, styles and fonts, every file in public/
 *   (icons), the manifest, and each bench screen's HTML and RSC payload (see lib/pwa/precache.mjs).
 * - Bench screens are answered from the precache, online or not, so the phone always runs one consistent version.
 * - API answers are never cached here: the device store (IndexedDB) holds the tech's data. API calls and other
 *   screens' router data do not even pass through the worker where the browser has static routes.
 * - Counter and owner pages go to the network; with no network the offline page answers instead.
 * - A new version waits: it takes over only when the app posts SKIP_WAITING (components/pwa/pwa-store.ts).
 */
import {
  CacheFirst,
  ExpirationPlugin,
  NetworkOnly,
  PrecacheFallbackPlugin,
  Serwist,
  type PrecacheEntry,
  type RouteHandlerCallback,
  type RouteMatchCallback,
  type SerwistGlobalConfig,
} from "serwist";
import { OFFLINE_ROUTE, RSC_MARK, SHELL_ROUTES } from "../lib/pwa/shell-routes.mjs";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: ServiceWorkerGlobalScope;

const manifest = self.__SW_MANIFEST ?? [];
const entryUrl = (e: PrecacheEntry | string) => (typeof e === "string" ? e : e.url);

/** Pages precached with their RSC payload (only those that exist in this build). */
const shellPages = new Set(
  manifest
    .map(entryUrl)
    .filter((url) => url.endsWith(`?${RSC_MARK}=1`))
    .map((url) => url.slice(0, url.indexOf("?"))),
);

/** This build's version (the revision of the offline page's entry), answered to GET_VERSION. */
const version = manifest.find((e) => typeof e !== "string" && e.url === OFFLINE_ROUTE);
const VERSION = typeof version === "object" && version.revision ? version.revision : "unknown";

const isRsc = (request: Request) => request.headers.get("RSC") === "1";
const isSegmentPrefetch = (request: Request) => request.headers.has("Next-Router-Segment-Prefetch");

const serwist = new Serwist({
  precacheEntries: manifest,
  precacheOptions: {
    cleanupOutdatedCaches: true,
    concurrency: 6,
    plugins: [
      {
        // An entry marked as an RSC payload is fetched the way Next's router fetches it: the same path with `RSC: 1`.
        requestWillFetch: async ({ request }) => {
          const url = new URL(request.url);
          if (!url.searchParams.has(RSC_MARK)) return request;
          url.searchParams.delete(RSC_MARK);
          // With only `RSC: 1` set, Next's cache-busting parameter is empty; without it Next answers 307.
          url.searchParams.set("_rsc", "");
          return new Request(url, { headers: { RSC: "1" }, credentials: "same-origin", cache: "reload" });
        },
      },
    ],
  },
  // Requests this worker would only pass on to the network skip it altogether (Static Routing API, set at install;
  // browsers without it use routes 1 and 5 below, which answer the same way). That saves starting the worker for
  // every API call, and it lets an outgoing worker go idle while an update takes over: Chromium swaps the new worker
  // in only once the old one has stopped, which it does when idle, and the queue board's refresh every 5 s (or any
  // router prefetch) would otherwise keep it running (see activateWaiting in components/pwa/pwa-store.ts).
  // Rules are tried in order; the first that matches decides.
  requestRules: [
    // API answers: never kept, so never through the worker.
    { condition: { urlPattern: { pathname: "/api/*" } }, source: "network" },
    // Bench screens (HTML and router data) come from the precache: the worker answers them.
    { condition: { or: SHELL_ROUTES.map((pathname) => ({ urlPattern: { pathname } })) }, source: "fetch-event" },
    // Router data (`_rsc`) of every other screen: the network, as route 5 would do. (A part left out of a pattern is
    // taken from the worker's own URL, so the path must be given.)
    { condition: { urlPattern: { pathname: "*", search: "*_rsc=*" } }, source: "network" },
  ],
  // A new version waits for the app's SKIP_WAITING message (Serwist listens for it when skipWaiting is false).
  skipWaiting: false,
  clientsClaim: true,
  disableDevLogs: true,
});

const fromPrecache =
  (key: (url: URL) => string): RouteHandlerCallback =>
  async ({ request, url }) =>
    (await serwist.matchPrecache(key(url))) ?? fetch(request);

// Routes are tried in this order, after the precache's own exact-URL route.

// 1. Never keep API answers: they carry shop and customer data, which lives in the device store instead.
serwist.registerCapture(({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/api/"), new NetworkOnly());

// 2. A bench screen opened with a query (e.g. /bench/ticket?id=…) answers with its precached page.
const shellNavigation: RouteMatchCallback = ({ request, url, sameOrigin }) =>
  sameOrigin && request.mode === "navigate" && shellPages.has(url.pathname);
serwist.registerCapture(shellNavigation, fromPrecache((url) => url.pathname));

// 3. Next's router asking for a bench screen's RSC payload: this version's precached payload.
const shellRsc: RouteMatchCallback = ({ request, url, sameOrigin }) =>
  sameOrigin && isRsc(request) && !isSegmentPrefetch(request) && shellPages.has(url.pathname);
serwist.registerCapture(shellRsc, fromPrecache((url) => `${url.pathname}?${RSC_MARK}=1`));

// 4. Hashed build files of another version (the precache holds this one's): immutable, no customer data.
serwist.registerCapture(
  ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/_next/static/"),
  new CacheFirst({
    cacheName: "next-static",
    plugins: [new ExpirationPlugin({ maxEntries: 200, maxAgeSeconds: 30 * 24 * 60 * 60 })],
  }),
);

// 5. Counter, owner and sign-in pages and their RSC data: the network, never kept; with no network, the offline page.
serwist.registerCapture(
  ({ request, sameOrigin }) => sameOrigin && (request.mode === "navigate" || isRsc(request)),
  new NetworkOnly({
    plugins: [
      new PrecacheFallbackPlugin({
        serwist,
        fallbackUrls: [{ url: OFFLINE_ROUTE, matcher: ({ request }) => request.destination === "document" }],
      }),
    ],
  }),
);

self.addEventListener("message", (event) => {
  if (event.data?.type === "GET_VERSION") event.ports[0]?.postMessage({ version: VERSION });
});

serwist.addEventListeners();
