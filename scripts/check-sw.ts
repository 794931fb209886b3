/** npm run check:sw — fails when the built service worker is missing or does not precache the offline shell. */
import { checkServiceWorker } from "./lib/check-sw";

const problems = checkServiceWorker();
if (problems.length) {
  for (const p of problems) console.error(`[check-sw] ${p}`);
  process.exit(1);
}
console.log("[check-sw] public/sw.js precaches the offline shell");
