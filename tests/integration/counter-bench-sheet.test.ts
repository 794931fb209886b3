import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/auth/auth", () => import("./helpers/auth-session"));

import { closeDb, getDb, type Db } from "@/db/client";
import { ensureBuiltInProcedures } from "@/db/procedures";
import { counterBenchSheet } from "@/lib/counter/bench-sheet";
import { CHAIN_SAW } from "@/lib/procedures/built-in/chain-saw";
import { resolveConflict } from "@/lib/sync/server";
import { tempDb } from "./helpers/db";
import { AT, COUNTER, T, TECH, batch, mutation, push, seedShop, uid } from "./helpers/sync-server";

let ctx: ReturnType<typeof tempDb>;
let db: Db;
beforeEach(async () => {
  ctx = tempDb();
  closeDb();
  db = getDb();
  await seedShop(db);
  ensureBuiltInProcedures(db);
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

const step = (stepId: string, value: unknown) => ({
  id: uid(), ticketId: T(1), procedureId: CHAIN_SAW.id, procedureVersion: CHAIN_SAW.version, stepId, value, at: AT,
});

describe("the counter's view of what the bench synced", () => {
  it("shows the answers in words, findings, tune positions, labor and notes from a pushed batch", async () => {
    const findingId = uid();
    const laborId = uid();
    const res = await push(TECH, batch(uid(), [
      mutation(1, "bench.entry.recorded", step("pull-over-feel", { kind: "choice", selected: ["weak"] })),
      mutation(2, "bench.entry.recorded", step("compression-gauge", { kind: "reading", value: 85, unit: "psi" })),
      mutation(3, "finding.added", { id: findingId, ticketId: T(1), grade: "cause", title: "Scored piston", note: "Rings stuck", photoIds: [], suggestedParts: [{ description: "Piston kit", qty: 1 }], suggestedLaborMinutes: 90, at: AT }),
      mutation(4, "tune.recorded", { id: uid(), ticketId: T(1), screw: "low", kind: "baseline", baselineKind: "seated-then-out", eighths: 10, at: AT }),
      mutation(5, "tune.recorded", { id: uid(), ticketId: T(1), screw: "low", kind: "turn", direction: "ccw", eighths: 2, at: AT }),
      mutation(6, "labor.started", { id: laborId, ticketId: T(1), startedAt: "2026-05-04T14:00:00.000Z" }),
      mutation(7, "labor.stopped", { id: laborId, endedAt: "2026-05-04T14:42:00.000Z" }),
      mutation(8, "ticket.note_added", { id: uid(), ticketId: T(1), text: "Customer says it sat since June.", at: AT }),
    ]));
    expect(res.body.results.map((r: { status: string; reason?: unknown }) => r.reason ?? r.status)).toEqual(Array(8).fill("applied"));

    const { view, conflicts } = counterBenchSheet(db, T(1));
    expect(conflicts).toEqual([]);
    expect(view.procedureTitle).toBe(CHAIN_SAW.title);
    expect(view.entries.map((e) => [e.title, e.answer])).toEqual([
      ["Pull-over compression feel", "Weak"],
      // [common practice, no single source] the soft default band is 100–150 psi
      [expect.stringMatching(/compression/i), "85 psi (low)"],
    ]);
    expect(view.findings).toMatchObject([{ id: findingId, grade: "cause", title: "Scored piston", byName: "Tomas Brevik" }]);
    expect(view.tune).toEqual([{ screw: "low", label: "Low-speed mixture screw", position: "1 ½ turns out from seated" }]);
    expect(view.laborMinutes).toBe(42);
    expect(view.notes.map((n) => n.text)).toEqual(["Customer says it sat since June."]);
  });

  it("lists a status the bench set from an old version as a conflict the counter decides", async () => {
    // The counter moves the ticket first (version 1 → 2) …
    db.$client.prepare("UPDATE tickets SET status = 'awaiting_parts' WHERE id = ?").run(T(1));
    // … then a phone that still had version 1 moves it too.
    const res = await push(TECH, batch(uid(), [mutation(1, "ticket.status_changed", { ticketId: T(1), status: "in_repair", baseVersion: 1, at: AT })]));
    expect(res.body.results[0].status).toBe("rejected");
    const { conflicts } = counterBenchSheet(db, T(1));
    expect(conflicts).toMatchObject([{ field: "status", deviceValue: "in_repair", serverValue: "awaiting_parts", userName: "Tomas Brevik" }]);
    resolveConflict(db, { conflictId: conflicts[0]!.id, userId: COUNTER.id, resolution: "used_device" });
    expect(counterBenchSheet(db, T(1)).conflicts).toEqual([]);
    expect(db.$client.prepare("SELECT status FROM tickets WHERE id = ?").get(T(1))).toEqual({ status: "in_repair" });
  });
});
