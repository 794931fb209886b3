import { randomUUID } from "node:crypto";
import { expect, test, type APIRequestContext } from "@playwright/test";
import { DEMO, SignInPage, signInAs } from "./pages/sign-in";
import { BenchSyncPage } from "./pages/bench-sync";

/** What a fresh device of the same person would pull: used to see what reached the server. */
async function serverIds(request: APIRequestContext, entity: string): Promise<string[]> {
  const res = await request.get(`/api/sync/pull?v=1&deviceId=${randomUUID()}&cursor=0&limit=2000`);
  expect(res.status()).toBe(200);
  const body = (await res.json()) as { changes: Array<{ entity: string; id: string }> };
  return body.changes.filter((c) => c.entity === entity).map((c) => c.id);
}
const serverNotes = (request: APIRequestContext) => serverIds(request, "ticket_note");

test("a tech's phone pulls its work, records offline and sends it when the network is back", async ({ page, context }) => {
  await BenchSyncPage.enableHooks(context);
  await signInAs(page, DEMO.tech);
  const sync = new BenchSyncPage(page);
  await sync.goto();
  await sync.waitSynced();
  // Other specs may have taken machines in: the phone holds every open ticket the server has.
  const open = (await serverIds(page.request, "ticket")).length;
  expect(open).toBeGreaterThanOrEqual(7);
  await expect(page.getByText(new RegExp(`${open} tickets on this phone`))).toBeVisible();

  await context.setOffline(true);
  await expect(sync.badge()).toHaveAttribute("data-state", "offline");
  const noteId = await sync.addNote(1001, "Customer says it sat since June.");
  await expect(sync.outboxItems()).toHaveCount(1);
  await expect(sync.outboxItems().first()).toContainText("Ticket #1001");
  await expect(sync.badge()).toContainText("1 waiting");

  await context.setOffline(false); // the `online` event starts a sync
  await sync.waitSynced();
  await expect(sync.outboxItems()).toHaveCount(0);
  expect(await serverNotes(page.request)).toContain(noteId);
});

test("when the session has expired, the change waits; signing in again sends it", async ({ page, context }) => {
  await BenchSyncPage.enableHooks(context);
  await signInAs(page, DEMO.tech2);
  const sync = new BenchSyncPage(page);
  await sync.goto();
  await sync.waitSynced();

  await context.setOffline(true);
  const noteId = await sync.addNote(1003, "Deck dent at the front right.");
  await context.clearCookies(); // the session ends while the phone is offline
  await context.setOffline(false);
  await expect(sync.badge()).toContainText("Sign in again", { timeout: 20_000 });
  await expect(sync.outboxItems()).toHaveCount(1);

  await page.getByRole("link", { name: "Sign in again" }).last().click();
  await new SignInPage(page).signIn(DEMO.tech2);
  await page.waitForURL(/\/bench\/sync$/);
  await sync.waitSynced();
  await expect(sync.outboxItems()).toHaveCount(0);
  expect(await serverNotes(page.request)).toContain(noteId);
});
