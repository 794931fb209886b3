/**
 * npm start: migrate, seed the demo shop when new, build when the build is missing or stale,
 * start the local fakes, then serve on PORT (default 3000).
 */
import { spawn } from "node:child_process";
import { buildIfNeeded } from "./lib/build";
import { prepareData } from "./lib/prepare";
import { startFakes } from "./lib/fakes";

process.env.NEXT_TELEMETRY_DISABLED = "1";
process.env.AUTH_TRUST_HOST = "true";

async function main() {
  await prepareData();
  buildIfNeeded();
  const fakes = await startFakes();
  const port = process.env.PORT || "3000";
  const args = ["next", "start", "-p", port];
  if (process.env.HOST) args.push("-H", process.env.HOST);
  const server = spawn("npx", args, { stdio: "inherit", env: process.env });
  console.log(`[benchwright] serving on http://localhost:${port}`);
  const stop = (signal: NodeJS.Signals) => {
    server.kill(signal);
    void fakes.stop();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
  server.on("exit", (code) => {
    void fakes.stop().finally(() => process.exit(code ?? 0));
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
