/**
 * The sync engine's own thread (a dedicated Web Worker, browser only). A sync round parses and checks every
 * page the server sends and writes it to the device store: done here, that work never holds up a tap or the
 * drawing of a screen. The page's live queries see the writes as usual (Dexie tells every window and worker of
 * the same origin when a write transaction commits). Started and spoken to by lib/sync/scheduler.ts only.
 */
import { getDeviceDb } from "./device-db";
import { syncOnce } from "./engine";
import type { SyncWorkerReply, SyncWorkerRequest } from "./sync-worker-messages";

interface WorkerScope {
  onmessage: ((event: MessageEvent<SyncWorkerRequest>) => void) | null;
  postMessage(message: SyncWorkerReply): void;
}
const scope = self as unknown as WorkerScope;

scope.onmessage = (event) => {
  const request = event.data;
  if (request?.type !== "sync") return;
  const { id } = request;
  void (async () => {
    try {
      const db = await getDeviceDb();
      const result = await syncOnce({ db, fetch: (...a) => fetch(...a), onProgress: (progress) => scope.postMessage({ type: "progress", id, progress }) });
      scope.postMessage({ type: "done", id, result });
    } catch (err) {
      scope.postMessage({ type: "failed", id, message: err instanceof Error ? err.message : String(err) });
    }
  })();
};
scope.postMessage({ type: "ready" });
