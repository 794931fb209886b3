/**
 * What a screen and the device host (lib/sync/device-host.ts, in the device worker or, where there is no worker,
 * in the page) say to each other. Types only.
 */
import type { SyncProgress, SyncResult } from "./engine";
import type { AdoptResult, SignedInUser } from "./session";
import type { WatchName, WatchValue } from "./watched";

/** A call that answers once: a sync round, "this person signed in", "the session ended". */
export type DeviceCall = { type: "sync" } | { type: "adopt"; user: SignedInUser } | { type: "session-ended" };
export type DeviceCallResult<C extends DeviceCall> = C extends { type: "sync" }
  ? SyncResult
  : C extends { type: "adopt" }
    ? AdoptResult
    : null;

export type DeviceRequest =
  | { type: "call"; id: number; call: DeviceCall }
  /** Send this read's value now and again whenever the device store changes it. */
  | { type: "watch"; name: WatchName };

export type DeviceReply =
  | { type: "ready" }
  | { type: "progress"; id: number; progress: SyncProgress }
  | { type: "done"; id: number; result: unknown }
  /** Something unexpected (a bug, not the network: a sync round answers those itself). */
  | { type: "failed"; id: number; message: string }
  | { [N in WatchName]: { type: "value"; name: N; value: WatchValue<N> } }[WatchName];
