import fs from "node:fs";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { checkServiceWorker } from "./check-sw";

const SOURCES = ["app", "components", "lib", "db", "worker", "public", "next.config.mjs", "package-lock.json", "tsconfig.json", "postcss.config.mjs"];
const IGNORED = new Set(["sw.js", "sw.js.map"]);

function newestMtime(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const stat = fs.statSync(p);
  if (!stat.isDirectory()) return IGNORED.has(path.basename(p)) || path.basename(p).startsWith("swe-worker-") ? 0 : stat.mtimeMs;
  let newest = 0;
  for (const entry of fs.readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

/** True when there is no production build or a source file is newer than it. */
export function buildIsStale(root = process.cwd()): boolean {
  const marker = path.join(root, ".next", "BUILD_ID");
  if (!fs.existsSync(marker)) return true;
  // The service worker is written into public/ by the build: without it the build is incomplete.
  if (!fs.existsSync(path.join(root, "public", "sw.js"))) return true;
  const built = fs.statSync(marker).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(root, s)) > built);
}

export function runBuild(): void {
  console.log("[benchwright] building the production app (next build --webpack)…");
  const started = Date.now();
  const r = spawnSync("npx", ["next", "build", "--webpack"], {
    stdio: "inherit",
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (r.status !== 0) {
    console.error("[benchwright] the build failed");
    process.exit(r.status ?? 1);
  }
  const problems = checkServiceWorker();
  if (problems.length) {
    for (const p of problems) console.error(`[benchwright] ${p}`);
    process.exit(1);
  }
  console.log(`[benchwright] build finished in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

export function buildIfNeeded(): void {
  if (process.env.SKIP_BUILD === "1") return;
  if (buildIsStale()) runBuild();
  else console.log("[benchwright] production build is up to date");
}
