/**
 * The bench sheet's building blocks on the real ticket screen (/bench/ticket) of the demo chain saw, signed in as the
 * demo tech: photos at a photo step, chips and the guided suggestion, cautions, the reading verdict, tune buttons and
 * the hazard note. Each test takes today's work with a first sync, then works offline, so nothing it records reaches
 * the server (bench-ticket.spec.ts checks the server's copy of this same ticket).
 *
 * Covered in bench-ticket.spec.ts, not repeated here: tap targets of at least 56 px on the sheet (expectBigTargets,
 * at the top of the ticket and again once the whole sheet is drawn), and the refusal of a turn that would go past
 * seated from part way out. Expected answers come from the built-in chain-saw sheet (our own procedure).
 */
import { createHash } from "node:crypto";
import path from "node:path";
import Database from "better-sqlite3";
import { expect, test, type Page } from "@playwright/test";
import { PNG } from "pngjs";
import { BenchSyncPage } from "./pages/bench-sync";
import { DEMO } from "./pages/sign-in";
import { E2E_DATA_DIR, openDemoSaw, pick, step } from "./pages/bench-ticket";
import { demoChainSaw } from "../fixtures/printed-tag";

const SHOTS = process.env.SCREENSHOTS ? "tests/.tmp/screens" : null;
const DEFER_LINE = "Follow the maker's manual, local codes and licensed practice.";

test.describe.configure({ timeout: 120_000 });
test.use({ actionTimeout: 15_000 });
test.beforeEach(async ({ context }) => {
  await BenchSyncPage.enableHooks(context);
});

// Offline means offline: the server's copy of the ticket has none of what these tests recorded.
test.afterAll(() => {
  const saw = demoChainSaw(E2E_DATA_DIR, DEMO.tech);
  const db = new Database(path.join(E2E_DATA_DIR, "benchwright.sqlite"), { readonly: true, fileMustExist: true });
  try {
    const count = (table: string) => (db.prepare(`SELECT COUNT(*) AS n FROM ${table} WHERE ticket_id = ?`).get(saw.id) as { n: number }).n;
    expect({ bench_entries: count("bench_entries"), tune_entries: count("tune_entries"), photos: count("photos") }).toEqual({ bench_entries: 0, tune_entries: 0, photos: 0 });
  } finally {
    db.close();
  }
});

/** A 3000×2000 test picture with a gradient and some noise (so the JPEG is not trivial). */
function bigPng(width = 3000, height = 2000): Buffer {
  const png = new PNG({ width, height });
  let seed = 7;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      seed = (seed * 1103515245 + 12345) & 0x7fffffff;
      const i = (y * width + x) * 4;
      png.data[i] = (x * 255) / width;
      png.data[i + 1] = (y * 255) / height;
      png.data[i + 2] = seed & 0xff;
      png.data[i + 3] = 255;
    }
  }
  return PNG.sync.write(png);
}

/** Width and height from a JPEG's start-of-frame segment [ISO/IEC 10918-1: SOI FFD8, SOFn FFC0–FFC3, height then width]. */
function jpegSize(bytes: Buffer): { width: number; height: number } {
  if (bytes[0] !== 0xff || bytes[1] !== 0xd8) throw new Error("not a JPEG (no SOI marker)");
  let i = 2;
  while (i < bytes.length) {
    if (bytes[i] !== 0xff) throw new Error(`bad marker at ${i}`);
    const marker = bytes[i + 1] as number;
    const length = bytes.readUInt16BE(i + 2);
    if (marker >= 0xc0 && marker <= 0xc3) return { height: bytes.readUInt16BE(i + 5), width: bytes.readUInt16BE(i + 7) };
    i += 2 + length;
  }
  throw new Error("no SOF segment");
}

type StoredPhoto = {
  sha256: string;
  mime: string;
  bytes: number;
  width: number;
  height: number;
  stepId: string | null;
  /** The bytes kept on the phone under that hash (photoBlobs), until the server has them. */
  blob: { type: string; bytes: number; data: number[] } | null;
};

