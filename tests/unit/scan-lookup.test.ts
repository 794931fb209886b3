import { describe, expect, expectTypeOf, it } from "vitest";
import type { TagResolution } from "@/lib/counter/tags";
import { explainTagAnswer, NO_NETWORK_TEXT, type TagAnswer } from "@/lib/bench/scan-lookup";

// Invented ids and codes ("HAWBR7H" is the app's own example code). The answers are the shapes of
// GET /api/tags/<code> (lib/counter/tags resolveTag; tests/integration/counter-tags.test.ts checks the route).
const CODE = "HAWBR7H";
const ok = (body: TagAnswer) => ({ status: 200, body });

describe("the scan screen's words for the server's tag answer", () => {
  it("uses the same answer shape as the server (checked by the type checker)", () => {
    expectTypeOf<TagAnswer>().toEqualTypeOf<TagResolution>();
  });

  it("an open ticket not on this phone: offer to sync and open it", () => {
    const o = explainTagAnswer(CODE, ok({ kind: "ticket", ticketId: "t1", number: 1042, status: "on_bench" }));
    expect(o).toMatchObject({ kind: "sync-and-open", ticketId: "t1", title: "Ticket #1042 is at the shop" });
    expect(o.text).toContain("on the bench");
  });

  it("a closed ticket: says it is closed, in words, and offers nothing to open", () => {
    const handed = explainTagAnswer(CODE, ok({ kind: "ticket", ticketId: "t1", number: 1042, status: "handed_back" }));
    expect(handed).toMatchObject({ kind: "nothing-open", title: "Ticket #1042 is closed" });
    expect(handed.text).toContain("HAW-BR7H belongs to ticket #1042, which is handed back");
    const unrepaired = explainTagAnswer(CODE, ok({ kind: "ticket", ticketId: "t1", number: 1042, status: "returned_unrepaired" }));
    expect(unrepaired.text).toContain("returned unrepaired");
  });

  it("a replaced tag: names the new tag; opens the ticket only while it is open", () => {
    const open = explainTagAnswer(CODE, ok({ kind: "replaced", ticketId: "t2", number: 1050, status: "awaiting_parts", currentCode: "KXM4P9D" }));
    expect(open).toMatchObject({ kind: "sync-and-open", ticketId: "t2", title: "Tag HAW-BR7H was replaced" });
    expect(open.text).toContain("Ticket #1050 now carries tag KXM-4P9D");
    const old = explainTagAnswer(CODE, ok({ kind: "replaced", ticketId: "t2", number: 1050, status: "handed_back", currentCode: "KXM4P9D" }));
    expect(old).toMatchObject({ kind: "nothing-open", title: "Tag HAW-BR7H is an old tag" });
    expect(old.text).toContain("KXM-4P9D on ticket #1050, which is now handed back");
  });

  it("a machine sticker: its open ticket, or that it has none", () => {
    expect(explainTagAnswer(CODE, ok({ kind: "sticker", machineId: "m1", openTicketId: "t3" }))).toMatchObject({ kind: "sync-and-open", ticketId: "t3" });
    const none = explainTagAnswer(CODE, ok({ kind: "sticker", machineId: "m1" }));
    expect(none).toMatchObject({ kind: "nothing-open", title: "This machine has no open ticket" });
    expect(none.text).toContain("HAW-BR7H is the machine's permanent sticker");
  });

  it("unknown at the shop (404), signed out (401), refused (400), no answer at all", () => {
    expect(explainTagAnswer(CODE, { status: 404, body: { error: { code: "not_found", message: "x" } } })).toMatchObject({
      kind: "nothing-open",
      title: "The shop does not know tag HAW-BR7H",
    });
    expect(explainTagAnswer(CODE, { status: 401, body: null }).kind).toBe("sign-in");
    const refused = explainTagAnswer(CODE, { status: 400, body: { error: { code: "validation", message: "This tag code does not check out." } } });
    expect(refused).toMatchObject({ kind: "failed" });
    expect(refused.text).toContain("This tag code does not check out.");
    expect(explainTagAnswer(CODE, { status: 500, body: "<html>" })).toMatchObject({ kind: "failed", text: "Try again in a moment, or ask the counter." });
    expect(explainTagAnswer(CODE, null)).toMatchObject({ kind: "failed", text: NO_NETWORK_TEXT });
  });

  it("an answer of a kind it does not know is not taken for a ticket", () => {
    expect(explainTagAnswer(CODE, { status: 200, body: { kind: "pallet" } }).kind).toBe("failed");
  });
});
