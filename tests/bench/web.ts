/**
 * npm run bench:web — the web budgets (issue 7). Not a test: figures for the README and the report.
 *
 * 1. JavaScript each main route loads on a first visit, gzipped (zlib level 9, as `next build` used to print it),
 *    measured in Chromium with the service worker blocked and an empty cache. The page's own scripts are the
 *    route's figure; what the sync worker loads (its own thread) is printed and reported beside it.
 * 2. Lighthouse 12.2.3 (its CLI, mobile settings) on /sign-in and the signed-in /bench, median of 3 runs, each in a
 *    fresh Chrome; the session cookie goes in as an extra header and is redacted in the kept reports.
 *
 * Serves the current production build (built first if stale) on BENCH_WEB_PORT (default 3402) with a fresh demo
 * shop in tests/.tmp. The last line printed is one JSON object. BENCH_STRICT=1 exits 1 when a budget is missed.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createRequire } from "node:module";
import zlib from "node:zlib";
import { spawnSync } from "node:child_process";
import { chromium, type Browser } from "@playwright/test";
import { buildIfNeeded } from "../../scripts/lib/build";
import { CHROMIUM_ARGS } from "../../playwright.config";
import { LOGINS, median, sessionCookie, startServer, stopServer, type Role } from "./lib/server";

process.env.NEXT_TELEMETRY_DISABLED = "1";
const require = createRequire(import.meta.url);
const PORT = Number(process.env.BENCH_WEB_PORT || 3402);
const BASE = `http://localhost:${PORT}`;
const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";
const RUNS = Number(process.env.LIGHTHOUSE_RUNS || 3);
const OUT = path.resolve("bench-results");
/** BENCH_WEB_DETAIL=/bench,/sign-in lists every script those routes load, largest first. */
const DETAIL = new Set((process.env.BENCH_WEB_DETAIL ?? "").split(",").filter(Boolean));


/** Main routes and who opens them. */
const ROUTES: { path: string; as?: Role }[] = [
  { path: "/sign-in" },
  { path: "/bench", as: "tech" },
  { path: "/bench/scan", as: "tech" },
  { path: "/bench/sync", as: "tech" },
  { path: "/bench/ticket", as: "tech" },
  { path: "/bench/device", as: "tech" },
  { path: "/tools", as: "tech" },
  { path: "/offline" },
  { path: "/counter", as: "counter" },
  { path: "/owner/people", as: "owner" },
  { path: "/owner/settings", as: "owner" },
];
const BENCH_BUDGET_KB = 170;
const LIGHTHOUSE_BUDGET = { performance: 90, accessibility: 95, best_practices: 95 };

function log(line: string) {
  console.log(`[bench:web] ${line}`);
}

/**
 * Gzipped bytes of every script the route loads on a first visit (service worker blocked, empty cache), and of
 * those the HTML itself names (what `next build` used to call "First Load JS"; the rest are imports made at once).
 */
