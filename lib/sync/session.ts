/**
 * Who the device works for. The bench remembers the person who signed in (so it opens offline and
 * every change carries their name); a different person on the same phone gets a fresh store — but
 * only once the previous person's changes have gone out, so two people's work is never mixed.
 */
import { INITIAL_SYNC_STATE, PULLED_TABLES, getDeviceDb, readDeviceUser, readSyncState, updateSyncState, writeMeta, type DeviceDb, type DeviceUser } from "./device-db";
import { uuid } from "./ids";

export interface SignedInUser {
  id: string;
  name: string;
  email: string;
  role: string;
}

export type AdoptResult =
  | { status: "adopted" | "same"; user: DeviceUser }
  /** Someone else's changes are still on this phone: nothing was changed. */
  | { status: "blocked"; previous: DeviceUser; waiting: number; needsAttention: number };

/** Call with the server's answer to "who is signed in" (GET /api/me) whenever the bench sees it. */
export async function adoptSignedInUser(user: SignedInUser, options: { db?: DeviceDb; now?: Date } = {}): Promise<AdoptResult> {
  const db = options.db ?? (await getDeviceDb());
  const at = (options.now ?? new Date()).toISOString();
  return db.transaction("rw", db.tables, async (): Promise<AdoptResult> => {
    const previous = await readDeviceUser(db);
    if (previous && previous.id === user.id) {
      const next: DeviceUser = { ...previous, name: user.name, email: user.email, role: user.role };
      await writeMeta(db, "user", next);
      await updateSyncState(db, { sessionExpired: false, signedOut: false, otherSignedIn: null, ...clearSessionError(await readSyncState(db)) });
      return { status: "same", user: next };
    }
    if (previous) {
      const waiting = await db.outbox.count();
      const needsAttention = await db.attention.count();
      if (waiting + needsAttention > 0) {
        await updateSyncState(db, { otherSignedIn: { id: user.id, name: user.name } });
        return { status: "blocked", previous, waiting, needsAttention };
      }
      // A new person: a fresh store and a new device id (the server binds a device to one person).
      for (const t of PULLED_TABLES) await db.table(t).clear();
      await db.photoBlobs.clear();
      await writeMeta(db, "sync", INITIAL_SYNC_STATE);
    }
    await writeMeta(db, "device", { deviceId: uuid(), nextSeq: 1 });
    const next: DeviceUser = { id: user.id, name: user.name, email: user.email, role: user.role, signedInAt: at };
    await writeMeta(db, "user", next);
    await updateSyncState(db, { sessionExpired: false, signedOut: false });
    return { status: "adopted", user: next };
  });
}

function clearSessionError(state: { lastError: { code: string } | null }) {
  return state.lastError && (state.lastError.code === "session_expired" || state.lastError.code === "not_signed_in") ? { lastError: null } : {};
}

/** The person this phone works for, or null. */
export async function currentDeviceUser(db?: DeviceDb): Promise<DeviceUser | null> {
  return readDeviceUser(db ?? (await getDeviceDb()));
}

/** After signing out: the person is remembered (their waiting changes stay theirs); recording stops. */
export async function markSignedOut(db?: DeviceDb): Promise<void> {
  await updateSyncState(db ?? (await getDeviceDb()), { signedOut: true });
}

/**
 * Start the copy of the shop over (the next sync fetches the working set from scratch). The outbox,
 * refused changes and photo bytes stay. For support, e.g. after the server was restored from a backup.
 */
export async function refetchEverything(db?: DeviceDb): Promise<void> {
  await updateSyncState(db ?? (await getDeviceDb()), { cursor: 0, snapshot: null });
}
