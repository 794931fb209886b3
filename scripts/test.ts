/**
 * npm test: Vitest (unit + integration), then Playwright end-to-end tests against a production build
 * in Debian's Chromium.
 */
import fs from "node:fs";
import { spawnSync } from "node:child_process";
import { buildIfNeeded, runBuild } from "./lib/build";

process.env.NEXT_TELEMETRY_DISABLED = "1";
const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";

function run(label: string, cmd: string, args: string[]): number {
  console.log(`\n[test] ${label}: ${cmd} ${args.join(" ")}`);
  const started = Date.now();
  const r = spawnSync(cmd, args, { stdio: "inherit", env: process.env });
  console.log(`[test] ${label} finished in ${((Date.now() - started) / 1000).toFixed(1)} s (exit ${r.status})`);
  return r.status ?? 1;
}

function ensureChromium(): void {
  if (fs.existsSync(CHROMIUM)) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (!isRoot) {
    console.error(`[test] Chromium is missing at ${CHROMIUM}. Install it with:\n    sudo apt-get update && sudo apt-get install -y chromium`);
    process.exit(1);
  }
  console.log("[test] Chromium is missing: installing Debian's chromium with apt-get…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const update = spawnSync("apt-get", ["update"], { stdio: "inherit", env });
  const install = update.status === 0 ? spawnSync("apt-get", ["install", "-y", "--no-install-recommends", "chromium"], { stdio: "inherit", env }) : update;
  if (install.status !== 0 || !fs.existsSync(CHROMIUM)) {
    console.error("[test] could not install Chromium; run: apt-get update && apt-get install -y chromium");
    process.exit(1);
  }
}

const only = process.argv[2];
let failed = 0;
if (only !== "e2e") failed += run("unit and integration", "npx", ["vitest", "run"]) === 0 ? 0 : 1;
if (only !== "unit") {
  ensureChromium();
  if (process.env.CI) runBuild();
  else buildIfNeeded();
  failed += run("end-to-end", "npx", ["playwright", "test", ...process.argv.slice(only === "e2e" ? 3 : 2)]) === 0 ? 0 : 1;
}
console.log(failed ? `\n[test] FAILED (${failed} suite${failed > 1 ? "s" : ""})` : "\n[test] all suites passed");
process.exit(failed ? 1 : 0);
