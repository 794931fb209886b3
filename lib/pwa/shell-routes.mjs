// @ts-check
/** The offline shell's routes: shared by next.config.mjs (build), the service worker and the tests. */

/** Screens that must open with no network: precached as HTML and as their RSC payload. */
export const SHELL_ROUTES = ["/bench", "/bench/scan", "/bench/sync", "/bench/device", "/bench/ticket", "/tools"];

/** The page shown for a screen that needs the network (counter, owner, sign-in) when there is none. */
export const OFFLINE_ROUTE = "/offline";

/**
 * Marks the precache entry that holds a route's RSC payload (what Next's client router fetches when moving
 * between screens). The service worker strips the mark and asks the server with the `RSC: 1` header.
 */
export const RSC_MARK = "__bw_rsc";
