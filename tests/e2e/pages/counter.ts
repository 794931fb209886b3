import { expect, type Locator, type Page } from "@playwright/test";

/** The intake form, found by its labels as a person would. */
export class IntakePage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/counter/intake");
    await expect(this.page.getByRole("heading", { name: "Take in a machine" })).toBeVisible();
  }

  /** A text, date or select control by its label (not the radio or checkbox chips of the same name). */
  field(label: string | RegExp): Locator {
    return this.page
      .getByLabel(label, { exact: typeof label === "string" })
      .and(this.page.locator("input:not([type=radio]):not([type=checkbox]), textarea, select"));
  }

  async choose(group: string, option: string) {
    await this.page.getByRole("group", { name: group }).getByLabel(option, { exact: true }).check();
  }

  async submit() {
    await this.page.getByRole("button", { name: "Take in and print tag" }).click();
  }

  /** The error shown beside a field (Field renders it as #f-<name>-error). */
  errorFor(name: string): Locator {
    return this.page.locator(`#f-${name}-error`);
  }
}

/** The queue board at widths below the table breakpoint: one card per ticket. */
export class QueueBoardPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/counter");
    await expect(this.page.getByRole("heading", { name: "Queue" })).toBeVisible();
  }

  /** Types into the search box and waits until the board shows the filtered answer. */
  async search(text: string) {
    await this.page.getByLabel("Search", { exact: true }).fill(text);
    await expect(this.page.getByText(/^\d+ tickets? match/)).toBeVisible();
    await expect(this.page.getByText(/ · refreshing…$/)).toHaveCount(0);
  }

  card(code: string): Locator {
    return this.page.getByRole("list", { name: "Open tickets" }).getByRole("listitem").filter({ hasText: code });
  }

  async move(code: string, to: string, reason: string) {
    await this.card(code).getByRole("button", { name: /^Move/ }).click();
    const dialog = this.page.getByRole("dialog");
    await dialog.getByLabel(to, { exact: true }).check();
    await dialog.getByLabel(/^Reason/).fill(reason);
    await dialog.getByRole("button", { name: "Move ticket" }).click();
    await expect(dialog).toBeHidden();
  }
}
