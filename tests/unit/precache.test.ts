import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { appRoutes, OFFLINE_ROUTE, RSC_MARK, SHELL_ROUTES, shellPrecacheEntries, sourceRevision } from "@/lib/pwa/precache.mjs";
import { checkServiceWorker, precachedUrls } from "../../scripts/lib/check-sw";

// Route paths follow the Next.js App Router conventions in node_modules/next/dist/docs (folders are path segments;
// "(group)" folders and "@slot" folders are not part of the URL) [read].

const dirs: string[] = [];
function tempApp(files: Record<string, string>): string {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), "benchwright-precache-"));
  dirs.push(root);
  for (const [file, text] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
    fs.writeFileSync(path.join(root, file), text);
  }
  return root;
}
afterEach(() => {
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
});

describe("appRoutes", () => {
  it("maps page files to URL paths, leaving out route groups and slots", () => {
    const root = tempApp({
      "app/page.tsx": "",
      "app/(auth)/sign-in/page.tsx": "",
      "app/bench/page.tsx": "",
      "app/bench/device/page.tsx": "",
      "app/bench/layout.tsx": "",
      "app/owner/@panel/people/page.tsx": "",
      "app/api/me/route.ts": "",
    });
    expect([...appRoutes(path.join(root, "app"))].sort()).toEqual(["/", "/bench", "/bench/device", "/owner/people", "/sign-in"]);
  });
});

describe("shellPrecacheEntries", () => {
  it("precaches HTML and RSC for each shell page that exists, the offline page, the manifest and public files", () => {
    const root = tempApp({
      "app/bench/page.tsx": "",
      "app/bench/ticket/page.tsx": "",
      "app/offline/page.tsx": "",
      "public/icons/icon-192.png": "abc",
    });
    const { entries, missing } = shellPrecacheEntries({ root, revision: "r1" });
    const urls = entries.map((e) => e.url);
    for (const route of ["/bench", "/bench/ticket", OFFLINE_ROUTE]) {
      expect(urls).toContain(route);
      expect(urls).toContain(`${route}?${RSC_MARK}=1`);
    }
    expect(urls).toContain("/manifest.webmanifest");
    expect(urls).toContain("/icons/icon-192.png");
    expect(urls).not.toContain("/bench/scan");
    expect(missing).toEqual(SHELL_ROUTES.filter((r) => r !== "/bench" && r !== "/bench/ticket"));
    expect(entries.find((e) => e.url === "/bench")?.revision).toBe("r1");
    // A public file's revision is the MD5 of its content. [RFC 1321, A.5 test suite, read] MD5("abc") = 9001…7f72
    expect(entries.find((e) => e.url === "/icons/icon-192.png")?.revision).toBe("900150983cd24fb0d6963f7d28e17f72");
  });

  it("never lists the built worker itself", () => {
    const root = tempApp({ "app/bench/page.tsx": "", "public/sw.js": "x", "public/swe-worker-abc.js": "x" });
    const urls = shellPrecacheEntries({ root, revision: "r" }).entries.map((e) => e.url);
    expect(urls.some((u) => u.includes("sw.js") || u.includes("swe-worker"))).toBe(false);
  });
});

describe("sourceRevision", () => {
  it("stays the same for the same sources and changes when a source changes", () => {
    const root = tempApp({ "app/bench/page.tsx": "one", "lib/a.ts": "a" });
    const first = sourceRevision(root);
    expect(sourceRevision(root)).toBe(first);
    fs.writeFileSync(path.join(root, "public-not-a-source.txt"), "ignored");
    expect(sourceRevision(root)).toBe(first);
    fs.writeFileSync(path.join(root, "lib/a.ts"), "b");
    expect(sourceRevision(root)).not.toBe(first);
  });

  it("ignores the generated worker, which the build writes into public/", () => {
    const root = tempApp({ "app/page.tsx": "x" });
    const before = sourceRevision(root);
    fs.mkdirSync(path.join(root, "public"));
    fs.writeFileSync(path.join(root, "public/sw.js"), "built");
    expect(sourceRevision(root)).toBe(before);
  });
});

describe("checkServiceWorker (run after every build)", () => {
  const worker = (urls: string[]) => `self.x=[${urls.map((u) => `{'revision':'1','url':'${u}'}`).join(",")}];`;
  const complete = [
    "/bench",
    `/bench?${RSC_MARK}=1`,
    OFFLINE_ROUTE,
    `${OFFLINE_ROUTE}?${RSC_MARK}=1`,
    "/_next/static/chunks/main.js",
    "/_next/static/css/a.css",
    "/_next/static/media/inter.woff2",
    "/icons/icon-192.png",
  ];

  it("reads the injected precache manifest", () => {
    expect(precachedUrls(worker(["/a", "/b?c=1"]))).toEqual(["/a", "/b?c=1"]);
  });

  it("fails when the worker is missing", () => {
    const root = tempApp({ "app/bench/page.tsx": "" });
    expect(checkServiceWorker(root)[0]).toMatch(/public\/sw\.js is missing/);
  });

  it("passes a worker that precaches the shell, and names what an incomplete one lacks", () => {
    const root = tempApp({ "app/bench/page.tsx": "", "app/offline/page.tsx": "", "public/sw.js": worker(complete) });
    expect(checkServiceWorker(root)).toEqual([]);
    fs.writeFileSync(path.join(root, "public/sw.js"), worker(complete.filter((u) => !u.startsWith("/bench") && !u.endsWith(".woff2"))));
    expect(checkServiceWorker(root)).toEqual([
      "public/sw.js does not precache /bench",
      "public/sw.js does not precache the RSC payload of /bench",
      "public/sw.js precaches no fonts",
    ]);
  });
});
