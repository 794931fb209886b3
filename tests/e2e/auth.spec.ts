import { expect, test } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, SignInPage, signInAs } from "./pages/sign-in";

test.describe("each role lands on its own home", () => {
  test("the tech lands on the bench", async ({ page }) => {
    await signInAs(page, DEMO.tech);
    await expect(page).toHaveURL(/\/bench$/);
    await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
    await expect(page.getByText("Signed in as")).toContainText("Tomas Brevik");
    await expect(page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Scan tag" })).toBeVisible();
  });

  test("the counter lands on the queue, without the owner menu", async ({ page }) => {
    await signInAs(page, DEMO.counter);
    await expect(page).toHaveURL(/\/counter$/);
    await expect(page.getByRole("heading", { name: "Queue" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "People" })).toHaveCount(0);
  });

  test("the owner lands on the queue with the owner menu", async ({ page }) => {
    await signInAs(page, DEMO.owner);
    await expect(page).toHaveURL(/\/counter$/);
    await expect(page.getByRole("heading", { name: "Queue" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "People" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Shop settings" })).toBeVisible();
  });
});

test("a tech opening an owner page gets the not-allowed page", async ({ page }) => {
  await signInAs(page, DEMO.tech);
  const res = await page.goto("/owner/people");
  expect(res?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Not allowed for your role" })).toBeVisible();
});

test("a signed-out visitor is sent to sign-in and returned afterwards", async ({ page }) => {
  await page.goto("/owner/settings");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fowner%2Fsettings/);
  await new SignInPage(page).signIn(DEMO.owner);
  await expect(page).toHaveURL(/\/owner\/settings$/);
  await expect(page.getByRole("heading", { name: "Shop settings" })).toBeVisible();
});

test("a wrong password is refused and the e-mail stays typed", async ({ page }) => {
  const form = new SignInPage(page);
  await form.goto();
  await form.signIn(DEMO.counter, "not-the-password");
  await expect(form.error()).toContainText("do not match");
  await expect(page.getByLabel("E-mail")).toHaveValue(DEMO.counter);
});

test("next-auth's own endpoints sign in and the session carries the role", async ({ request }) => {
  const { csrfToken } = await (await request.get("/api/auth/csrf")).json();
  const res = await request.post("/api/auth/callback/credentials", {
    form: { csrfToken, email: DEMO.counter, password: DEMO_PASSWORD },
    maxRedirects: 0,
  });
  expect(res.status()).toBe(302);
  const session = await (await request.get("/api/auth/session")).json();
  expect(session.user).toMatchObject({ email: DEMO.counter, role: "counter" });
});

test("the owner switches a tech off and that tech's open session stops working", async ({ browser }) => {
  const techContext = await browser.newContext();
  const tech = await techContext.newPage();
  await signInAs(tech, DEMO.tech2);
  expect((await tech.request.get("/api/me")).status()).toBe(200);

  const ownerContext = await browser.newContext();
  const owner = await ownerContext.newPage();
  await signInAs(owner, DEMO.owner);
  await owner.goto("/owner/people");
  const card = owner.getByRole("listitem").filter({ hasText: DEMO.tech2 });
  await card.getByRole("button", { name: /^Switch off/ }).click();
  await expect(card.getByText("Switched off", { exact: true })).toBeVisible();

  const after = await tech.request.get("/api/me");
  expect(after.status()).toBe(401);
  expect(await after.json()).toEqual({ error: { code: "unauthorized", message: "Sign in to continue." } });

  const again = new SignInPage(tech);
  await again.goto();
  await again.signIn(DEMO.tech2);
  await expect(again.error()).toContainText("switched off");

  await card.getByRole("button", { name: /^Switch on/ }).click();
  await expect(card.getByText("Switched off", { exact: true })).toHaveCount(0);
  await Promise.all([techContext.close(), ownerContext.close()]);
});

test("health answers once the database does", async ({ request }) => {
  const res = await request.get("/api/health");
  expect(res.status()).toBe(200);
  expect(await res.json()).toMatchObject({ ok: true });
});