/** The device store's photo rows for a ticket, with their kept bytes, and how many photo bytes and photo changes it holds in all. */
async function devicePhotos(page: Page, ticketId: string): Promise<{ photos: StoredPhoto[]; blobCount: number; photoChanges: number }> {
  return page.evaluate(async (ticketId) => {
    type Row = Omit<StoredPhoto, "blob">;
    type Hooks = {
      getDeviceDb: () => Promise<{
        photos: { where: (k: string) => { equals: (v: string) => { toArray: () => Promise<Row[]> } } };
        photoBlobs: { get: (k: string) => Promise<{ blob: Blob; bytes: number } | undefined>; count: () => Promise<number> };
        outbox: { toArray: () => Promise<Array<{ name: string }>> };
      }>;
    };
    const db = await (window as unknown as { __benchwrightSync: Hooks }).__benchwrightSync.getDeviceDb();
    const rows = await db.photos.where("ticketId").equals(ticketId).toArray();
    const photos = await Promise.all(
      rows.map(async (r) => {
        const kept = await db.photoBlobs.get(r.sha256);
        const blob = kept ? { type: kept.blob.type, bytes: kept.bytes, data: Array.from(new Uint8Array(await kept.blob.arrayBuffer())) } : null;
        return { sha256: r.sha256, mime: r.mime, bytes: r.bytes, width: r.width, height: r.height, stepId: r.stepId, blob };
      }),
    );
    const photoChanges = (await db.outbox.toArray()).filter((e) => e.name === "photo.attached").length;
    return { photos, blobCount: await db.photoBlobs.count(), photoChanges };
  }, ticketId);
}

async function waitForHooks(page: Page) {
  await page.waitForFunction(() => Boolean((window as unknown as { __benchwrightSync?: unknown }).__benchwrightSync));
}

test("a big photo at a photo step is kept as a ≤ 1600 px JPEG named by the SHA-256 of its bytes", async ({ page, context }) => {
  const saw = await openDemoSaw(page, context, { offline: true });
  await waitForHooks(page);
  const intake = step(page, "intake-photo");
  await intake.locator('input[type="file"]').setInputFiles({ name: "bench.png", mimeType: "image/png", buffer: bigPng() });
  await expect(intake.getByRole("img", { name: "Photo as it came in, photo 1" })).toBeVisible({ timeout: 30_000 });
  await expect(intake).toHaveAttribute("data-answered", "yes");

  const { photos, blobCount, photoChanges } = await devicePhotos(page, saw.id);
  expect(photos).toHaveLength(1);
  const [photo] = photos as [StoredPhoto];
  expect(photo.stepId).toBe("intake-photo");
  expect(photo.blob).not.toBeNull();
  const bytes = Buffer.from(photo.blob!.data);
  expect(photo.sha256).toBe(createHash("sha256").update(bytes).digest("hex")); // [Node.js crypto] independent SHA-256
  const size = jpegSize(bytes); // [ISO/IEC 10918-1] the JPEG's own frame header, not what the app says
  expect(size.width).toBe(1600);
  expect(Math.abs(size.height - (2000 * 1600) / 3000)).toBeLessThanOrEqual(1); // 3:2 kept: 1066.7 px
  expect({ width: photo.width, height: photo.height }).toEqual(size);
  expect(photo.mime).toBe("image/jpeg");
  expect(photo.blob!.type).toBe("image/jpeg");
  expect(photo.bytes).toBe(bytes.length);
  expect(photo.blob!.bytes).toBe(bytes.length);
  expect(blobCount).toBe(1);
  expect(photoChanges).toBe(1); // waiting to be sent: this test is offline
});