async function routeScripts(browser: Browser, route: string, cookie?: { name: string; value: string }) {
  const context = await browser.newContext({ serviceWorkers: "block", viewport: { width: 390, height: 844 } });
  if (cookie) await context.addCookies([{ ...cookie, url: BASE }]);
  const page = await context.newPage();
  const scripts = new Map<string, Promise<Buffer | null>>();
  // The sync worker's own script is a "script"; the chunks it pulls in with importScripts() are "other".
  const workerUrls = new Set<string>();
  page.on("worker", (w) => workerUrls.add(w.url()));
  context.on("response", (res) => {
    const type = res.request().resourceType();
    const isJs = type === "script" || (type === "other" && /\.js(\?|$)/.test(new URL(res.url()).pathname));
    if (!isJs || scripts.has(res.url())) return;
    if (type === "other") workerUrls.add(res.url());
    scripts.set(res.url(), res.body().catch(() => null));
  });
  const res = await page.goto(`${BASE}${route}`, { waitUntil: "load" });
  // Imports made right after hydration (e.g. the device store) count too. A prefetch answered 404 for a screen
  // not built yet can keep the network from ever going idle: stop waiting after a while.
  await page.waitForLoadState("networkidle", { timeout: 5000 }).catch(() => undefined);
  const status = res?.status() ?? 0;
  const html = status === 200 ? await res!.text() : "";
  const finalPath = new URL(page.url()).pathname;
  let gz = 0;
  let initialGz = 0;
  let workerGz = 0;
  let raw = 0;
  let count = 0;
  const each: { path: string; gzKb: number; where: "in HTML" | "imported" | "worker" }[] = [];
  for (const [url, pending] of scripts) {
    const body = await pending;
    if (!body) continue;
    const size = zlib.gzipSync(body, { level: 9 }).length;
    const where = workerUrls.has(url) ? "worker" : html.includes(new URL(url).pathname) ? "in HTML" : "imported";
    each.push({ path: new URL(url).pathname, gzKb: size / 1000, where });
    if (where === "worker") {
      workerGz += size;
      continue;
    }
    raw += body.length;
    gz += size;
    count += 1;
    if (where === "in HTML") initialGz += size;
  }
  await context.close();
  return { status, finalPath, count, rawKb: raw / 1000, gzKb: gz / 1000, initialGzKb: initialGz / 1000, workerGzKb: workerGz / 1000, each };
}

interface Scores {
  performance: number;
  accessibility: number;
  best_practices: number;
}

/**
 * One Lighthouse run through its own CLI (a fresh Chrome each time). The CLI, not the Node API, because the
 * functions Lighthouse sends into the page must not pass through tsx's transform.
 */
