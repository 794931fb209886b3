import { expect, type BrowserContext, type Page } from "@playwright/test";

/** /bench/sync and the sync badge, plus the page's test hooks (record, sync) for changes the bench UI makes. */
export class BenchSyncPage {
  constructor(private readonly page: Page) {}

  /** Turn on the page's test hooks for every page of this context (before the first navigation). */
  static async enableHooks(context: BrowserContext) {
    await context.addInitScript(() => localStorage.setItem("benchwright.testHooks", "1"));
  }

  async goto() {
    await this.page.goto("/bench/sync");
    await expect(this.page.getByRole("heading", { name: "Sync", exact: true })).toBeVisible();
    await this.page.waitForFunction(() => Boolean((window as unknown as { __benchwrightSync?: unknown }).__benchwrightSync));
  }

  badge() {
    return this.page.getByTestId("sync-badge");
  }

  outboxItems() {
    return this.page.getByTestId("outbox-item");
  }

  async waitSynced() {
    await expect(this.badge()).toHaveAttribute("data-state", "synced", { timeout: 20_000 });
  }

  /** Records a note on the ticket with this number through the device's record() (as the bench sheet would). */
  async addNote(ticketNumber: number, text: string): Promise<string> {
    return this.page.evaluate(
      async ({ ticketNumber, text }) => {
        type Hooks = {
          getDeviceDb: () => Promise<{ tickets: { where: (k: string) => { equals: (v: number) => { first: () => Promise<{ id: string } | undefined> } } } }>;
          record: (name: string, args: unknown) => Promise<{ id: string }>;
        };
        const hooks = (window as unknown as { __benchwrightSync: Hooks }).__benchwrightSync;
        const db = await hooks.getDeviceDb();
        const ticket = await db.tickets.where("number").equals(ticketNumber).first();
        if (!ticket) throw new Error(`ticket #${ticketNumber} is not on this phone`);
        return (await hooks.record("ticket.note_added", { ticketId: ticket.id, text })).id;
      },
      { ticketNumber, text },
    );
  }
}