test("a file that is not a picture is refused with a clear message and nothing is stored", async ({ page, context }) => {
  const saw = await openDemoSaw(page, context, { offline: true });
  await waitForHooks(page);
  const intake = step(page, "intake-photo");
  await intake.locator('input[type="file"]').setInputFiles({ name: "notes.txt", mimeType: "text/plain", buffer: Buffer.from("not a photo") });
  await expect(intake.getByRole("alert")).toHaveText("That file is not a photo. Take or choose a picture.");
  await expect(intake.getByRole("img")).toHaveCount(0);
  await expect(intake).toHaveAttribute("data-answered", "no");
  // The button is ready for the next try.
  await expect(intake.locator("label").filter({ hasText: "Take photo" })).toBeVisible();
  expect(await devicePhotos(page, saw.id)).toEqual({ photos: [], blobCount: 0, photoChanges: 0 });
});

test("chips pick answers, the spark test follows a no-start, the suggestion is labelled as one, and cautions fold", async ({ page, context }) => {
  await openDemoSaw(page, context, { offline: true });
  const primed = step(page, "primed-start");
  const primedNote = primed.getByRole("region", { name: "Safety cautions" });
  await expect(step(page, "spark-test")).toHaveCount(0);
  await expect(page.locator("[data-rule='primed-no-start']")).toHaveCount(0);

  // The first step with the starting hazards shows its cautions in full until it is answered.
  await expect(primedNote.getByText("Engine exhaust carries carbon monoxide")).toBeVisible();
  await expect(primedNote.getByText("Read what each one means")).toHaveCount(0);

  await pick(page, "primed-start", "No start");
  await expect(primed.getByRole("radio", { name: "No start" })).toHaveAttribute("aria-checked", "true");
  await expect(primed.getByRole("radio", { name: "Kept running" })).toHaveAttribute("aria-checked", "false");
  // Answered: the cautions fold to signal words and titles, the full text one tap away.
  await expect(primedNote).toContainText("Exhaust can kill: run engines outdoors");
  await expect(primedNote.getByText("Engine exhaust carries carbon monoxide")).toBeHidden();
  await expect(primedNote.getByText("Read what each one means")).toBeVisible();

  const suggestion = page.getByRole("region", { name: "Suggestions" }).locator("[data-rule='primed-no-start']");
  await expect(suggestion).toContainText("Suggestion");
  await expect(suggestion).toContainText("Next: Spark test.");

  const spark = step(page, "spark-test");
  await expect(spark).toBeVisible();
  await suggestion.getByRole("button", { name: "Go to Spark test" }).click();
  await expect(spark).toBeFocused();
  // The compression gauge showed the spark-test cautions in full already: here they come compact.
  const sparkNote = spark.getByRole("region", { name: "Safety cautions" });
  await expect(sparkNote).toContainText("Spark test away from fuel");
  await expect(sparkNote.getByText("Keep the spark away from spilled fuel")).toBeHidden();
  await sparkNote.getByText("Read what each one means").click();
  await expect(sparkNote.getByText(/Keep the spark away from spilled fuel/)).toBeVisible();
  await expect(sparkNote).toContainText(DEFER_LINE);

  await pick(page, "spark-test", "No spark");
  await expect(page.locator("[data-rule='no-spark']")).toContainText("stop switch");
  await expect(suggestion).toHaveCount(0);
  await expect(step(page, "stop-switch")).toBeVisible();

  // Several answers; "No leak found" is exclusive and clears the others.
  const leak = step(page, "leak-where").getByRole("group", { name: "Where fuel leaks" });
  const savedLeak = page.getByTestId("saved-leak-where");
  await leak.getByRole("button", { name: "Tank", exact: true }).click();
  await expect(savedLeak).toContainText(/Recorded: Tank ·/);
  await leak.getByRole("button", { name: "Tank vent" }).click();
  await expect(savedLeak).toContainText("Recorded: Tank, Tank vent ·");
  await expect(leak.locator("[aria-pressed='true']")).toHaveCount(2);
  await leak.getByRole("button", { name: "No leak found" }).click();
  await expect(savedLeak).toContainText("Recorded: No leak found ·");
  await expect(leak.locator("[aria-pressed='true']")).toHaveText(["No leak found"]);
});

