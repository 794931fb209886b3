/**
 * After `next build --webpack`: the service worker must exist and precache the offline shell. A plain `next build`
 * (Turbopack) or a misconfigured plugin writes no worker at all, and the bench would then not open offline.
 */
import fs from "node:fs";
import path from "node:path";
import { OFFLINE_ROUTE, RSC_MARK, appRoutes, SHELL_ROUTES } from "../../lib/pwa/precache.mjs";

/** The URLs in the precache manifest Serwist injected into public/sw.js. */
export function precachedUrls(swSource: string): string[] {
  return [...swSource.matchAll(/'url':'([^']+)'/g)].map((m) => m[1]!);
}

/** Problems with the built worker; empty when it is fine. */
export function checkServiceWorker(root = process.cwd()): string[] {
  const file = path.join(root, "public", "sw.js");
  if (!fs.existsSync(file)) return [`${path.relative(root, file)} is missing: build with "next build --webpack"`];
  const urls = new Set(precachedUrls(fs.readFileSync(file, "utf8")));
  if (urls.size === 0) return ["public/sw.js has no precache manifest"];
  const problems: string[] = [];
  const existing = appRoutes(path.join(root, "app"));
  const required = [...SHELL_ROUTES.filter((r) => existing.has(r)), OFFLINE_ROUTE];
  for (const route of required) {
    if (!urls.has(route)) problems.push(`public/sw.js does not precache ${route}`);
    if (!urls.has(`${route}?${RSC_MARK}=1`)) problems.push(`public/sw.js does not precache the RSC payload of ${route}`);
  }
  if (![...urls].some((u) => u.startsWith("/_next/static/chunks/"))) problems.push("public/sw.js precaches no scripts");
  if (![...urls].some((u) => u.endsWith(".css"))) problems.push("public/sw.js precaches no styles");
  if (![...urls].some((u) => u.endsWith(".woff2"))) problems.push("public/sw.js precaches no fonts");
  if (![...urls].some((u) => u.startsWith("/icons/"))) problems.push("public/sw.js precaches no icons");
  return problems;
}