function lighthouseRun(url: string, cookieHeader?: string): { scores: Scores; report: string } {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "bench-web-lh-"));
  try {
    const out = path.join(tmp, "report.json");
    const args = [
      require.resolve("lighthouse/cli/index.js"),
      url,
      `--chrome-flags=--headless --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --disable-sync --no-first-run`,
      "--only-categories=performance,accessibility,best-practices",
      "--form-factor=mobile",
      "--output=json",
      `--output-path=${out}`,
      "--quiet",
    ];
    if (cookieHeader) {
      // A file rather than an argument, so the token does not show in the process list.
      const headers = path.join(tmp, "headers.json");
      fs.writeFileSync(headers, JSON.stringify({ Cookie: cookieHeader }), { mode: 0o600 });
      args.push(`--extra-headers=${headers}`);
    }
    const r = spawnSync(process.execPath, args, { env: { ...process.env, CHROME_PATH: CHROMIUM }, encoding: "utf8" });
    if (r.status !== 0 || !fs.existsSync(out)) throw new Error(`lighthouse failed on ${url}:\n${r.stderr}`);
    let report = fs.readFileSync(out, "utf8");
    if (cookieHeader) report = report.split(cookieHeader).join("Cookie-redacted");
    report = report.replace(/(session-token=)[^"\\;]+/g, "$1REDACTED");
    const c = (JSON.parse(report) as { categories: Record<string, { score: number | null }> }).categories;
    const pct = (s: number | null | undefined) => Math.round((s ?? 0) * 100);
    return {
      scores: {
        performance: pct(c.performance?.score),
        accessibility: pct(c.accessibility?.score),
        best_practices: pct(c["best-practices"]?.score),
      },
      report,
    };
  } finally {
    fs.rmSync(tmp, { recursive: true, force: true });
  }
}

async function main() {
  buildIfNeeded();
  fs.mkdirSync(OUT, { recursive: true });
  const server = await startServer(PORT, "tests/.tmp/bench-web-data");
  const stop = () => stopServer(server);
  process.on("SIGINT", () => (stop(), process.exit(130)));
  try {
    const cookies: Partial<Record<Role, { name: string; value: string }>> = {};
    for (const role of Object.keys(LOGINS) as Role[]) cookies[role] = await sessionCookie(BASE, role);

    // 1. JavaScript per route.
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
    const routesGzipKb: Record<string, number> = {};
    const workerGzipKb: Record<string, number> = {};
    log("JavaScript loaded on a first visit (service worker blocked), gzip -9:");
    for (const r of ROUTES) {
      const m = await routeScripts(browser, r.path, r.as ? cookies[r.as] : undefined);
      if (m.status !== 200 || m.finalPath !== r.path) {
        log(`  ${r.path.padEnd(16)} not measured (HTTP ${m.status}${m.finalPath !== r.path ? `, ended on ${m.finalPath}` : ""}: no page yet)`);
        continue;
      }
      routesGzipKb[r.path] = Math.round(m.gzKb * 10) / 10;
      if (m.workerGzKb) workerGzipKb[r.path] = Math.round(m.workerGzKb * 10) / 10;
      log(
        `  ${r.path.padEnd(16)} ${m.gzKb.toFixed(1).padStart(6)} kB gz  (named in the HTML ${m.initialGzKb.toFixed(1)} kB; ` +
          `${m.rawKb.toFixed(0)} kB raw, ${m.count} scripts)` +
          (m.workerGzKb ? ` + sync worker ${m.workerGzKb.toFixed(1)} kB gz (its own thread, loaded once the screen is drawn)` : ""),
      );
      if (DETAIL.has(r.path)) {
        for (const e of m.each.sort((a, b) => b.gzKb - a.gzKb)) log(`      ${e.gzKb.toFixed(1).padStart(6)} kB  ${e.where.padEnd(8)}  ${e.path}`);
      }
    }
    await browser.close();

    // 2. Lighthouse.
    const techCookie = `${cookies.tech!.name}=${cookies.tech!.value}`;
    const audits: { route: string; cookie?: string }[] = [{ route: "/sign-in" }, { route: "/bench", cookie: techCookie }];
    const lighthouseScores: Record<string, Scores> = {};
    // LIGHTHOUSE_RUNS=0: the script sizes only.
    for (const a of RUNS > 0 ? audits : []) {
      const runs: { scores: Scores; report: string }[] = [];
      for (let i = 0; i < RUNS; i++) {
        const run = lighthouseRun(`${BASE}${a.route}`, a.cookie);
        log(`  lighthouse ${a.route} run ${i + 1}: ${JSON.stringify(run.scores)}`);
        runs.push(run);
      }
      const scores: Scores = {
        performance: median(runs.map((r) => r.scores.performance)),
        accessibility: median(runs.map((r) => r.scores.accessibility)),
        best_practices: median(runs.map((r) => r.scores.best_practices)),
      };
      lighthouseScores[a.route] = scores;
      // Keep the run whose performance is the median, with the session token redacted.
      const kept = runs.find((r) => r.scores.performance === scores.performance) ?? runs[0]!;
      const file = path.join(OUT, `lighthouse${a.route.replace(/\//g, "-")}.json`);
      fs.writeFileSync(file, kept.report);
      if (kept.report.includes(cookies.tech!.value)) throw new Error(`${file} still holds the session token`);
      log(`  lighthouse ${a.route} median of ${RUNS}: ${JSON.stringify(scores)} (report: ${path.relative(process.cwd(), file)})`);
    }

    // Budgets.
    const misses: string[] = [];
    const bench = routesGzipKb["/bench"];
    if (bench === undefined || bench > BENCH_BUDGET_KB) misses.push(`/bench JavaScript ${bench ?? "?"} kB > ${BENCH_BUDGET_KB} kB`);
    for (const [route, s] of Object.entries(lighthouseScores)) {
      for (const [k, min] of Object.entries(LIGHTHOUSE_BUDGET) as [keyof Scores, number][]) {
        if (s[k] < min) misses.push(`lighthouse ${route} ${k} ${s[k]} < ${min}`);
      }
    }
    log(misses.length ? `budgets missed: ${misses.join("; ")}` : "all budgets met");
    console.log(JSON.stringify({ routes_gzip_kb: routesGzipKb, sync_worker_gzip_kb: workerGzipKb, lighthouse: lighthouseScores }));
    if (misses.length && process.env.BENCH_STRICT === "1") process.exitCode = 1;
  } finally {
    stop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
