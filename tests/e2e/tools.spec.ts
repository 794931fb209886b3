import { expect, test, type Page } from "@playwright/test";

const result = (page: Page) => page.getByTestId("big-result");
const chip = (page: Page, group: string, name: string) =>
  page.getByRole("group", { name: group }).or(page.getByRole("radiogroup", { name: group })).getByRole("radio", { name, exact: true });

test.describe("shop tools on a phone", () => {
  test.beforeEach(async ({ page }) => {
    await page.goto("/tools");
    await expect(page.getByRole("heading", { name: "Shop tools" })).toBeVisible();
  });

  test("premix: 1 US gal at 50:1 needs 2.6 US fl oz (exact 2.56); 5 L needs 100 mL", async ({ page }) => {
    // [REFERENCES worked value] 50:1 → 2.56 US fl oz per US gal, printed charts round to 2.6; 5 L at 50:1 → 100 mL
    await expect(result(page)).toHaveText("2.6 US fl oz");
    await expect(page.getByText("Exact: 2.56 US fl oz")).toBeVisible();
    await page.getByLabel("Gasoline", { exact: true }).fill("5");
    await chip(page, "Gasoline measured in", "Litres").click();
    await chip(page, "Answer oil in", "mL").click();
    await expect(result(page)).toHaveText("100 mL");
    await chip(page, "Ratio on the engine or oil", "32:1").click();
    // [REFERENCES worked value] 32:1 → 31.25 mL per L; 5 L → 156.25 mL
    await expect(result(page)).toHaveText("156 mL");
  });

  test("premix: a typing mistake shows a clear error and keeps what was typed", async ({ page }) => {
    await page.getByLabel("Gasoline", { exact: true }).fill("1..5");
    await expect(page.getByRole("alert").filter({ hasText: "Enter the amount of gasoline as a number" })).toBeVisible();
    await expect(page.getByLabel("Gasoline", { exact: true })).toHaveValue("1..5");
  });

  test("premix: the ratio of a mix, and the fueling cautions are shown", async ({ page }) => {
    await chip(page, "What do you want to know?", "What ratio is my mix?").click();
    await page.getByLabel("Gasoline", { exact: true }).fill("2.5");
    await page.getByLabel("Oil in the mix").fill("6.4");
    // [REFERENCES worked value] 2.5 gal at 50:1 → 6.4 fl oz
    await expect(result(page)).toHaveText("50:1");
    await expect(page.getByRole("region", { name: "Safety cautions" })).toContainText("Follow the maker's manual, local codes and licensed practice.");
  });

  test("units: 3/16 in is 4.7625 mm", async ({ page }) => {
    await chip(page, "Tool", "Units").click();
    // [NIST exact, 16 CFR 500.19] 1 in = 25.4 mm, so 3/16 in = 4.7625 mm
    await expect(result(page)).toHaveText("4.7625 mm");
    await chip(page, "Quantity", "Pressure").click();
    await page.getByLabel(/Value in/).fill("100");
    // [NIST SP 811, from memory] 1 psi = 6.894757 kPa
    await expect(result(page)).toHaveText("689.4757 kPa");
  });

  test("tune screws: out is richer, and a seated screw cannot go further in", async ({ page }) => {
    await chip(page, "Tool", "Tune screws").click();
    await expect(result(page)).toHaveText("Out: richer low-speed mixture (more fuel).");
    await expect(page.getByText("Afterwards: 1 ½ turns out from seated.")).toBeVisible();
    await expect(chip(page, "Screw", "Low-speed mixture screw")).toHaveAttribute("aria-checked", "true");
    await chip(page, "Starting from", "Seated").click();
    await chip(page, "Turn it", "In (clockwise)").click();
    await expect(page.getByRole("alert").filter({ hasText: "is already seated, so it cannot go" })).toBeVisible();
  });

  test("ethanol: E10 is fine, E15 is not", async ({ page }) => {
    await chip(page, "Tool", "Ethanol").click();
    await expect(result(page)).toHaveText("OK for small engines");
    await chip(page, "What does the pump say?", "E15").click();
    // [40 CFR 80.1504(a)(1)] more than 10 % ethanol must not be used in nonroad engines
    await expect(result(page)).toHaveText("Do not use");
    await expect(page.getByText("40 CFR 80.1504(a)(1)", { exact: false })).toBeVisible();
  });
});
