/**
 * The bench building blocks on the dev-only kit page (app/bench/kit): the photo helper end to end, chips, the
 * guided suggestion, the reading verdict, tune buttons and the hazard note. Drop this file with the kit page.
 */
import { createHash } from "node:crypto";
import { expect, test, type Page } from "@playwright/test";
import { PNG } from "pngjs";

const SHOTS = process.env.SCREENSHOTS ? "tests/.tmp/screens" : null;

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

async function openKit(page: Page) {
  await page.goto("/bench/kit");
  await expect(page.getByRole("heading", { name: "Bench kit" })).toBeVisible();
}

test("a big photo is downscaled to 1600 px JPEG and named by the SHA-256 of its bytes", async ({ page }) => {
  await openKit(page);
  await page.getByLabel("Take photo").setInputFiles({ name: "bench.png", mimeType: "image/png", buffer: bigPng() });
  const result = page.getByTestId("photo-result");
  await expect(result).toBeVisible({ timeout: 30_000 });
  const sha = await result.getAttribute("data-sha256");
  const url = await result.getAttribute("data-url");
  const bytes = Buffer.from(
    await page.evaluate(async (u) => Array.from(new Uint8Array(await (await fetch(u as string)).arrayBuffer())), url),
  );
  expect(sha).toBe(createHash("sha256").update(bytes).digest("hex")); // [Node.js crypto] independent SHA-256
  const size = jpegSize(bytes);
  expect(size.width).toBe(1600);
  expect(Math.abs(size.height - (2000 * 1600) / 3000)).toBeLessThanOrEqual(1); // 3:2 kept: 1066.7 px
  await expect(page.getByTestId("photo-size")).toHaveText(`${size.width}×${size.height}`);
  await expect(result).toContainText("image/jpeg");
});

test("a file that is not a picture is refused with a clear message", async ({ page }) => {
  await openKit(page);
  await page.getByLabel("Take photo").setInputFiles({ name: "notes.txt", mimeType: "text/plain", buffer: Buffer.from("not a photo") });
  await expect(page.getByRole("alert").filter({ hasText: "That file is not a photo" })).toBeVisible();
  await expect(page.getByTestId("photo-result")).toHaveCount(0);
});

test("chips pick answers, the spark test follows a no-start, and the suggestion is labelled as one", async ({ page }) => {
  await openKit(page);
  const primed = page.getByRole("radiogroup", { name: "Prime and test start" });
  await expect(page.getByRole("radiogroup", { name: "Spark test" })).toHaveCount(0);
  await primed.getByRole("radio", { name: "No start" }).click();
  await expect(primed.getByRole("radio", { name: "No start" })).toHaveAttribute("aria-checked", "true");
  const suggestion = page.locator("[data-rule='primed-no-start']");
  await expect(suggestion).toContainText("Suggestion");
  await expect(suggestion).toContainText("Next: Spark test.");
  // The spark test's cautions, compact: signal words and titles, the full text one tap away.
  const sparkNote = page.getByRole("region", { name: "Safety cautions" }).nth(1);
  await expect(sparkNote).toContainText("Spark test away from fuel");
  await expect(sparkNote.getByText("Keep the spark away from spilled fuel")).toBeHidden();
  await sparkNote.getByText("Read what each one means").click();
  await expect(sparkNote.getByText(/Keep the spark away from spilled fuel/)).toBeVisible();
  await expect(sparkNote).toContainText("Follow the maker's manual, local codes and licensed practice.");
  await page.getByRole("radiogroup", { name: "Spark test" }).getByRole("radio", { name: "No spark" }).click();
  await expect(page.locator("[data-rule='no-spark']")).toContainText("stop switch");
  await expect(suggestion).toHaveCount(0);

  const leak = page.getByRole("group", { name: "Where fuel leaks" });
  await leak.getByRole("button", { name: "Tank", exact: true }).click();
  await leak.getByRole("button", { name: "Tank vent" }).click();
  await expect(leak.locator("[aria-pressed='true']")).toHaveCount(2);
  await leak.getByRole("button", { name: "No leak found" }).click(); // exclusive: clears the others
  await expect(leak.locator("[aria-pressed='true']")).toHaveText(["No leak found"]);
});

test("every tap target is at least 56 px tall, and chips keep a gap between them", async ({ page }) => {
  await openKit(page);
  const boxes = await page.locator("main button, main label[for], nav a").evaluateAll((els) =>
    els.map((e) => {
      const r = e.getBoundingClientRect();
      return { text: (e.textContent ?? "").trim().slice(0, 30), width: r.width, height: r.height, left: r.left, top: r.top };
    }),
  );
  expect(boxes.length).toBeGreaterThan(20);
  // label[for] also matches the reading's field label; the field itself is the target there
  const targets = boxes.filter((b) => b.text !== "Compression gauge reading");
  for (const b of targets) expect(b.height, b.text).toBeGreaterThanOrEqual(56);
  const chips = await page.getByRole("group", { name: "Where fuel leaks" }).getByRole("button").evaluateAll((els) =>
    els.map((e) => e.getBoundingClientRect()).map((r) => ({ left: r.left, right: r.right, top: r.top, bottom: r.bottom })),
  );
  for (let i = 1; i < chips.length; i++) {
    const [a, b] = [chips[i - 1]!, chips[i]!];
    const sameRow = Math.abs(a.top - b.top) < 1;
    const gap = sameRow ? b.left - a.right : b.top - a.bottom;
    expect(gap).toBeGreaterThanOrEqual(8);
  }
});

