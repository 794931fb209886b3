import { expect, type Page } from "@playwright/test";

/** The /bench/scan screen. */
export class ScanPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/bench/scan");
    await expect(this.page.getByRole("heading", { name: "Scan tag" })).toBeVisible();
  }

  scanner() {
    return this.page.getByRole("region", { name: "Tag scanner" });
  }

  tagCode() {
    return this.page.getByTestId("tag-code");
  }

  /** "Looking up…" / "Opening ticket #…" while the phone looks for the code. */
  lookup() {
    return this.page.getByTestId("ticket-lookup");
  }

  /** The message for a code this phone does not hold. */
  notOnPhone(code?: string) {
    const box = this.page.getByTestId("not-on-phone");
    return code ? box.filter({ has: this.page.getByRole("heading", { name: `Tag ${code} is not on this phone` }) }) : box;
  }

  /** The server's answer after "Look it up online". */
  onlineAnswer() {
    return this.page.getByTestId("online-answer");
  }

  manualField() {
    return this.page.getByLabel("Or type the tag code");
  }

  async typeCode(code: string) {
    await this.manualField().fill(code);
    await this.page.getByRole("button", { name: "Open" }).click();
  }

  manualError() {
    return this.page.getByRole("form", { name: "Type the tag code" }).getByRole("alert");
  }
}

/**
 * Before any page script: record the camera stream the page gets (so a test can assert the camera really
 * started, and with the clip's size) and the vibration calls.
 */
export const RECORD_CAMERA_AND_VIBRATION = () => {
  const w = window as unknown as {
    __camera?: { calls: number; tracks: { label: string; width?: number; height?: number; state: () => string }[] };
    __vibrations?: unknown[];
  };
  w.__camera = { calls: 0, tracks: [] };
  w.__vibrations = [];
  navigator.vibrate = ((pattern: unknown) => {
    w.__vibrations?.push(pattern);
    return true;
  }) as Navigator["vibrate"];
  const md = navigator.mediaDevices;
  if (!md?.getUserMedia) return;
  const original = md.getUserMedia.bind(md);
  md.getUserMedia = async (constraints?: MediaStreamConstraints) => {
    const cam = w.__camera as NonNullable<typeof w.__camera>;
    cam.calls++;
    const stream = await original(constraints);
    for (const track of stream.getVideoTracks()) {
      const s = track.getSettings();
      cam.tracks.push({ label: track.label, width: s.width, height: s.height, state: () => track.readyState });
    }
    return stream;
  };
};
