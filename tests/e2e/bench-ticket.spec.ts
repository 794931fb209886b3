/**
 * A whole chain-saw diagnosis on a phone-sized screen with no network: the tech takes today's work, goes offline,
 * scans the machine's printed repair tag through Chromium's fake camera, walks the bench sheet (compression,
 * primed start, carburetor checks, a finding with a photo, tune entries, the labor timer), reloads while still
 * offline and finds everything there, comes back online, and the server holds it all.
 *
 * The printed tag is the counter's own label PDF for the ticket, rendered by poppler (pdftoppm) and played to
 * the fake camera as a Y4M clip. Expected answers come from the built-in chain-saw sheet (our own procedure) and
 * lib/trade/tune (mixture-screw arithmetic: out = counter-clockwise, common practice, no single source).
 */
import path from "node:path";
import Database from "better-sqlite3";
import { expect, test } from "@playwright/test";
import bwipjs from "bwip-js/node";
import { E2E_PORT } from "../../playwright.config";
import { demoChainSaw, labelClip } from "../fixtures/printed-tag";
import { launchWithFakeCamera } from "../fixtures/fake-camera";
import { DEMO, signInAs } from "./pages/sign-in";
import { RECORD_CAMERA_AND_VIBRATION } from "./pages/scan";
import { deviceTickets, goOffline, outboxCount, waitForServiceWorker } from "./pages/pwa";
import { E2E_DATA_DIR, expectBigTargets, pick, step } from "./pages/bench-ticket";

const BASE_URL = `http://localhost:${E2E_PORT}`;
const SHOTS = process.env.SCREENSHOTS ? "tests/.tmp/screens" : null;

test.describe.configure({ timeout: 240_000 });
test.use({ actionTimeout: 15_000 });

function serverDb() {
  return new Database(path.join(E2E_DATA_DIR, "benchwright.sqlite"), { readonly: true, fileMustExist: true });
}

let onFailure: () => Promise<void> = async () => undefined;

