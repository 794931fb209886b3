/**
 * The device worker (a dedicated Web Worker, browser only): runs the device host (lib/sync/device-host.ts) off
 * the page's main thread. Started by lib/sync/device-client.ts only.
 */
import { startDeviceHost } from "./device-host";
import type { DeviceReply, DeviceRequest } from "./device-messages";

interface WorkerScope {
  onmessage: ((event: MessageEvent<DeviceRequest>) => void) | null;
  postMessage(message: DeviceReply): void;
}
const scope = self as unknown as WorkerScope;

const host = startDeviceHost((reply) => scope.postMessage(reply));
scope.onmessage = (event) => host.handle(event.data);
scope.postMessage({ type: "ready" });
