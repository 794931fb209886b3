/** Persistent storage for the device store (browser only). */

const ASKED_KEY = "benchwright.persistAsked";

export interface StorageStatus {
  supported: boolean;
  persisted: boolean | null;
  usageBytes: number | null;
  quotaBytes: number | null;
}

/**
 * Asks the browser to keep this app's data even when the phone runs low on space. Asked once, the first time the
 * bench sees a signed-in user; later calls only report. Returns whether storage is persistent (null: not offered).
 */
export async function askPersistentStorageOnce(): Promise<boolean | null> {
  const storage = typeof navigator !== "undefined" ? navigator.storage : undefined;
  if (!storage?.persist || !storage.persisted) return null;
  if (await storage.persisted()) return true;
  if (localStorage.getItem(ASKED_KEY)) return false;
  localStorage.setItem(ASKED_KEY, new Date().toISOString());
  return storage.persist();
}

/** Asked again from the device page, when the tech taps the button. */
export async function askPersistentStorage(): Promise<boolean | null> {
  const storage = navigator.storage;
  if (!storage?.persist) return null;
  localStorage.setItem(ASKED_KEY, new Date().toISOString());
  return storage.persist();
}

export async function storageStatus(): Promise<StorageStatus> {
  const storage = typeof navigator !== "undefined" ? navigator.storage : undefined;
  if (!storage) return { supported: false, persisted: null, usageBytes: null, quotaBytes: null };
  const [persisted, estimate] = await Promise.all([
    storage.persisted ? storage.persisted() : Promise.resolve(null),
    storage.estimate ? storage.estimate() : Promise.resolve(null),
  ]);
  return {
    supported: true,
    persisted,
    usageBytes: estimate?.usage ?? null,
    quotaBytes: estimate?.quota ?? null,
  };
}