test("a chain-saw diagnosis recorded offline on the phone reaches the server after sync", async ({ browser }) => {
  const saw = demoChainSaw(E2E_DATA_DIR, DEMO.tech);

  // The printed tag: the counter's 4×2 in label PDF at 150 dpi (600×300 px), centred in a 640×480 camera frame.
  const counter = await browser.newContext({ baseURL: BASE_URL });
  const cp = await counter.newPage();
  await signInAs(cp, DEMO.counter);
  const pdf = await (await cp.request.get(`/api/labels/tickets/${saw.id}?layout=label-4x2`)).body();
  await counter.close();
  const clip = labelClip("printed-chain-saw-tag", pdf);

  const { browser: camBrowser, context, page } = await launchWithFakeCamera(clip, BASE_URL, RECORD_CAMERA_AND_VIBRATION);
  try {
    page.on("pageerror", (e) => console.log(`[page error] ${e.message}`));
    onFailure = async () => {
      await page.screenshot({ path: test.info().outputPath("phone.png") });
      console.log(await page.locator("main").ariaSnapshot().catch(() => "(no snapshot)"));
    };

    // Take today's work (the first sync), then lose the network.
    await signInAs(page, DEMO.tech);
    await waitForServiceWorker(page);
    expect((await deviceTickets(page)).map((t) => t.id)).toContain(saw.id);
    await goOffline(context, page);

    // Scan the printed tag: the ticket opens from the phone's store.
    await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Scan tag" }).click();
    await expect(page).toHaveURL(new RegExp(`/bench/ticket\\?id=${saw.id}$`), { timeout: 20_000 });
    await expect(page.getByRole("heading", { level: 1 })).toContainText(`#${saw.number}`);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/bench-ticket-top.png` });
    await expectBigTargets(page);

    // Condition at intake; one answer taken back (Undo is a void: the history keeps it).
    await pick(page, "chain-tension", "Loose or sagging");
    await step(page, "chain-tension").getByRole("button", { name: "Undo answer" }).click();
    await expect(page.getByTestId("saved-chain-tension")).toHaveCount(0);
    await pick(page, "chain-tension", "Snug, pulls round");

    // Compression: feel, then a gauge reading against the soft default band (100–150 psi, common practice).
    await pick(page, "pull-over-feel", "Fair");
    const gauge = step(page, "compression-gauge");
    await expect(gauge.getByRole("region", { name: "Safety cautions" })).toBeVisible();
    await gauge.getByLabel("Compression gauge reading").fill("95");
    await gauge.getByRole("button", { name: "Record reading" }).click();
    await expect(page.getByTestId("saved-compression-gauge")).toContainText("95 psi (low)");

    // Primed start ran briefly: the sheet suggests fuel delivery (labelled as a suggestion).
    await expect(step(page, "primed-start").getByRole("region", { name: "Safety cautions" })).toBeVisible();
    await pick(page, "primed-start", "Ran briefly, then died");
    const suggestions = page.getByRole("region", { name: "Suggestions" });
    await expect(suggestions).toContainText("Suggestion");
    await expect(suggestions).toContainText("look at fuel delivery");

    // Carburetor.
    await pick(page, "inlet-screen", "Film or varnish");
    await pick(page, "metering-diaphragm", "Stiff");
    await pick(page, "diaphragm-stem", "Short stem, matches the old");
    await pick(page, "check-valve", "Bent or curled");
    await pick(page, "metering-lever", "Sticks");
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/bench-ticket-carb.png` });

    // A finding from the diaphragm step, with a photo of the worn part.
    await step(page, "metering-diaphragm").getByRole("button", { name: "Add finding" }).click();
    const form = page.getByRole("region", { name: "New finding" });
    await form.getByRole("radio", { name: "Why it came in" }).click();
    await expect(form.getByLabel("Title")).toHaveValue("Metering diaphragm");
    await form.getByLabel("Title").fill("Metering diaphragm stiff");
    await form.getByLabel("Note").fill("Diaphragm gone stiff from stale fuel; lever sticks.");
    const photo = await bwipjs.toBuffer({ bcid: "code128", text: "WORN-PART", scale: 4, height: 20, backgroundcolor: "FFFFFF" });
    await form.locator('input[type="file"]').setInputFiles({ name: "diaphragm.png", mimeType: "image/png", buffer: photo });
    await expect(form.getByRole("img", { name: "New finding, photo 1" })).toBeVisible();
    await form.getByRole("button", { name: "Add a part" }).click();
    await form.getByLabel("Part 1", { exact: true }).fill("Carburetor rebuild kit");
    await form.getByRole("button", { name: "30", exact: true }).click();
    await form.getByRole("button", { name: "Offer another way (e.g. replace the assembly)" }).click();
    await form.getByLabel("Name of the other way").fill("Replace the carburetor assembly");
    await form.getByLabel("Labor minutes for the other way").fill("20");
    await form.getByRole("button", { name: "Save finding" }).click();
    const finding = page.getByRole("article", { name: "Finding: Metering diaphragm stiff" });
    await expect(finding).toBeVisible();
    await expect(finding.getByTestId("photo-thumb")).toHaveCount(1);
    await expect(finding).toContainText("Carburetor rebuild kit × 1, 30 min labor");

    // Tune log: baselines first, then ⅛ out on L and ¼ in on H.
    const tune = step(page, "tune");
    await tune.getByRole("button", { name: "L screw: seated, then 1 turn out" }).click();
    await tune.getByRole("button", { name: "H screw: seated, then 1 turn out" }).click();
    await tune.getByRole("button", { name: "L screw ⅛ turn out" }).click();
    await expect(tune.getByTestId("net-low")).toHaveText("1 ⅛ turns out from seated");
    await tune.getByRole("button", { name: "H screw ¼ turn in" }).click();
    await expect(tune.getByTestId("net-high")).toHaveText("¾ turn out from seated");
    // A seated screw cannot go further in: the phone refuses and records nothing.
    await tune.getByRole("button", { name: "H screw ½ turn in" }).click();
    await expect(tune.getByTestId("net-high")).toHaveText("¼ turn out from seated");
    await tune.getByRole("button", { name: "H screw ½ turn in" }).click();
    await expect(tune.getByRole("alert")).toContainText("cannot go ½ turn further in");
    await expect(tune.getByTestId("net-high")).toHaveText("¼ turn out from seated");

    // Labor timer.
    await page.getByRole("region", { name: "Labor timer" }).getByRole("button", { name: "Start timer" }).click();
    await expect(page.getByRole("region", { name: "Labor timer" })).toContainText("Timer running");
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/bench-ticket-finding.png`, fullPage: false });
    await expectBigTargets(page);

    // Reload with no network: everything is still on the phone.
    await page.reload();
    await expect(page.getByTestId("bench-ticket")).toBeVisible();
    await expect(page.getByTestId("saved-chain-tension")).toContainText("Snug, pulls round");
    await expect(page.getByTestId("saved-compression-gauge")).toContainText("95 psi (low)");
    await expect(page.getByTestId("saved-metering-diaphragm")).toContainText("Stiff");
    await expect(page.getByTestId("saved-metering-lever")).toContainText("Sticks");
    await expect(page.getByRole("article", { name: "Finding: Metering diaphragm stiff" }).getByTestId("photo-thumb")).toHaveCount(1);
    await expect(step(page, "tune").getByTestId("net-low")).toHaveText("1 ⅛ turns out from seated");
    await expect(step(page, "tune").getByTestId("net-high")).toHaveText("¼ turn out from seated");
    await expect(page.getByRole("region", { name: "Labor timer" })).toContainText("Timer running");
    const waiting = await outboxCount(page);
    expect(waiting).toBeGreaterThan(15);

    // Back online: the outbox drains and the server has it all.
    await context.setOffline(false);
    await expect.poll(() => outboxCount(page), { timeout: 60_000 }).toBe(0);

    const db = serverDb();
    try {
      const entries = db.prepare("SELECT step_id AS stepId, value, voided_at AS voidedAt FROM bench_entries WHERE ticket_id = ?").all(saw.id) as Array<{ stepId: string; value: string; voidedAt: string | null }>;
      const live = new Map(entries.filter((e) => !e.voidedAt).map((e) => [e.stepId, JSON.parse(e.value)]));
      expect(live.get("compression-gauge")).toEqual({ kind: "reading", value: 95, unit: "psi" });
      expect(live.get("primed-start")).toEqual({ kind: "choice", selected: ["ran-briefly"] });
      expect(live.get("metering-diaphragm")).toEqual({ kind: "choice", selected: ["stiff"] });
      expect(live.get("metering-lever")).toEqual({ kind: "pass-fail", pass: false });
      expect(entries.filter((e) => e.stepId === "chain-tension" && e.voidedAt)).toHaveLength(1);
      const findings = db.prepare("SELECT id, grade, title, alternatives FROM findings WHERE ticket_id = ?").all(saw.id) as Array<{ id: string; grade: string; title: string; alternatives: string }>;
      expect(findings).toHaveLength(1);
      expect(findings[0]).toMatchObject({ grade: "cause", title: "Metering diaphragm stiff" });
      const photos = db.prepare("SELECT sha256, finding_id AS findingId FROM photos WHERE ticket_id = ?").all(saw.id) as Array<{ sha256: string; findingId: string }>;
      expect(photos).toEqual([expect.objectContaining({ findingId: findings[0]!.id })]);
      const tuneRows = db.prepare("SELECT screw, kind, direction, eighths FROM tune_entries WHERE ticket_id = ? ORDER BY at").all(saw.id);
      expect(tuneRows).toEqual([
        { screw: "low", kind: "baseline", direction: null, eighths: 8 },
        { screw: "high", kind: "baseline", direction: null, eighths: 8 },
        { screw: "low", kind: "turn", direction: "ccw", eighths: 1 },
        { screw: "high", kind: "turn", direction: "cw", eighths: 2 },
        { screw: "high", kind: "turn", direction: "cw", eighths: 4 },
      ]);
      const labor = db.prepare("SELECT ended_at AS endedAt FROM labor_entries WHERE ticket_id = ?").all(saw.id);
      expect(labor).toEqual([{ endedAt: null }]);
    } finally {
      db.close();
    }

    // The counter sees it on the ticket page.
    const desk = await browser.newContext({ baseURL: BASE_URL });
    const dp = await desk.newPage();
    await signInAs(dp, DEMO.counter);
    await dp.goto(`/counter/tickets/${saw.id}`);
    await expect(dp.getByText("Metering diaphragm stiff").first()).toBeVisible();
    await expect(dp.getByText("95 psi (low)").first()).toBeVisible();
    await desk.close();
  } catch (e) {
    await onFailure();
    throw e;
  } finally {
    await camBrowser.close();
  }
});
