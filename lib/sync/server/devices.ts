import "server-only";
import type { Db } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/guard";
import { AppError } from "@/lib/http/errors";
import type { PendingReport } from "../protocol";
import { stmt } from "./store";

export interface DeviceRow {
  id: string;
  userId: string;
  lastSeq: number;
}

/**
 * The device, bound to the user on first contact. A device bound to someone else is refused: one
 * person's unsynced work never goes out under another person's name.
 */
export function bindDevice(db: Db, deviceId: string, user: CurrentUser, userAgent = ""): DeviceRow {
  const row = stmt(db, "SELECT id, user_id, last_seq FROM devices WHERE id = ?").get(deviceId) as
    | { id: string; user_id: string; last_seq: number }
    | undefined;
  if (row) {
    if (row.user_id !== user.id) {
      throw new AppError("forbidden", "This phone's store belongs to another person. Sign in as that person to send their changes.");
    }
    return { id: row.id, userId: row.user_id, lastSeq: row.last_seq };
  }
  stmt(db, "INSERT INTO devices (id, user_id, user_agent) VALUES (?, ?, ?)").run(deviceId, user.id, userAgent.slice(0, 300));
  return { id: deviceId, userId: user.id, lastSeq: 0 };
}

/** Keeps what the device says it still holds (outbox size and tickets with unsynced changes). */
export function storeReport(db: Db, deviceId: string, report: PendingReport): void {
  const now = Date.now();
  stmt(db, "UPDATE devices SET pending_count = ?, pending_tickets = ?, reported_at = ?, last_seen_at = ? WHERE id = ?").run(
    report.count,
    JSON.stringify(report.count ? report.tickets : []),
    now,
    now,
    deviceId,
  );
}

export interface UnsyncedWork {
  /** Changes waiting on devices for this ticket. */
  changes: number;
  /** Who holds them (the device's person; several names joined when more than one device). */
  deviceUser: string;
  /** When a device last said so. */
  reportedAt: Date;
}

/**
 * Tickets with bench work still waiting on a device, as the devices last reported it (for the counter's
 * queue board: "bench work not synced yet").
 */
export function unsyncedBenchWork(db: Db): Map<string, UnsyncedWork> {
  const rows = stmt(
    db,
    `SELECT d.pending_tickets AS tickets, d.reported_at AS reported_at, u.name AS name
       FROM devices d JOIN users u ON u.id = d.user_id
      WHERE d.pending_count > 0 ORDER BY d.reported_at`,
  ).all() as Array<{ tickets: string; reported_at: number | null; name: string }>;
  const out = new Map<string, UnsyncedWork>();
  for (const r of rows) {
    const reportedAt = new Date(r.reported_at ?? 0);
    for (const t of JSON.parse(r.tickets) as PendingReport["tickets"]) {
      const prev = out.get(t.ticketId);
      if (!prev) out.set(t.ticketId, { changes: t.changes, deviceUser: r.name, reportedAt });
      else {
        out.set(t.ticketId, {
          changes: prev.changes + t.changes,
          deviceUser: prev.deviceUser.split(", ").includes(r.name) ? prev.deviceUser : `${prev.deviceUser}, ${r.name}`,
          reportedAt: reportedAt > prev.reportedAt ? reportedAt : prev.reportedAt,
        });
      }
    }
  }
  return out;
}
