/**
 * Today's work on the bench: searching the list, splitting it into the tech's own tickets and the rest, and
 * the promised date in words. Pure TypeScript, no framework: the screen (components/bench/bench-home.tsx)
 * feeds it the cards lib/sync/read `ticketsForToday()` reads from the device store.
 *
 * Search rules:
 * - case, accents and extra spaces do not matter; every word typed must match somewhere on the card
 *   (ticket number, make, model, machine kind, customer's first or last name, complaint);
 * - a ticket number may be typed with or without "#" ("#1042", "1042"); with "#" it must start the number;
 * - a tag code may be typed as printed or with any spacing, dashes or case ("HAW-BR7H", "haw br7h", "br7h"):
 *   the whole query with spaces and dashes dropped, or any one word, is looked for inside the tag code once it
 *   has at least 3 characters (fewer would match half the list by chance);
 * - the machine's permanent sticker code counts like a tag code.
 */
import { MACHINE_KIND_LABELS, type MachineKind } from "../tickets/machine";
import { normalizeTagCode } from "../trade/tag-code";

/** The parts of a today card the search looks at (lib/sync/read `TicketCard` fits). */
export interface SearchableCard {
  ticket: { number: number; tagCode: string; complaint: string };
  machine: { make: string; model: string; kind: MachineKind; stickerCode: string | null } | null;
  customer: { firstName: string; lastName: string } | null;
  mine: boolean;
}

/** The shortest piece of a tag code that is looked for inside tag codes. */
export const MIN_TAG_PIECE = 3;

/** Lower case, accents dropped, runs of white space made one space, trimmed. */
export function foldText(s: string): string {
  return s
    .normalize("NFD")
    .replace(/\p{M}+/gu, "")
    .toLowerCase()
    .replace(/\s+/g, " ")
    .trim();
}

function codesOf(card: SearchableCard): string[] {
  const codes = [normalizeTagCode(card.ticket.tagCode)];
  if (card.machine?.stickerCode) codes.push(normalizeTagCode(card.machine.stickerCode));
  return codes;
}

function inCodes(codes: string[], piece: string): boolean {
  const p = normalizeTagCode(piece);
  return p.length >= MIN_TAG_PIECE && codes.some((c) => c.includes(p));
}

function wordsOf(card: SearchableCard): string {
  const m = card.machine;
  const c = card.customer;
  return foldText(
    [
      String(card.ticket.number),
      m ? `${m.make} ${m.model} ${MACHINE_KIND_LABELS[m.kind] ?? ""}` : "",
      c ? `${c.firstName} ${c.lastName}` : "",
      card.ticket.complaint,
    ].join(" \n "),
  );
}

/** True when the card matches the typed search (an empty search matches every card). */
export function matchesSearch(card: SearchableCard, query: string): boolean {
  const q = foldText(query);
  if (q === "") return true;
  const codes = codesOf(card);
  if (inCodes(codes, q)) return true;
  const text = wordsOf(card);
  return q.split(" ").every((word) => {
    if (word.startsWith("#")) {
      const digits = word.slice(1);
      return digits === "" || String(card.ticket.number).startsWith(digits);
    }
    return text.includes(word) || inCodes(codes, word);
  });
}

/** The cards that match, in the order given. */
export function filterToday<T extends SearchableCard>(cards: readonly T[], query: string): T[] {
  return cards.filter((c) => matchesSearch(c, query));
}

/** "Assigned to you" first, then every other open ticket; each keeps the order given. */
export function groupToday<T extends Pick<SearchableCard, "mine">>(cards: readonly T[]): { mine: T[]; others: T[] } {
  return { mine: cards.filter((c) => c.mine), others: cards.filter((c) => !c.mine) };
}

const DAY_MS = 86_400_000;
const WEEKDAY_DATE = new Intl.DateTimeFormat("en-US", { weekday: "short", month: "short", day: "numeric", timeZone: "UTC" });

function dayNumber(isoDate: string): number | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) return null;
  const ms = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  return Number.isNaN(ms) ? null : Math.round(ms / DAY_MS);
}

/** The calendar date (YYYY-MM-DD) of `at` on this device's clock. */
export function localIsoDate(at: Date): string {
  const p = (n: number) => String(n).padStart(2, "0");
  return `${at.getFullYear()}-${p(at.getMonth() + 1)}-${p(at.getDate())}`;
}

export interface PromisedLabel {
  text: string;
  /** The promised day has passed. */
  overdue: boolean;
  /** Promised for today. */
  today: boolean;
}

/**
 * A promised date (YYYY-MM-DD, a calendar day with no time zone) in words, against today's date (same form):
 * "Promised today", "Promised tomorrow", "Promised Wed, Jan 14", "Overdue: promised Mon, Jan 12".
 */
export function promisedLabel(promised: string, today: string): PromisedLabel | null {
  const p = dayNumber(promised);
  const t = dayNumber(today);
  if (p === null || t === null) return null;
  const when = WEEKDAY_DATE.format(new Date(p * DAY_MS));
  if (p === t) return { text: "Promised today", overdue: false, today: true };
  if (p === t + 1) return { text: "Promised tomorrow", overdue: false, today: false };
  if (p < t) return { text: `Overdue: promised ${when}`, overdue: true, today: false };
  return { text: `Promised ${when}`, overdue: false, today: false };
}

/** "1 change not synced" / "3 changes not synced". */
export function notSyncedLabel(waiting: number): string {
  return `${waiting} change${waiting === 1 ? "" : "s"} not synced`;
}
