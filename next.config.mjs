import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import withSerwistInit from "@serwist/next";
import { shellPrecacheEntries, sourceRevision } from "./lib/pwa/precache.mjs";

const root = path.dirname(fileURLToPath(import.meta.url));
const pkg = JSON.parse(fs.readFileSync(path.join(root, "package.json"), "utf8"));

/** One version for the HTML, the RSC payloads and the app's "version" line: a hash of the sources. */
const revision = process.env.BENCHWRIGHT_REVISION || sourceRevision(root);
process.env.BENCHWRIGHT_REVISION = revision;

const { entries, missing } = shellPrecacheEntries({ root, revision });
if (missing.length && !process.env.BENCHWRIGHT_QUIET_PRECACHE) {
  process.env.BENCHWRIGHT_QUIET_PRECACHE = "1";
  console.warn(`[benchwright] offline shell: no page yet for ${missing.join(", ")} (left out of the precache)`);
}

const withSerwist = withSerwistInit({
  swSrc: "worker/sw.ts",
  swDest: "public/sw.js",
  // The app registers the worker itself (components/pwa) and decides when an update may take over.
  register: false,
  // Never reload on "online": a half-filled bench sheet must survive the network coming back.
  reloadOnOnline: false,
  cacheOnNavigation: false,
  additionalPrecacheEntries: entries,
});

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ["better-sqlite3", "bcryptjs"],
  experimental: {
    authInterrupts: true,
  },
  env: {
    NEXT_PUBLIC_APP_VERSION: pkg.version,
    NEXT_PUBLIC_APP_REVISION: revision,
  },
  async headers() {
    return [
      {
        // The worker script is always checked against the server, so an update is found on the next visit.
        source: "/sw.js",
        headers: [
          { key: "Cache-Control", value: "no-cache, no-store, must-revalidate" },
          { key: "Service-Worker-Allowed", value: "/" },
        ],
      },
    ];
  },
};

/**
 * @serwist/next always adds its window-side entry (the Serwist window class, ~12 kB gzipped) to every page's
 * first load, even with `register: false`. The app registers the worker itself (components/pwa/pwa-store.ts)
 * and never uses `window.serwist`, so the entry is taken out again.
 * @param {import('next').NextConfig} config
 * @returns {import('next').NextConfig}
 */
function withoutSerwistWindowEntry(config) {
  const inner = config.webpack;
  return {
    ...config,
    webpack(webpackConfig, options) {
      const out = inner ? inner(webpackConfig, options) : webpackConfig;
      const entry = out.entry;
      out.entry = async () => {
        const entries = await (typeof entry === "function" ? entry() : entry);
        for (const name of ["main.js", "main-app"]) {
          const list = entries[name];
          if (Array.isArray(list)) entries[name] = list.filter((file) => !/[\\/]@serwist[\\/]next[\\/]dist[\\/]sw-entry\.mjs$/.test(String(file)));
        }
        return entries;
      };
      return out;
    },
  };
}

export default withoutSerwistWindowEntry(withSerwist(nextConfig));
