/** The server Playwright starts: a fresh demo shop in tests/.tmp, then the same path as npm start. */
import fs from "node:fs";
import path from "node:path";

const dir = path.resolve(process.env.DATA_DIR || "tests/.tmp/e2e-data");
fs.rmSync(dir, { recursive: true, force: true });
fs.mkdirSync(dir, { recursive: true });
void import("./start");