test("chips on the whole sheet keep a gap of at least 8 px between them", async ({ page, context }) => {
  await openDemoSaw(page, context, { offline: true });
  await pick(page, "primed-start", "No start"); // the spark test's chips too
  const groups = await page.locator("[data-step] [role='radiogroup'], [data-step] [role='group']").evaluateAll((els) =>
    els.map((g) => ({
      name: g.getAttribute("aria-label") ?? document.getElementById(g.getAttribute("aria-labelledby") ?? "")?.textContent ?? "",
      chips: [...g.querySelectorAll("button")].map((b) => {
        const r = b.getBoundingClientRect();
        return { left: r.left, right: r.right, top: r.top, bottom: r.bottom };
      }),
    })),
  );
  expect(groups.length).toBeGreaterThan(20);
  expect(groups.map((g) => g.name)).toContain("Spark test");
  const tooClose: string[] = [];
  for (const g of groups) {
    expect(g.chips.length, g.name).toBeGreaterThan(1);
    for (let i = 1; i < g.chips.length; i++) {
      const [a, b] = [g.chips[i - 1]!, g.chips[i]!];
      const sameRow = Math.abs(a.top - b.top) < 1;
      const gap = sameRow ? b.left - a.right : b.top - a.bottom;
      if (gap < 8) tooClose.push(`${g.name}: chips ${i} and ${i + 1} are ${gap} px apart`);
    }
  }
  expect(tooClose).toEqual([]);
});

test("a reading shows low / within against its band and a bad entry keeps what was typed with its error", async ({ page, context }) => {
  await openDemoSaw(page, context, { offline: true });
  const gauge = step(page, "compression-gauge");
  const field = gauge.getByLabel("Compression gauge reading");
  const verdict = gauge.locator("[data-verdict]");
  const saved = page.getByTestId("saved-compression-gauge");
  await field.fill("90");
  await expect(verdict).toHaveAttribute("data-verdict", "low"); // soft band 100–150 psi (common practice, no single source)
  await expect(verdict).toContainText("Low · typical range");
  await gauge.getByRole("radio", { name: "kPa" }).click();
  await field.fill("900"); // [NIST SP 811] 900 kPa ≈ 130.5 psi
  await expect(verdict).toHaveAttribute("data-verdict", "within");
  await gauge.getByRole("button", { name: "Record reading" }).click();
  await expect(saved).toContainText("Recorded: 900 kPa (within)");

  await field.fill("12O");
  await gauge.getByRole("button", { name: "Record reading" }).click();
  await expect(gauge.getByRole("alert")).toContainText('"12O" is not a number');
  await expect(field).toHaveValue("12O");
  await expect(field).toHaveAttribute("aria-invalid", "true");
  await expect(gauge.getByRole("radio", { name: "kPa" })).toHaveAttribute("aria-checked", "true");
  await expect(saved).toContainText("Recorded: 900 kPa (within)");
  await expect(gauge.getByRole("button", { name: /earlier answers/ })).toHaveCount(0); // nothing new was recorded
});

