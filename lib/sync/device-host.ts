/**
 * The device host: the one place that runs sync rounds and the watched reads (lib/sync/watched.ts) for the
 * screens. It runs in the device worker (lib/sync/device-worker.ts), so parsing a pull, writing it and reading
 * today's list never hold up a tap or the drawing of a screen, and the bench's first screen loads no database
 * code of its own. Where a browser has no worker, the same host runs in the page.
 *
 * Watched reads are sent again after every committed write on the phone, from any window or worker
 * (Dexie's "storagemutated"), and only when their answer changed.
 */
import Dexie from "dexie";
import { getDeviceDb, readDeviceUser, updateSyncState } from "./device-db";
import type { DeviceCall, DeviceReply, DeviceRequest } from "./device-messages";
import { syncOnce } from "./engine";
import { adoptSignedInUser } from "./session";
import { WATCHED, type WatchName } from "./watched";

export interface DeviceHost {
  handle(request: DeviceRequest): void;
  /** Stops watching the store (tests; a worker or page simply ends). */
  stop(): void;
}

export function startDeviceHost(post: (reply: DeviceReply) => void): DeviceHost {
  const last = new Map<WatchName, string>();
  let running = false;
  let again = false;

  async function readWatched() {
    if (running) {
      again = true;
      return;
    }
    running = true;
    try {
      do {
        again = false;
        const db = await getDeviceDb();
        for (const name of last.keys()) {
          const value = await WATCHED[name](db);
          const json = JSON.stringify(value);
          if (json === last.get(name)) continue;
          last.set(name, json);
          post({ type: "value", name, value } as DeviceReply);
        }
      } while (again);
    } catch {
      // The store is unreadable right now (storage cleared, closed under us): the next write or watch tries again.
    } finally {
      running = false;
    }
  }

  const onMutated = () => void readWatched();
  Dexie.on("storagemutated", onMutated);

  async function answer(id: number, call: DeviceCall): Promise<unknown> {
    const db = await getDeviceDb();
    switch (call.type) {
      case "sync":
        return syncOnce({ db, fetch: (...a) => fetch(...a), onProgress: (progress) => post({ type: "progress", id, progress }) });
      case "adopt":
        return adoptSignedInUser(call.user, { db });
      case "session-ended":
        // Keep everything; the badge asks the tech to sign in again.
        if (await readDeviceUser(db)) await updateSyncState(db, { sessionExpired: true });
        return null;
    }
  }

  function handle(request: DeviceRequest) {
    if (request.type === "watch") {
      if (!last.has(request.name)) last.set(request.name, "");
      void readWatched();
      return;
    }
    const { id, call } = request;
    answer(id, call).then(
      (result) => post({ type: "done", id, result }),
      (err: unknown) => post({ type: "failed", id, message: err instanceof Error ? err.message : String(err) }),
    );
  }

  return { handle, stop: () => Dexie.on("storagemutated").unsubscribe(onMutated) };
}
