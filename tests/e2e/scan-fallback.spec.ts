/** The scan screen without a usable camera: say how to allow it, offer typing; and @zxing stays off /bench. */
import { expect, test } from "@playwright/test";
import { DEMO, signInAs } from "./pages/sign-in";
import { ScanPage } from "./pages/scan";

const failCamera = (name: string) => {
  navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException("camera refused in test", name));
};

test("camera permission denied: says how to allow it and offers typing the code", async ({ page }) => {
  await page.addInitScript(failCamera, "NotAllowedError");
  await signInAs(page, DEMO.tech);
  const scan = new ScanPage(page);
  await scan.goto();
  const alert = scan.scanner().getByRole("alert");
  await expect(alert).toContainText("The camera is blocked for Benchwright");
  await expect(alert).toContainText("set Camera to Allow");
  await expect(alert.getByRole("button", { name: "Try again" })).toBeVisible();
  if (process.env.SCREENSHOTS) await page.screenshot({ path: "tests/.tmp/screens/scan-denied.png" });
  await alert.getByRole("button", { name: "Type the code" }).click();
  await expect(scan.manualField()).toBeFocused();
  await scan.typeCode("");
  await expect(scan.manualError()).toContainText("Enter the tag code");
});

test("no camera: says so and offers typing the code", async ({ page }) => {
  await page.addInitScript(failCamera, "NotFoundError");
  await signInAs(page, DEMO.tech);
  const scan = new ScanPage(page);
  await scan.goto();
  const alert = scan.scanner().getByRole("alert");
  await expect(alert).toContainText("No camera found");
  await expect(alert.getByRole("button", { name: "Try again" })).toHaveCount(0);
  await expect(alert.getByRole("button", { name: "Type the code" })).toBeVisible();
});

test("the scanner's code loads on the scan screen only, not with the bench", async ({ page }) => {
  await page.addInitScript(failCamera, "NotFoundError");
  /** Bodies of every script the page has loaded so far (from its resource timing entries). */
  const loadedScripts = async () => {
    const urls = await page.evaluate(() =>
      performance
        .getEntriesByType("resource")
        .map((e) => e.name)
        .filter((u) => u.endsWith(".js")),
    );
    return Promise.all(urls.map(async (url) => ({ url, body: await (await page.request.get(url)).text() })));
  };
  const zxing = (scripts: { url: string; body: string }[]) => scripts.filter((s) => s.body.includes("decodeFromConstraints")).map((s) => s.url);

  await signInAs(page, DEMO.tech);
  await page.goto("/bench");
  await page.waitForLoadState("load");
  await expect(page.getByText("Signed in as")).toBeVisible();
  const bench = await loadedScripts();
  expect(bench.length).toBeGreaterThan(3);
  expect(zxing(bench)).toEqual([]);

  // Control: the same check finds the scanner's code once the scan screen is open.
  await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Scan tag" }).click();
  await expect(new ScanPage(page).scanner().getByRole("alert")).toContainText("No camera found");
  expect(zxing(await loadedScripts()).length).toBeGreaterThan(0);
});