test("a reading shows low / within against the soft band and keeps a bad entry with its error", async ({ page }) => {
  await openKit(page);
  const field = page.getByLabel("Compression gauge reading");
  await field.fill("90");
  await expect(page.locator("[data-verdict]")).toHaveAttribute("data-verdict", "low"); // [practice] soft band 100–150 psi
  await expect(page.locator("[data-verdict]")).toContainText("Low · typical range");
  await page.getByRole("radio", { name: "kPa" }).click();
  await field.fill("900"); // [NIST SP 811] 900 kPa ≈ 130.5 psi
  await expect(page.locator("[data-verdict]")).toHaveAttribute("data-verdict", "within");
  await page.getByRole("button", { name: "Record reading" }).click();
  await expect(page.getByTestId("recorded-reading")).toHaveText("Recorded: 900 kPa (within)");
  await field.fill("12O");
  await page.getByRole("button", { name: "Record reading" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "is not a number" })).toBeVisible();
  await expect(field).toHaveValue("12O");
  await expect(page.getByTestId("recorded-reading")).toHaveText("Recorded: 900 kPa (within)");
});

test("tune buttons show the net position and refuse turning a seated screw further in", async ({ page }) => {
  await openKit(page);
  await expect(page.getByTestId("net-low")).toHaveText("1 turn out from seated");
  await page.getByRole("button", { name: "L screw ½ turn in" }).click();
  await expect(page.getByTestId("net-low")).toHaveText("½ turn out from seated");
  await expect(page.getByRole("region", { name: "low-speed mixture screw" })).toContainText("In: leaner low-speed mixture");
  await page.getByRole("button", { name: "L screw ½ turn in" }).click();
  await expect(page.getByTestId("net-low")).toHaveText("seated (0 turns out)");
  await page.getByRole("button", { name: "L screw ⅛ turn in" }).click();
  await expect(page.getByRole("region", { name: "low-speed mixture screw" }).getByRole("alert")).toContainText("already seated");
  await expect(page.getByTestId("net-low")).toHaveText("seated (0 turns out)");
  await page.getByRole("button", { name: "Idle screw ¼ turn in" }).click();
  await expect(page.getByTestId("net-idle")).toHaveText("¼ turn in from as found");
});

test("the hazard note uses the signal-word colours and closes with the defer-to-manual line", async ({ page }) => {
  await openKit(page);
  const note = page.getByRole("region", { name: "Safety cautions" }).first();
  await expect(note).toContainText("Follow the maker's manual, local codes and licensed practice.");
  const style = async (word: string) =>
    note.locator(`[data-signal='${word}'] > p`).first().evaluate((e) => {
      const s = getComputedStyle(e);
      return [s.backgroundColor, s.color];
    });
  // ANSI Z535 signal-word panels, with the hex values the project set: DANGER #c8102e on white text,
  // WARNING #f47920 with black text, CAUTION #ffd100 with black text.
  expect(await style("DANGER")).toEqual(["rgb(200, 16, 46)", "rgb(255, 255, 255)"]);
  expect(await style("WARNING")).toEqual(["rgb(244, 121, 32)", "rgb(0, 0, 0)"]);
  expect(await style("CAUTION")).toEqual(["rgb(255, 209, 0)", "rgb(0, 0, 0)"]);
  await expect(note.getByText("Fuel at least 10 ft (3 m) from flames and sparks")).toBeVisible();
  const words = await note.locator("[data-signal]").evaluateAll((els) => els.map((e) => e.getAttribute("data-signal")));
  const rank = ["DANGER", "WARNING", "CAUTION", "NOTICE"];
  expect(words.map((w) => rank.indexOf(w ?? ""))).toEqual([...words.map((w) => rank.indexOf(w ?? ""))].sort((a, b) => a - b));
});

test("screenshots of the kit (when SCREENSHOTS is set)", async ({ page, browser }) => {
  test.skip(!SHOTS, "set SCREENSHOTS=1 to write screenshots to tests/.tmp/screens");
  await openKit(page);
  await page.getByRole("radiogroup", { name: "Prime and test start" }).getByRole("radio", { name: "No start" }).click();
  await page.getByLabel("Compression gauge reading").fill("95");
  await page.screenshot({ path: `${SHOTS}/kit-phone.png`, fullPage: true });
  await page.screenshot({ path: `${SHOTS}/kit-phone-fold.png` });
  const dark = await browser.newContext({ viewport: { width: 390, height: 844 }, colorScheme: "dark" });
  const dp = await dark.newPage();
  await openKit(dp);
  await dp.screenshot({ path: `${SHOTS}/kit-phone-dark.png`, fullPage: true });
  await dark.close();
  const desk = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const kp = await desk.newPage();
  await openKit(kp);
  await kp.screenshot({ path: `${SHOTS}/kit-desktop.png` });
  await desk.close();
});
