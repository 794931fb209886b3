import { PNG } from "pngjs";
import { expect, test } from "@playwright/test";
import { decodeCode128, renderPdfPage } from "../fixtures/barcode";
import { addDays, dateIn } from "../../lib/counter/dates";
import { isValidTagCode, normalizeTagCode } from "../../lib/trade/tag-code";
import { DEMO, signInAs } from "./pages/sign-in";
import { IntakePage, QueueBoardPage } from "./pages/counter";

// The counter works on a tablet: landscape 1024 × 768 (cards on the board below the table breakpoint).
test.use({ viewport: { width: 1024, height: 768 } });

/** The demo shop keeps Chicago time. */
const inThreeDays = () => addDays(dateIn("America/Chicago", Date.now()), 3);

/** A plain PNG of the given size (pngjs), standing in for a camera picture. */
function testPng(width: number, height: number): Buffer {
  const png = new PNG({ width, height });
  for (let i = 0; i < png.data.length; i += 4) {
    png.data[i] = (i / 4) % width % 256;
    png.data[i + 1] = 120;
    png.data[i + 2] = 60;
    png.data[i + 3] = 255;
  }
  return PNG.sync.write(png);
}

test("the counter takes a machine in, prints a tag that scans back to its code, and moves it on the board", async ({ page }) => {
  await signInAs(page, DEMO.counter);
  const intake = new IntakePage(page);
  await intake.goto();

  await intake.field("First name").fill("Wendeline");
  await intake.field("Last name").fill("Aspinall");
  await intake.field("Phone").fill("555-01ab");
  await intake.field("E-mail").fill("wendeline@example.org");
  await intake.choose("How to reach them", "Text message");
  await intake.choose("Kind of machine", "Chain saw");
  await intake.choose("Engine", "Two-stroke");
  await intake.field("Make").fill("Tarnwick");
  await intake.field("Model").fill("TW-40");
  await intake.field("Serial number").fill("TW40-E2E-0001");
  await intake.choose("Quick picks", "Won't start");
  await intake.field("In the customer's words").fill("Pulls over but never fires.");
  await intake.choose("Tick what you see", "Fuel in the tank");
  await expect(page.getByRole("complementary", { name: /^WARNING/ })).toContainText("10 ft (3 m)");
  await intake.field("Promised for").fill(inThreeDays());
  await intake.field("Call before going over ($)").fill("150");
  await intake.submit();

  // The bad phone number is refused beside its field; everything typed stays.
  await expect(intake.errorFor("phone")).toContainText("Use digits only");
  await expect(intake.field("Phone")).toHaveValue("555-01ab");
  await expect(intake.field("Last name")).toHaveValue("Aspinall");
  await expect(intake.field("Make")).toHaveValue("Tarnwick");
  await expect(intake.field("In the customer's words")).toHaveValue("Pulls over but never fires.");
  await expect(page.getByRole("group", { name: "Quick picks" }).getByLabel("Won't start")).toBeChecked();
  await expect(page).toHaveURL(/\/counter\/intake$/);

  // An intake photo: downscaled, hashed and uploaded at once; the failed save above did not lose it either.
  await page.getByTestId("intake-photo-input").setInputFiles({ name: "guard.png", mimeType: "image/png", buffer: testPng(2400, 1800) });
  await expect(page.getByRole("list", { name: "Intake photos" }).getByRole("img")).toHaveCount(1);

  await intake.field("Phone").fill("555-0131");
  await intake.submit();
  await expect(page).toHaveURL(/\/counter\/tickets\/[0-9a-f-]{36}\?taken=1$/);
  const heading = page.getByRole("heading", { level: 1 });
  const printed = (await heading.textContent())!.trim();
  const code = normalizeTagCode(printed);
  expect(isValidTagCode(code)).toBe(true);
  await expect(page.getByRole("status").filter({ hasText: "Print the tag and fix it to the machine" })).toBeVisible();
  const intakePhoto = page.getByRole("list", { name: "Photos taken at intake" }).getByRole("img");
  await expect(intakePhoto).toHaveCount(1);
  // Stored downscaled to the 1600 px long edge (lib/bench/photo), and served back to the counter.
  await expect.poll(() => intakePhoto.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(1600);

  // The label PDF's barcode, rendered by poppler and read by zxing, is the ticket's code.
  const href = await page.getByRole("link", { name: "Print tag: 2 × 4 in label" }).getAttribute("href");
  const pdf = await page.request.get(href!);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  expect(decodeCode128(renderPdfPage(await pdf.body(), { dpi: 200 }))).toBe(code);

  // The queue board shows the new ticket; a status move with a reason lands on the board and in the history.
  const board = new QueueBoardPage(page);
  await board.goto();
  await board.search("Aspinall");
  await expect(board.card(printed)).toContainText("Taken in");
  await expect(board.card(printed)).toContainText("Tarnwick TW-40");
  await board.move(printed, "On the bench", "Bench 2 is free");
  await expect(board.card(printed)).toContainText("On the bench");

  await board.card(printed).getByRole("link", { name: printed }).click();
  const history = page.getByRole("region", { name: "Status history" });
  await expect(history).toContainText("Taken in → On the bench");
  await expect(history).toContainText("Bench 2 is free");
});

test("the board picks up a change made elsewhere without a reload", async ({ page }) => {
  await signInAs(page, DEMO.counter);
  const board = new QueueBoardPage(page);
  await board.goto();
  await board.search("Petrakis");
  const card = page.getByRole("list", { name: "Open tickets" }).getByRole("listitem").filter({ hasText: "Petrakis" });
  await expect(card).toContainText("Taken in");
  const id = (await card.getByRole("link").first().getAttribute("href"))!.split("/").pop()!;
  // Another counter (or a synced bench device) moves the ticket; this page is not touched.
  const res = await page.request.post(`/api/counter/tickets/${id}/status`, { data: { from: "taken_in", to: "in_repair", reason: "" } });
  expect(res.status()).toBe(200);
  await expect(card).toContainText("In repair", { timeout: 15_000 });
});

test("a serial already on file is flagged before a second machine is saved", async ({ page }) => {
  await signInAs(page, DEMO.counter);
  const intake = new IntakePage(page);
  await intake.goto();
  await intake.field("Last name").fill("Quenby");
  await intake.field("Phone").fill("555-0177");
  await intake.choose("Kind of machine", "Chain saw");
  await intake.choose("Engine", "Two-stroke");
  await intake.field("Make").fill("Varnholt");
  await intake.field("Serial number").fill("vh451 20931"); // the demo shop's Varnholt VH-451, typed loosely
  await intake.field("Serial number").blur();
  await expect(page.getByText("Possible duplicate: this serial is already on file.")).toBeVisible();
  await expect(page.getByText(/Varnholt VH-451 \(chain saw\) · s\/n VH451-20931 · Marguerite Ashdown/)).toBeVisible();
  await page.getByRole("button", { name: "Use this machine" }).click();
  await expect(page.getByText(/^On file:/).filter({ hasText: "VH-451" })).toBeVisible();
  await expect(page.getByText(/Already in the shop on #\d+ \(on the bench\)/)).toBeVisible();
});

test("looking up a sticker code opens the machine's history when nothing is open", async ({ page }) => {
  await signInAs(page, DEMO.counter);
  // The demo's Brennick BW-19 was handed back 37 days ago, so it has no open ticket.
  await page.goto("/counter/history?q=BW19-40877");
  await page.getByRole("link", { name: /Brennick BW-19/ }).click();
  await expect(page.getByRole("heading", { name: "Brennick BW-19" })).toBeVisible();
  await page.getByRole("button", { name: "Give this machine a permanent sticker" }).click();
  const sticker = page.getByRole("region", { name: "Permanent sticker" });
  const code = (await sticker.locator("p.font-mono").textContent())!.trim();
  expect(isValidTagCode(code)).toBe(true);
  const machineUrl = page.url();

  await page.goto(`/counter/history?q=${encodeURIComponent(code.toLowerCase())}`);
  await expect(page).toHaveURL(machineUrl);

  const res = await page.request.get(`/api/tags/${normalizeTagCode(code)}`);
  expect(await res.json()).toEqual({ kind: "sticker", machineId: machineUrl.split("/").pop() });
  const wrong = await page.request.get(`/api/tags/${normalizeTagCode(code).slice(0, 6)}${code.endsWith("X") ? "Y" : "X"}`);
  expect(wrong.status()).toBe(400);
});

test.describe("on a desktop", () => {
  test.use({ viewport: { width: 1440, height: 900 } });

  test("a ready machine is handed back, and the same machine brought back is marked a comeback", async ({ page }) => {
    await signInAs(page, DEMO.counter);
    const board = new QueueBoardPage(page);
    await board.goto();
    await board.search("Teasdale");
    const row = page.getByRole("table").getByRole("row").filter({ hasText: "Teasdale" });
    await expect(row).toHaveCount(1);
    await expect(row).toContainText("Ready for pickup");
    await row.getByRole("link").first().click();

    const handBack = page.getByRole("region", { name: "Hand-back" });
    await expect(handBack.getByLabel("Collected by")).toHaveValue("Bram Teasdale");
    await handBack.getByRole("button", { name: "Record hand-back and close" }).click();
    await expect(handBack).toContainText("Handed back to Bram Teasdale");
    await expect(page.getByRole("region", { name: "Status history" })).toContainText("Handed back to Bram Teasdale");
    const number = (await page.getByText(/^#\d+$/).first().textContent())!.trim();

    await page.getByRole("link", { name: "Machine history" }).click();
    await page.getByRole("link", { name: "Take it in again" }).click();
    await expect(page.getByText(/^On file:/).filter({ hasText: "Quarrow QB-44" })).toBeVisible();
    await expect(page.getByLabel("Last name", { exact: true })).toHaveValue("Teasdale");
    await page.getByRole("group", { name: "Quick picks" }).getByLabel("Won't start", { exact: true }).check();
    await page.getByRole("button", { name: "Take in and print tag" }).click();
    await expect(page).toHaveURL(/\/counter\/tickets\/[0-9a-f-]{36}\?taken=1$/);
    // Same day, or the next one if the test runs across midnight in the shop's zone.
    await expect(page.getByText(new RegExp(`^Comeback: back [01] days? after ${number} was handed back\\.$`))).toBeVisible();
  });
});
