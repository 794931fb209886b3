import "server-only";
/** The server side of sync: push, pull, devices, photos, conflicts. */
export { applyPush } from "./push";
export { pullChanges, serverView } from "./pull";
export { unsyncedBenchWork, type UnsyncedWork } from "./devices";
export { storePhoto, readPhoto, readBodyLimited, sniffImage } from "./photos";
export { listConflicts, resolveConflict } from "./conflicts";
export { benchSheetFor } from "./bench-sheet";
export { saveProcedure, type ProcedureInput } from "@/db/procedures";
