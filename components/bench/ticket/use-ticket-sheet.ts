"use client";

import { useMemo } from "react";
import { useLiveQuery } from "dexie-react-hooks";
import { deviceDb, readDeviceUser, type DeviceUser } from "@/lib/sync/device-db";
import {
  benchEntriesFor,
  findingsFor,
  laborFor,
  notesFor,
  photosFor,
  ticketById,
  tuneEntriesFor,
  waitingRowIds,
  type BenchSheetEntries,
  type PhotoWithBlob,
  type TicketCard,
} from "@/lib/sync/read";
import type { FindingRow, LaborEntryRow, ProcedureRow, TicketNoteRow, TuneEntryRow } from "@/lib/sync/protocol";
import { parseProcedures, sheetProcedure, sheetState, tuneLog, type SheetState, type TuneLog } from "@/lib/bench/sheet";

export interface TicketSheetData {
  card: TicketCard;
  user: DeviceUser | null;
  entries: BenchSheetEntries;
  findings: FindingRow[];
  tune: TuneEntryRow[];
  tuneLog: TuneLog;
  photos: PhotoWithBlob[];
  labor: LaborEntryRow[];
  notes: TicketNoteRow[];
  sheet: SheetState;
  /** Ids of rows with changes not yet on the server. */
  waiting: Set<string>;
}

type Loaded = Omit<TicketSheetData, "sheet" | "tuneLog"> & { procedures: ProcedureRow[] };

/** One ticket's whole bench sheet from the device store, live: it re-renders on every recorded change and every sync. */
export function useTicketSheet(ticketId: string | null): TicketSheetData | null | undefined {
  const loaded = useLiveQuery(async (): Promise<Loaded | null> => {
    if (!ticketId) return null;
    const db = deviceDb();
    const card = await ticketById(ticketId, db);
    if (!card) return null;
    const [user, entries, findings, tune, photos, labor, notes, procedures, waiting] = await Promise.all([
      readDeviceUser(db),
      benchEntriesFor(ticketId, db),
      findingsFor(ticketId, db),
      tuneEntriesFor(ticketId, db),
      photosFor(ticketId, db),
      laborFor(ticketId, db),
      notesFor(ticketId, db),
      db.procedures.toArray(),
      waitingRowIds(db),
    ]);
    return { card, user, entries, findings, tune, photos, labor, notes, procedures, waiting };
  }, [ticketId]);

  return useMemo(() => {
    if (loaded === undefined) return undefined;
    if (loaded === null) return null;
    const { procedures, ...rest } = loaded;
    const procedure = sheetProcedure(loaded.card.machine, loaded.entries.history, parseProcedures(procedures));
    const sheet = sheetState(procedure, { benchEntries: loaded.entries.history, tuneEntries: loaded.tune, photos: loaded.photos }, loaded.card.machine?.kind);
    return { ...rest, sheet, tuneLog: tuneLog(loaded.tune) };
  }, [loaded]);
}
