import { describe, expect, it } from "vitest";
import { decideUpdate, holdsOn, updateWarning, type UpdateSituation } from "@/lib/pwa/update-policy";

// The rule under test is our own (issue 7: "an update never discards unsynced work and never breaks a half-filled
// bench sheet"). The lifecycle it sits on is the W3C Service Workers spec [read]: an installed worker stays
// "waiting" while an older one controls clients, until it calls skipWaiting(); ours calls it only on SKIP_WAITING.

const base: UpdateSituation = { waiting: true, pendingChanges: 0, editing: false, requested: false, confirmed: false };

describe("decideUpdate", () => {
  it("does nothing without a waiting version", () => {
    expect(decideUpdate({ ...base, waiting: false })).toEqual({ action: "none" });
    expect(decideUpdate({ ...base, waiting: false, requested: true, confirmed: true })).toEqual({ action: "none" });
  });

  it("applies by itself when the outbox is empty and nothing is being typed", () => {
    expect(decideUpdate(base)).toEqual({ action: "apply" });
  });

  it("waits while the outbox holds changes, and while something is typed", () => {
    expect(decideUpdate({ ...base, pendingChanges: 1 })).toEqual({ action: "wait", reasons: ["unsynced-changes"] });
    expect(decideUpdate({ ...base, editing: true })).toEqual({ action: "wait", reasons: ["editing"] });
    expect(decideUpdate({ ...base, pendingChanges: 3, editing: true })).toEqual({
      action: "wait",
      reasons: ["unsynced-changes", "editing"],
    });
  });

  it("waits when the device store cannot be read (unknown is not empty)", () => {
    expect(decideUpdate({ ...base, pendingChanges: null })).toEqual({ action: "wait", reasons: ["store-unreadable"] });
  });

  it("asks first when the tech taps update with work held, and applies only after the confirmation", () => {
    expect(decideUpdate({ ...base, pendingChanges: 2, requested: true })).toEqual({
      action: "confirm",
      reasons: ["unsynced-changes"],
    });
    expect(decideUpdate({ ...base, pendingChanges: 2, requested: true, confirmed: true })).toEqual({ action: "apply" });
    // A confirmation without the tap (a stale flag) does not apply anything.
    expect(decideUpdate({ ...base, pendingChanges: 2, confirmed: true })).toEqual({ action: "wait", reasons: ["unsynced-changes"] });
  });

  it("applies a tapped update at once when nothing is held", () => {
    expect(decideUpdate({ ...base, requested: true })).toEqual({ action: "apply" });
  });

  it("never applies by itself while anything holds it (every combination)", () => {
    for (const pendingChanges of [null, 0, 1, 40]) {
      for (const editing of [false, true]) {
        const d = decideUpdate({ ...base, pendingChanges, editing });
        const held = pendingChanges !== 0 || editing;
        expect(d.action).toBe(held ? "wait" : "apply");
        expect(holdsOn({ pendingChanges, editing }).length > 0).toBe(held);
      }
    }
  });
});

describe("updateWarning", () => {
  it("says how many changes have not reached the shop, and that typing is lost", () => {
    expect(updateWarning(["unsynced-changes"], 1)[0]).toMatch(/^1 change on this phone has not reached the shop yet/);
    expect(updateWarning(["unsynced-changes"], 5)[0]).toMatch(/^5 changes on this phone have not reached the shop yet/);
    const both = updateWarning(["unsynced-changes", "editing"], 2);
    expect(both).toHaveLength(2);
    expect(both[1]).toMatch(/typed on this screen and not saved yet will be lost/);
    expect(updateWarning(["store-unreadable"], null)[0]).toMatch(/could not be checked/);
  });
});