test("tune buttons show the net position and refuse turning a seated screw further in", async ({ page, context }) => {
  // Mixture screws: in (clockwise) = leaner, out = richer; idle screw in = faster idle (common practice, no single source).
  await openDemoSaw(page, context, { offline: true });
  const tune = step(page, "tune");
  const low = tune.getByRole("region", { name: "low-speed mixture screw" });
  const turnsLogged = tune.getByRole("region", { name: "Tune log" });
  await tune.getByRole("button", { name: "L screw: seated, then 1 turn out" }).click();
  await expect(tune.getByTestId("net-low")).toHaveText("1 turn out from seated");
  await tune.getByRole("button", { name: "L screw ½ turn in" }).click();
  await expect(tune.getByTestId("net-low")).toHaveText("½ turn out from seated");
  await expect(low).toContainText("In: leaner low-speed mixture (less fuel).");
  await tune.getByRole("button", { name: "L screw ½ turn in" }).click();
  await expect(tune.getByTestId("net-low")).toHaveText("seated (0 turns out)");
  await expect(turnsLogged).toContainText("2 turns logged");

  await tune.getByRole("button", { name: "L screw ⅛ turn in" }).click();
  await expect(low.getByRole("alert")).toContainText("is already seated, so it cannot go ⅛ turn further in");
  await expect(tune.getByTestId("net-low")).toHaveText("seated (0 turns out)");
  await expect(turnsLogged).toContainText("2 turns logged");

  await tune.getByRole("button", { name: "Idle screw: as found" }).click();
  await expect(tune.getByTestId("net-idle")).toHaveText("as found");
  await tune.getByRole("button", { name: "Idle screw ¼ turn in" }).click();
  await expect(tune.getByTestId("net-idle")).toHaveText("¼ turn in from as found");
  await expect(tune.getByRole("region", { name: "idle speed screw" })).toContainText("Faster idle");
  await expect(turnsLogged).toContainText("3 turns logged");
});

test("the hazard note uses the signal-word colours and closes with the defer-to-manual line", async ({ page, context }) => {
  await openDemoSaw(page, context, { offline: true });
  // Unanswered, the first step with the starting hazards shows the full note.
  const note = step(page, "primed-start").getByRole("region", { name: "Safety cautions" });
  await expect(note.locator(":scope > p").last()).toHaveText(DEFER_LINE);
  const style = async (word: string) =>
    note.locator(`[data-signal='${word}'] > p`).first().evaluate((e) => {
      const s = getComputedStyle(e);
      return [s.backgroundColor, s.color];
    });
  // ANSI Z535 signal-word panels, with the hex values the project set: DANGER #c8102e on white text,
  // WARNING #f47920 with black text, CAUTION #ffd100 with black text, NOTICE #0054a6 with white text.
  expect(await style("DANGER")).toEqual(["rgb(200, 16, 46)", "rgb(255, 255, 255)"]);
  expect(await style("WARNING")).toEqual(["rgb(244, 121, 32)", "rgb(0, 0, 0)"]);
  expect(await style("CAUTION")).toEqual(["rgb(255, 209, 0)", "rgb(0, 0, 0)"]);
  expect(await style("NOTICE")).toEqual(["rgb(0, 84, 166)", "rgb(255, 255, 255)"]);
  await expect(note.getByText("Fuel at least 10 ft (3 m) from flames and sparks")).toBeVisible(); // [OSHA 29 CFR 1910.266(e)(2)(iv)]
  const words = await note.locator("[data-signal]").evaluateAll((els) => els.map((e) => e.getAttribute("data-signal")));
  expect(words.length).toBeGreaterThan(3);
  const rank = ["DANGER", "WARNING", "CAUTION", "NOTICE"];
  const ranks = words.map((w) => rank.indexOf(w ?? ""));
  expect(ranks).not.toContain(-1);
  expect(ranks).toEqual([...ranks].sort((a, b) => a - b)); // most severe first
});

test("screenshots of the bench sheet (when SCREENSHOTS is set)", async ({ page, context }) => {
  test.skip(!SHOTS, "set SCREENSHOTS=1 to write screenshots to tests/.tmp/screens");
  await openDemoSaw(page, context, { offline: true });
  await pick(page, "primed-start", "No start");
  await step(page, "compression-gauge").getByLabel("Compression gauge reading").fill("95");
  await page.screenshot({ path: `${SHOTS}/sheet-phone.png`, fullPage: true });
  await page.emulateMedia({ colorScheme: "dark" });
  await page.screenshot({ path: `${SHOTS}/sheet-phone-dark.png`, fullPage: true });
  await page.emulateMedia({ colorScheme: "light" });
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.screenshot({ path: `${SHOTS}/sheet-desktop.png` });
});
