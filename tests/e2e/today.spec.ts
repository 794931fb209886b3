/**
 * Today's work on the phone (390×844): the list the tech's phone pulled, searched, still there offline, and a tag
 * typed on the scan screen opening its ticket. Counts come from the server (what a fresh device of the same person
 * pulls), never fixed numbers: other specs may have taken machines in.
 */
import { randomUUID } from "node:crypto";
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { DEMO, signInAs } from "./pages/sign-in";
import { BenchSyncPage } from "./pages/bench-sync";
import { ScanPage } from "./pages/scan";
import { goOffline, waitForServiceWorker } from "./pages/pwa";
import { formatTagCode, generateTagCode } from "../../lib/trade/tag-code";

const SHOTS = process.env.SCREENSHOTS ? "tests/.tmp/screens" : null;

interface ServerTicket {
  id: string;
  number: number;
  tagCode: string;
  assignedTechId: string | null;
  customerId: string;
}

/** The open tickets a fresh device of the signed-in person would pull, and who that person is. */
async function serverTickets(request: APIRequestContext): Promise<{ me: string; tickets: ServerTicket[]; lastNames: Map<string, string> }> {
  const me = ((await (await request.get("/api/me")).json()) as { user: { id: string } }).user.id;
  const res = await request.get(`/api/sync/pull?v=1&deviceId=${randomUUID()}&cursor=0&limit=2000`);
  expect(res.status()).toBe(200);
  const body = (await res.json()) as { changes: Array<{ entity: string; op: string; row?: Record<string, unknown> }>; more?: boolean };
  const rows = (entity: string) => body.changes.filter((c) => c.entity === entity && c.op === "upsert").map((c) => c.row!);
  const lastNames = new Map(rows("customer").map((c) => [String(c.id), String(c.lastName)]));
  return { me, tickets: rows("ticket") as unknown as ServerTicket[], lastNames };
}

const cards = (page: Page) => page.getByTestId("today-card");
const group = (page: Page, name: string) => page.getByRole("region", { name: new RegExp(`^${name}`) });
const numbersShown = async (page: Page) => (await cards(page).evaluateAll((els) => els.map((e) => Number(e.getAttribute("data-ticket-number"))))).sort((a, b) => a - b);

/** Edits the device store through the page's test hooks: drop one ticket, or make the next sync pull everything. */
async function deviceStore(page: Page, action: "drop-ticket" | "pull-everything", ticketId?: string) {
  await page.evaluate(
    async ({ action, ticketId }) => {
      type Table = { delete: (k: string) => Promise<void>; get: (k: string) => Promise<{ value: Record<string, unknown> } | undefined>; put: (r: unknown) => Promise<unknown> };
      const hooks = (window as unknown as { __benchwrightSync: { getDeviceDb: () => Promise<{ tickets: Table; meta: Table }> } }).__benchwrightSync;
      const db = await hooks.getDeviceDb();
      if (action === "drop-ticket") await db.tickets.delete(ticketId!);
      else await db.meta.put({ key: "sync", value: { ...((await db.meta.get("sync"))?.value ?? {}), cursor: 0, snapshot: null } });
    },
    { action, ticketId },
  );
}

/** No camera: the scan screen goes straight to typing (the camera paths are scan-tag.spec / scan-fallback.spec). */
const noCamera = () => {
  navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException("no camera in this test", "NotFoundError"));
};

test.describe.configure({ timeout: 90_000 });

