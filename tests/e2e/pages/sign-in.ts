import { expect, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "benchwright-demo";
export const DEMO = {
  owner: "owner@demo.benchwright.test",
  counter: "counter@demo.benchwright.test",
  tech: "tech@demo.benchwright.test",
  tech2: "tech2@demo.benchwright.test",
} as const;

export class SignInPage {
  constructor(private readonly page: Page) {}

  async goto(next?: string) {
    await this.page.goto(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }

  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  error() {
    return this.page.getByRole("alert").filter({ hasText: "Not signed in" });
  }
}

/** Signs in through the form and waits to leave the sign-in page. */
export async function signInAs(page: Page, email: string) {
  const form = new SignInPage(page);
  await form.goto();
  await form.signIn(email);
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}
