/**
 * The page's side of the device host (browser only): starts the device worker on first use, or the same host in
 * the page where a worker cannot start; calls it (`deviceCall`) and keeps the latest value of each watched read
 * for `useSyncExternalStore` (`subscribeWatched` / `watchedValue`). Nothing here imports the database code:
 * the bench's first screen draws from what the host sends.
 */
import type { DeviceCall, DeviceCallResult, DeviceReply, DeviceRequest } from "./device-messages";
import type { SyncProgress } from "./engine";
import type { WatchName, WatchValue } from "./watched";

type Send = (request: DeviceRequest) => void;
type Pending = { resolve: (value: unknown) => void; reject: (err: Error) => void; onProgress?: (p: SyncProgress) => void; call: DeviceCall };

const values = new Map<WatchName, unknown>();
const listeners = new Map<WatchName, Set<() => void>>();
const calls = new Map<number, Pending>();
let nextId = 1;
let host: Promise<Send> | null = null;

function onReply(reply: DeviceReply) {
  switch (reply.type) {
    case "ready":
      return;
    case "value":
      values.set(reply.name, reply.value);
      for (const l of listeners.get(reply.name) ?? []) l();
      return;
    case "progress":
      calls.get(reply.id)?.onProgress?.(reply.progress);
      return;
    case "done":
    case "failed": {
      const pending = calls.get(reply.id);
      if (!pending) return;
      calls.delete(reply.id);
      if (reply.type === "done") pending.resolve(reply.result);
      else pending.reject(new Error(`device host: ${reply.message}`));
    }
  }
}

async function inPage(): Promise<Send> {
  const { startDeviceHost } = await import("./device-host");
  const host = startDeviceHost(onReply);
  return (request) => host.handle(request);
}

/** The worker once it said "ready"; the in-page host if it cannot start. */
function startWorker(): Promise<Send> {
  return new Promise<Send>((resolve) => {
    let w: Worker;
    try {
      // localStorage "benchwright.deviceInPage" = "1" keeps the host in the page (for comparisons in benchmarks).
      if (typeof Worker === "undefined" || localStorage.getItem("benchwright.deviceInPage") === "1") throw new Error("no worker");
      w = new Worker(new URL("./device-worker.ts", import.meta.url), { name: "benchwright-device" });
    } catch {
      resolve(inPage());
      return;
    }
    let ready = false;
    w.onmessage = (event: MessageEvent<DeviceReply>) => {
      if (!ready && event.data.type === "ready") {
        ready = true;
        resolve((request) => w.postMessage(request));
      }
      onReply(event.data);
    };
    w.onerror = (event) => {
      // The worker's script did not load, or the host in it failed: carry on with the host in the page.
      event.preventDefault();
      w.terminate();
      if (!ready) return resolve(inPage());
      host = inPage();
      void host.then((send) => {
        for (const name of listeners.keys()) send({ type: "watch", name });
        for (const [id, pending] of calls) send({ type: "call", id, call: pending.call });
      });
    };
  });
}

function connect(): Promise<Send> {
  host ??= startWorker();
  return host;
}

/** One call to the device host. */
export async function deviceCall<C extends DeviceCall>(call: C, onProgress?: (p: SyncProgress) => void): Promise<DeviceCallResult<C>> {
  const send = await connect();
  const id = nextId++;
  return new Promise((resolve, reject) => {
    calls.set(id, { resolve: resolve as (v: unknown) => void, reject, onProgress, call });
    send({ type: "call", id, call });
  });
}

export function subscribeWatched(name: WatchName, listener: () => void): () => void {
  let set = listeners.get(name);
  if (!set) {
    set = new Set();
    listeners.set(name, set);
    void connect().then((send) => send({ type: "watch", name }));
  }
  set.add(listener);
  return () => set.delete(listener);
}

/** The latest value of a watched read; undefined until the host has sent one. */
export function watchedValue<N extends WatchName>(name: N): WatchValue<N> | undefined {
  return values.get(name) as WatchValue<N> | undefined;
}