test("the tech's list: pulled, grouped, searched, kept offline, and a typed tag opens its ticket", async ({ page, context }) => {
  await BenchSyncPage.enableHooks(context);
  await context.addInitScript(noCamera);
  await signInAs(page, DEMO.tech);
  await page.goto("/bench");
  await waitForServiceWorker(page);
  const sync = new BenchSyncPage(page);
  await sync.waitSynced();

  const { me, tickets, lastNames } = await serverTickets(page.request);
  expect(tickets.length).toBeGreaterThan(0);
  const mine = tickets.filter((t) => t.assignedTechId === me);
  const others = tickets.filter((t) => t.assignedTechId !== me);
  expect(mine.length).toBeGreaterThan(0); // the demo shop gives the tech some work
  expect(others.length).toBeGreaterThan(0);

  // Every open ticket the server has is on the list, the tech's own under "Assigned to you".
  await expect(cards(page)).toHaveCount(tickets.length);
  expect(await numbersShown(page)).toEqual(tickets.map((t) => t.number).sort((a, b) => a - b));
  await expect(group(page, "Assigned to you").getByTestId("today-card")).toHaveCount(mine.length);
  await expect(group(page, "Open tickets").getByTestId("today-card")).toHaveCount(others.length);
  const first = mine[0]!;
  const firstCard = cards(page).filter({ hasText: `#${first.number}` });
  await expect(firstCard).toContainText(formatTagCode(first.tagCode));
  await expect(firstCard).toContainText(lastNames.get(first.customerId)!);
  // The whole card is one link to the ticket, at least a fingertip high.
  await expect(firstCard).toHaveAttribute("href", `/bench/ticket?id=${first.id}`);
  expect((await firstCard.boundingBox())!.height).toBeGreaterThanOrEqual(56);
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/today-list.png`, fullPage: true });

  // Search: a tag code typed loosely finds exactly its ticket; nonsense finds nothing and can be cleared.
  const search = page.getByRole("searchbox", { name: "Search today's work" });
  const other = others[0]!;
  await search.fill(`${other.tagCode.slice(0, 3).toLowerCase()} ${other.tagCode.slice(3).toLowerCase()}`);
  expect(await numbersShown(page)).toEqual([other.number]);
  await search.fill(`#${first.number}`);
  expect(await numbersShown(page)).toEqual([first.number]);
  await search.fill("qqqq nothing like this");
  await expect(cards(page)).toHaveCount(0);
  await expect(page.getByText("Nothing matches the search")).toBeVisible();
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/today-no-match.png` });
  await page.getByRole("button", { name: "Clear search" }).click();
  await expect(search).toHaveValue("");
  await expect(cards(page)).toHaveCount(tickets.length);

  // Offline: a change recorded on the phone marks its card; after a reload the list is all still there.
  await goOffline(context, page);
  await expect(sync.badge()).toHaveAttribute("data-state", "offline");
  await page.waitForFunction(() => Boolean((window as unknown as { __benchwrightSync?: unknown }).__benchwrightSync));
  await sync.addNote(first.number, "Bar nose sprocket dry.");
  await expect(firstCard.getByTestId("not-synced")).toHaveText("1 change not synced");
  await page.reload();
  await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
  await expect(cards(page)).toHaveCount(tickets.length);
  await expect(firstCard.getByTestId("not-synced")).toHaveText("1 change not synced");
  await expect(cards(page).getByTestId("not-synced")).toHaveCount(1);
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/today-offline.png`, fullPage: true });

  // A code this phone does not hold, offline: says so, and that there is no network.
  await page.getByRole("link", { name: "Scan tag" }).last().click();
  const scan = new ScanPage(page);
  await expect(page.getByRole("heading", { name: "Scan tag" })).toBeVisible();
  const unknown = generateTagCode();
  await scan.typeCode(unknown);
  await expect(scan.notOnPhone(formatTagCode(unknown))).toBeVisible();
  await expect(scan.notOnPhone()).toContainText("No network: sync when you are back online, or ask the counter.");
  await expect(page.getByRole("button", { name: "Look it up online" })).toHaveCount(0);
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/scan-not-on-phone-offline.png`, fullPage: true });

  // A demo ticket's tag typed in (any case, with the printed dash) opens that ticket, still offline.
  await page.getByRole("button", { name: "Scan another tag" }).click();
  await scan.typeCode(formatTagCode(other.tagCode).toLowerCase());
  await page.waitForURL((url) => url.pathname === "/bench/ticket" && url.searchParams.get("id") === other.id);
});

test("a tag unknown on the phone is looked up online and explained; a ticket only the server has is synced and opened", async ({ page, context }) => {
  await BenchSyncPage.enableHooks(context);
  await context.addInitScript(noCamera);
  await signInAs(page, DEMO.tech2);
  await page.goto("/bench"); // the bench takes the person in and syncs
  const sync = new BenchSyncPage(page);
  await sync.waitSynced();
  const scan = new ScanPage(page);
  await scan.goto();
  await sync.waitSynced(); // the sync on app start is over: nothing else pulls during this test
  await page.waitForFunction(() => Boolean((window as unknown as { __benchwrightSync?: unknown }).__benchwrightSync));

  // Nobody carries this code: the server says so in words.
  const unknown = generateTagCode();
  await scan.typeCode(unknown);
  await expect(scan.notOnPhone(formatTagCode(unknown))).toBeVisible();
  await page.getByRole("button", { name: "Look it up online" }).click();
  await expect(scan.onlineAnswer()).toContainText(`The shop does not know tag ${formatTagCode(unknown)}`);
  await expect(page.getByRole("button", { name: "Sync now and open" })).toHaveCount(0);
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/scan-not-on-phone-online.png`, fullPage: true });

  // A ticket the server has but this phone does not (its row removed from the device store, as if it had come in
  // after the last sync): the server names it, and "Sync now and open" brings it back and opens it.
  const { tickets } = await serverTickets(page.request);
  const target = tickets[0]!;
  await deviceStore(page, "drop-ticket", target.id);
  await page.getByRole("button", { name: "Scan another tag" }).click();
  await scan.typeCode(target.tagCode);
  await expect(scan.notOnPhone(formatTagCode(target.tagCode))).toBeVisible();
  await page.getByRole("button", { name: "Look it up online" }).click();
  await expect(scan.onlineAnswer()).toContainText(`Ticket #${target.number} is at the shop`);
  // The removed row only comes back with a full pull (as the Sync page's "Fetch everything again" starts).
  await deviceStore(page, "pull-everything");
  await page.getByRole("button", { name: "Sync now and open" }).click();
  await page.waitForURL((url) => url.pathname === "/bench/ticket" && url.searchParams.get("id") === target.id, { timeout: 20_000 });
});
