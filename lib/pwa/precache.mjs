// @ts-check
/**
 * What the service worker keeps on the phone, worked out at build time (imported by next.config.mjs,
 * the build check and the tests). Plain JavaScript because next.config.mjs loads it before any compiler runs.
 */
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { OFFLINE_ROUTE, RSC_MARK, SHELL_ROUTES } from "./shell-routes.mjs";

export { OFFLINE_ROUTE, RSC_MARK, SHELL_ROUTES };

/** Folders and files whose content decides the build; the same list the stale-build check uses. */
const SOURCES = ["app", "components", "lib", "db", "worker", "public", "next.config.mjs", "package-lock.json", "tsconfig.json", "postcss.config.mjs"];
const GENERATED = /^(sw\.js|sw\.js\.map|swe-worker-.*\.js(\.map)?)$/;

/** @param {string} p @param {(file: string) => void} visit */
function walk(p, visit) {
  if (!fs.existsSync(p)) return;
  const stat = fs.statSync(p);
  if (!stat.isDirectory()) {
    if (!GENERATED.test(path.basename(p))) visit(p);
    return;
  }
  for (const entry of fs.readdirSync(p).sort()) walk(path.join(p, entry), visit);
}

/**
 * A short hash of every source file: the same sources give the same version, so rebuilding without a change
 * does not offer the phones an "update".
 * @param {string} root
 */
export function sourceRevision(root) {
  const hash = crypto.createHash("sha256");
  for (const s of SOURCES) {
    walk(path.join(root, s), (file) => {
      hash.update(path.relative(root, file));
      hash.update("\0");
      hash.update(fs.readFileSync(file));
      hash.update("\0");
    });
  }
  return hash.digest("hex").slice(0, 12);
}

/**
 * Route paths of the App Router pages under `appDir` (route groups and slots left out).
 * @param {string} appDir
 * @returns {Set<string>}
 */
export function appRoutes(appDir) {
  /** @type {Set<string>} */
  const routes = new Set();
  walk(appDir, (file) => {
    if (!/^page\.(tsx|ts|jsx|js|mdx)$/.test(path.basename(file))) return;
    const segments = path
      .relative(appDir, path.dirname(file))
      .split(path.sep)
      .filter((s) => s && !/^\(.*\)$/.test(s) && !s.startsWith("@"));
    routes.add("/" + segments.join("/"));
  });
  return routes;
}

/**
 * The precache entries beyond webpack's own assets: each shell route's HTML and RSC payload (only routes whose
 * page exists in this build), the offline page, the manifest and every file in public/.
 * @param {{ root: string, revision: string }} options
 * @returns {{ entries: { url: string, revision: string }[], missing: string[] }}
 */
export function shellPrecacheEntries({ root, revision }) {
  const existing = appRoutes(path.join(root, "app"));
  const missing = SHELL_ROUTES.filter((r) => !existing.has(r));
  const pages = [...SHELL_ROUTES.filter((r) => existing.has(r)), OFFLINE_ROUTE];
  /** @type {{ url: string, revision: string }[]} */
  const entries = [];
  for (const route of pages) {
    entries.push({ url: route, revision });
    entries.push({ url: `${route}?${RSC_MARK}=1`, revision });
  }
  entries.push({ url: "/manifest.webmanifest", revision });
  const publicDir = path.join(root, "public");
  walk(publicDir, (file) => {
    const url = "/" + path.relative(publicDir, file).split(path.sep).join("/");
    entries.push({ url, revision: crypto.createHash("md5").update(fs.readFileSync(file)).digest("hex") });
  });
  return { entries, missing };
}
